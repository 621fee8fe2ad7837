import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import type { TestApp } from './app.js';
import { makeCallInReview } from './review-factories.js';
import type { Actor, Expected, RightsRow } from './rights.js';

/**
 * A call in deliberation with one proposal; the actor is made its chair when they hold the chair
 * role (so "chair" means the call's own chair here; another call's chair gets 404: allocation
 * e2e specs). With `publish`, the call is published with the actor as the proposal's PI.
 */
async function deliberating(t: TestApp, actor: Actor, opts: { publish?: boolean } = {}) {
  const c = await makeCallInReview(t, {
    status: 'deliberation',
    proposals: 1,
    referees: 0,
    compilePdf: false,
  });
  if (actor.name === 'chair' && actor.user)
    await t.dataSource.manager.insert(GrantedCallRole, {
      userId: actor.user.id,
      callId: c.call.id,
      role: 'chair',
      grantedAt: new Date(),
    });
  const p = c.proposals[0]!.proposal;
  if (opts.publish) {
    await t.dataSource.query(
      `UPDATE calls SET status = 'published', published_at = now() WHERE id = $1`,
      [c.call.id],
    );
    if (actor.user)
      await t.dataSource.query(
        `UPDATE proposal_members SET user_id = $2, email = $3 WHERE proposal_id = $1 AND role = 'pi'`,
        [p.id, actor.user.id, actor.user.email.toLowerCase()],
      );
  }
  return { code: c.call.code, reference: p.reference };
}

const chairOrStaff = (chair: number, staff: number): Expected => ({
  anonymous: 401,
  unverified: 403,
  proposer: 403,
  referee: 403,
  chair,
  staff,
  admin: 403,
});

/** Rows of the rights matrix for the allocation module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const ALLOCATION_ROWS: RightsRow[] = [
  {
    route: 'GET /api/calls/:code/standing',
    request: async (t, a) => ({ path: `/api/calls/${(await deliberating(t, a)).code}/standing` }),
    expect: chairOrStaff(200, 200),
  },
  {
    route: 'GET /api/calls/:code/report.pdf',
    request: async (t, a) => ({ path: `/api/calls/${(await deliberating(t, a)).code}/report.pdf` }),
    expect: chairOrStaff(200, 200),
  },
  {
    route: 'POST /api/calls/:code/publish',
    request: async (t, a) => ({
      path: `/api/calls/${(await deliberating(t, a)).code}/publish`,
      body: { confirm: true },
    }),
    expect: chairOrStaff(200, 403),
  },
  {
    route: 'PUT /api/proposals/:reference/grant',
    request: async (t, a) => ({
      path: `/api/proposals/${(await deliberating(t, a)).reference}/grant`,
      body: { tier: 'tier1' },
    }),
    expect: chairOrStaff(200, 403),
  },
  {
    route: 'DELETE /api/proposals/:reference/grant',
    request: async (t, a) => ({
      path: `/api/proposals/${(await deliberating(t, a)).reference}/grant`,
    }),
    expect: chairOrStaff(200, 403),
  },
  {
    route: 'GET /api/proposals/:reference/outcome',
    note: 'each actor is the PI of a proposal in a published call (not the team: 404, allocation e2e)',
    request: async (t, a) => ({
      path: `/api/proposals/${(await deliberating(t, a, { publish: true })).reference}/outcome`,
    }),
    expect: {
      anonymous: 401,
      unverified: 200,
      proposer: 200,
      referee: 200,
      chair: 200,
      staff: 200,
      admin: 200,
    },
  },
];

/** The routes sit under /api/calls and /api/proposals, whose prefixes those modules list. */
export const ALLOCATION_MATRIX_PREFIXES: string[] = [];
