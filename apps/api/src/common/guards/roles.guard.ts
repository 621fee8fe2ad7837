import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Request } from 'express';
import type { Role } from '../../users/entities/user.entity.js';
import { ROLES_KEY } from '../decorators/roles.decorator.js';
import { forbidden } from '../errors/app-error.js';

@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const needed = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [
      context.getHandler(),
      context.getClass(),
    ]);
    if (!needed?.length) return true;
    const user = context.switchToHttp().getRequest<Request>().user;
    if (user && needed.some((role) => user.roles.includes(role))) return true;
    throw forbidden(`This needs the role ${needed.join(' or ')}`);
  }
}
