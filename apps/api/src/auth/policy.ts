import { forbidden, notFound } from '../common/errors/app-error.js';
import type { Role } from '../users/entities/user.entity.js';
import type { CallRoleGrant, SessionUser } from './session-user.js';

/**
 * Per-resource rights, the helpers every service uses after the global guards have run.
 *
 * The rule: a resource the user may not see answers 404 exactly as one that does not exist, so its
 * existence does not leak; one the user may see but not change answers 403.
 *
 *   const proposal = assertVisible(await repo.findOneBy({ id }), (p) => canSeeProposal(user, p), 'Proposal');
 *   assertAllowed(canEditProposal(user, proposal));
 */
export function assertVisible<T>(
  resource: T | null | undefined,
  canSee: (resource: T) => boolean,
  what: string,
): T {
  if (resource === null || resource === undefined || !canSee(resource)) throw notFound(what);
  return resource;
}

export function assertAllowed(allowed: boolean, message?: string): void {
  if (!allowed) throw forbidden(message);
}

export const hasRole = (user: SessionUser, role: Role): boolean => user.roles.includes(role);

/**
 * Chair or referee of one call. Only a confirmed address acts in a call's roles, as with
 * proposer: an unverified account can neither submit nor review.
 */
export const hasCallRole = (
  user: SessionUser,
  callCode: string,
  role: CallRoleGrant['role'],
): boolean =>
  user.emailVerified && user.callRoles.some((g) => g.callCode === callCode && g.role === role);

/** Staff see every call of the observatory; admins manage accounts, not science. */
export const isStaff = (user: SessionUser): boolean => user.globalRoles.includes('staff');
