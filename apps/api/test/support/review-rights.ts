import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import type { User } from '../../src/users/entities/user.entity.js';
import type { TestApp } from './app.js';
import { assignReview, makeCallInReview } from './review-factories.js';
import type { Actor, Expected, RightsRow } from './rights.js';

/**
 * Rows of the rights matrix for the review module's routes (rights-matrix.e2e-spec.ts spreads
 * them). Each request makes its own call in review; the referee (or chair) actor is given the
 * role in that call, so its 2xx is the positive path, while every other caller meets the role
 * guard. A referee reading another referee's assignment, and a chair of another call, are tested
 * in review.e2e-spec.ts.
 */

const refereeOnly = (status: number): Expected => ({
  anonymous: 401,
  unverified: 403,
  proposer: 403,
  referee: status,
  chair: 403,
  staff: 403,
  admin: 403,
});
const chairOnly = (status: number): Expected => ({
  ...refereeOnly(403),
  referee: 403,
  chair: status,
});

const grant = (t: TestApp, user: User, callId: string, role: 'referee' | 'chair') =>
  t.dataSource.manager.insert(GrantedCallRole, {
    userId: user.id,
    callId,
    role,
    grantedById: null,
    grantedAt: new Date(),
  });

/** A call in review; the actor referees it and holds an assignment when it is the referee. */
async function ownAssignment(t: TestApp, actor: Actor) {
  const c = await makeCallInReview(t, { proposals: 1, referees: 1, compilePdf: false });
  const p = c.proposals[0]!.proposal;
  let referee = c.referees[0]!;
  if (actor.name === 'referee' && actor.user) {
    await grant(t, actor.user, c.call.id, 'referee');
    referee = actor.user;
  }
  const a = await assignReview(t, p, referee);
  return { c, a };
}

/** A call in review the actor chairs, when it is the chair. */
async function chairedCall(t: TestApp, actor: Actor) {
  const c = await makeCallInReview(t, { proposals: 2, referees: 3, compilePdf: false });
  if (actor.name === 'chair' && actor.user) await grant(t, actor.user, c.call.id, 'chair');
  return c;
}

export const REVIEW_ROWS: RightsRow[] = [
  { route: 'GET /api/reviews', expect: refereeOnly(200) },
  {
    route: 'GET /api/reviews/:id',
    request: async (t, actor) => ({ path: `/api/reviews/${(await ownAssignment(t, actor)).a.id}` }),
    expect: refereeOnly(200),
  },
  {
    route: 'PUT /api/reviews/:id',
    request: async (t, actor) => ({
      path: `/api/reviews/${(await ownAssignment(t, actor)).a.id}`,
      body: { version: 1, score: 3, commentToPi: '', commentToCommittee: '', expertise: null },
    }),
    expect: refereeOnly(200),
  },
  {
    route: 'POST /api/reviews/:id/decline',
    request: async (t, actor) => ({
      path: `/api/reviews/${(await ownAssignment(t, actor)).a.id}/decline`,
      body: { version: 1, reason: 'Travelling for the whole review period.' },
    }),
    expect: refereeOnly(200),
  },
  {
    route: 'POST /api/reviews/:id/conflict',
    request: async (t, actor) => ({
      path: `/api/reviews/${(await ownAssignment(t, actor)).a.id}/conflict`,
      body: { version: 1, reason: 'A close collaborator of the team.' },
    }),
    expect: refereeOnly(200),
  },
  {
    route: 'GET /api/reviews/:id/pdf',
    request: async (t, actor) => ({
      path: `/api/reviews/${(await ownAssignment(t, actor)).a.id}/pdf`,
    }),
    expect: refereeOnly(200),
  },
  {
    route: 'GET /api/calls/:code/referees',
    note: 'staff may look; the chair of this call manages',
    request: async (t, actor) => ({
      path: `/api/calls/${(await chairedCall(t, actor)).call.code}/referees`,
    }),
    expect: { ...chairOnly(200), staff: 200 },
  },
  {
    route: 'POST /api/calls/:code/assign',
    request: async (t, actor) => ({
      path: `/api/calls/${(await chairedCall(t, actor)).call.code}/assign`,
      body: {},
    }),
    expect: chairOnly(200),
  },
  {
    route: 'POST /api/calls/:code/assignments',
    request: async (t, actor) => {
      const c = await chairedCall(t, actor);
      return {
        path: `/api/calls/${c.call.code}/assignments`,
        body: { proposalId: c.proposals[0]!.proposal.id, refereeId: c.referees[0]!.id },
      };
    },
    expect: chairOnly(201),
  },
  {
    route: 'DELETE /api/calls/:code/assignments/:id',
    request: async (t, actor) => {
      const c = await chairedCall(t, actor);
      const a = await assignReview(t, c.proposals[0]!.proposal, c.referees[0]!);
      return { path: `/api/calls/${c.call.code}/assignments/${a.id}` };
    },
    expect: chairOnly(204),
  },
];

/** Route prefixes under which every served route of the review module must have a row. */
export const REVIEW_MATRIX_PREFIXES: string[] = ['/api/reviews'];
