import type { Role, Session } from './api';

/** Who a screen or a control is for. */
export type Audience = 'everyone' | 'signed-in' | Role;

/**
 * Whether the user may see something meant for `audience`. Chairing or refereeing one call
 * counts as holding that role. This only decides what the interface offers; the server checks
 * every request on its own.
 */
export function canAccess(session: Session | null | undefined, audience: Audience): boolean {
  if (audience === 'everyone') return true;
  if (!session) return false;
  if (audience === 'signed-in') return true;
  return (
    session.roles.includes(audience) ||
    session.callRoles.some((callRole) => callRole.role === audience)
  );
}
