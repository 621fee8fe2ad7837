import { SetMetadata } from '@nestjs/common';
import type { Role } from '../../users/entities/user.entity.js';

export const ROLES_KEY = 'skyhours:roles';

/** The route needs one of these roles (global roles; per-call rights are checked in services). */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES_KEY, roles);
