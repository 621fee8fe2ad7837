import type { TestApp } from './app.js';
import { makeUser } from './factories.js';
import { insertRun, joinTeam, makeChairOf, makeFeed, makePlanCall } from './plan-factories.js';
import type { Actor, Expected, RightsRow } from './rights.js';

/** Route prefixes under which every served route of the plan module must have a row. */
export const PLAN_MATRIX_PREFIXES: string[] = [
  '/api/plans',
  '/api/runs',
  '/api/me/calendar-feed',
  '/api/calendar',
];

/** The call's own chair reads the plan (the actor is made chair of the row's call). */
const readers = (status: number): Expected => ({
  anonymous: 401,
  unverified: 404,
  proposer: 404,
  referee: 404,
  chair: status,
  staff: status,
  admin: 404,
});
const staffOnly = (status: number): Expected => ({
  anonymous: 401,
  unverified: 403,
  proposer: 403,
  referee: 403,
  chair: 403,
  staff: status,
  admin: 403,
});

/** A published call of one proposal; the chair actor becomes its chair. */
async function planCall(t: TestApp, actor: Actor) {
  const c = await makePlanCall(t, { proposals: 1, days: 2 });
  if (actor.name === 'chair' && actor.user) await makeChairOf(t, actor.user, c.call.id);
  return c;
}

const runRequest =
  (suffix: string, body: (run: { startsAt: Date; endsAt: Date }) => object | undefined) =>
  async (t: TestApp, actor: Actor) => {
    const c = await planCall(t, actor);
    const run = await insertRun(t, c);
    return { path: `/api/runs/${run.id}${suffix}`, body: body(run) };
  };

/** Rows of the rights matrix for the plan module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const PLAN_ROWS: RightsRow[] = [
  {
    route: 'GET /api/plans',
    note: 'staff see every published call, a chair their own calls',
    expect: { ...staffOnly(200), chair: 200 },
  },
  {
    route: 'GET /api/calls/:code/plan',
    note: 'staff and the call’s chair; for anyone else the plan does not exist',
    request: async (t, actor) => ({
      path: `/api/calls/${(await planCall(t, actor)).call.code}/plan`,
    }),
    expect: readers(200),
  },
  {
    route: 'GET /api/calls/:code/plan.ics',
    request: async (t, actor) => ({
      path: `/api/calls/${(await planCall(t, actor)).call.code}/plan.ics`,
    }),
    expect: readers(200),
  },
  {
    route: 'GET /api/calls/:code/runs.csv',
    request: async (t, actor) => ({
      path: `/api/calls/${(await planCall(t, actor)).call.code}/runs.csv`,
    }),
    expect: readers(200),
  },
  {
    route: 'PUT /api/calls/:code/plan/settings',
    note: 'the chair reads the plan but only staff change it',
    request: async (t, actor) => ({
      path: `/api/calls/${(await planCall(t, actor)).call.code}/plan/settings`,
      body: { maintenanceStartHour: 9, maintenanceHours: 2, weatherReserve: 0.2 },
    }),
    expect: staffOnly(200),
  },
  {
    route: 'POST /api/calls/:code/plan/generate',
    request: async (t, actor) => ({
      path: `/api/calls/${(await planCall(t, actor)).call.code}/plan/generate`,
    }),
    expect: staffOnly(200),
  },
  {
    route: 'PATCH /api/runs/:id',
    request: runRequest('', () => ({ version: 1, locked: true })),
    expect: staffOnly(200),
  },
  {
    route: 'POST /api/runs/:id/split',
    request: runRequest('/split', (run) => ({
      version: 1,
      at: new Date(run.startsAt.getTime() + 3_600_000).toISOString(),
    })),
    expect: staffOnly(200),
  },
  {
    route: 'DELETE /api/runs/:id',
    request: runRequest('', () => undefined),
    expect: staffOnly(204),
  },
  {
    route: 'GET /api/proposals/:reference/progress',
    note: 'the team (the proposer actor joins it) and staff; nobody else learns it exists',
    request: async (t, actor) => {
      const c = await planCall(t, actor);
      const p = c.proposals[0]!.proposal;
      if (actor.name === 'proposer' && actor.user) await joinTeam(t, p.id, actor.user);
      return { path: `/api/proposals/${p.reference}/progress` };
    },
    expect: {
      anonymous: 401,
      unverified: 404,
      proposer: 200,
      referee: 404,
      chair: 404,
      staff: 200,
      admin: 404,
    },
  },
  {
    route: 'POST /api/me/calendar-feed',
    note: 'every confirmed account may have its own feed',
    expect: {
      anonymous: 401,
      unverified: 403,
      proposer: 201,
      referee: 201,
      chair: 201,
      staff: 201,
      admin: 201,
    },
  },
  {
    route: 'GET /api/calendar/:token.ics',
    note: 'public: the token in the link is the credential',
    request: async (t) => ({
      path: `/api/calendar/${await makeFeed(t, await makeUser(t.dataSource))}.ics`,
    }),
    expect: {
      anonymous: 200,
      unverified: 200,
      proposer: 200,
      referee: 200,
      chair: 200,
      staff: 200,
      admin: 200,
    },
  },
];
