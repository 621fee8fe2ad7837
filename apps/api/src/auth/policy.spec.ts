import { AppError } from '../common/errors/app-error.js';
import { assertAllowed, assertVisible, hasCallRole, hasRole } from './policy.js';
import type { SessionUser } from './session-user.js';

const user = (over: Partial<SessionUser> = {}): SessionUser => ({
  id: 'u1',
  email: 'a@example.org',
  name: 'A',
  affiliation: 'Example Institute',
  country: 'NZ',
  orcid: null,
  emailVerified: true,
  globalRoles: [],
  callRoles: [],
  roles: ['proposer'],
  sessionEpoch: 0,
  ...over,
});

const statusOf = (fn: () => unknown): number | undefined => {
  try {
    fn();
  } catch (e) {
    return (e as AppError).getStatus();
  }
  return undefined;
};

describe('policy helpers', () => {
  it('answers 404 both for a missing resource and for one the user may not see', () => {
    const own = { ownerId: 'u1' };
    const other = { ownerId: 'u2' };
    const mine = (r: { ownerId: string }) => r.ownerId === 'u1';
    expect(assertVisible(own, mine, 'Proposal')).toBe(own);
    expect(statusOf(() => assertVisible(other, mine, 'Proposal'))).toBe(404);
    expect(statusOf(() => assertVisible(null, mine, 'Proposal'))).toBe(404);
    const missing = (() => {
      try {
        assertVisible(null, mine, 'Proposal');
      } catch (e) {
        return (e as AppError).getResponse();
      }
    })();
    const hidden = (() => {
      try {
        assertVisible(other, mine, 'Proposal');
      } catch (e) {
        return (e as AppError).getResponse();
      }
    })();
    expect(hidden).toEqual(missing);
  });

  it('answers 403 for a visible resource the user may not change', () => {
    expect(statusOf(() => assertAllowed(false))).toBe(403);
    expect(statusOf(() => assertAllowed(true))).toBeUndefined();
  });

  it('counts call roles per call, and only for a confirmed address', () => {
    const grants: SessionUser['callRoles'] = [{ callCode: 'SP27', role: 'chair' }];
    expect(hasCallRole(user({ callRoles: grants }), 'SP27', 'chair')).toBe(true);
    expect(hasCallRole(user({ callRoles: grants }), 'SP28', 'chair')).toBe(false);
    expect(hasCallRole(user({ callRoles: grants }), 'SP27', 'referee')).toBe(false);
    expect(hasCallRole(user({ callRoles: grants, emailVerified: false }), 'SP27', 'chair')).toBe(
      false,
    );
    expect(hasRole(user(), 'proposer')).toBe(true);
    expect(hasRole(user(), 'admin')).toBe(false);
  });
});
