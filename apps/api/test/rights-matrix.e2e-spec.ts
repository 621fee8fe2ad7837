import { randomUUID } from 'node:crypto';
import { createTestApp, type TestApp } from './support/app.js';
import { NEW_PASSWORD, registration } from './support/accounts.js';
import { CALLS_MATRIX_PREFIXES, CALLS_ROWS } from './support/calls-rights.js';
import { PROPOSALS_MATRIX_PREFIXES, PROPOSALS_ROWS } from './support/proposal-rights.js';
import { ALLOCATION_MATRIX_PREFIXES, ALLOCATION_ROWS } from './support/allocation-rights.js';
import { ASSESSMENTS_MATRIX_PREFIXES, ASSESSMENTS_ROWS } from './support/assessments-rights.js';
import { DESK_MATRIX_PREFIXES, DESK_ROWS } from './support/desk-rights.js';
import { PLAN_MATRIX_PREFIXES, PLAN_ROWS } from './support/plan-rights.js';
import { REVIEW_MATRIX_PREFIXES, REVIEW_ROWS } from './support/review-rights.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';
import {
  ACTOR_FACTORIES,
  type ActorName,
  type RightsRow,
  send,
  servedRoutes,
} from './support/rights.js';

/** A well-formed token that no link ever carried. */
const UNKNOWN_TOKEN = 'A'.repeat(43);

const all = (status: number) => ({
  anonymous: status,
  unverified: status,
  proposer: status,
  staff: status,
  admin: status,
});
const signedIn = (status: number) => ({ ...all(status), anonymous: 401 });
const adminOnly = (status: number) => ({
  anonymous: 401,
  unverified: 403,
  proposer: 403,
  staff: 403,
  admin: status,
});

/**
 * Role × route → status. Add a row for every new route; the last test fails for a served route
 * under MATRIX_PREFIXES that has none. Each cell runs with a fresh actor and fresh data.
 */
const ROWS: RightsRow[] = [
  { route: 'GET /api/health', expect: all(200) },
  { route: 'GET /api/auth/csrf', expect: all(200) },
  {
    route: 'POST /api/auth/login',
    note: 'signing in as someone else is allowed from any state',
    request: async (t) => ({
      body: { email: (await makeUser(t.dataSource)).email, password: TEST_PASSWORD },
    }),
    expect: all(200),
  },
  { route: 'POST /api/auth/logout', expect: all(204) },
  { route: 'GET /api/auth/me', expect: signedIn(200) },
  {
    route: 'PATCH /api/auth/me',
    request: () => ({ body: { name: 'Renamed Person' } }),
    expect: signedIn(200),
  },
  {
    route: 'POST /api/auth/password',
    request: () => ({ body: { currentPassword: TEST_PASSWORD, newPassword: NEW_PASSWORD } }),
    expect: signedIn(204),
  },
  {
    route: 'POST /api/auth/register',
    request: () => ({ body: registration() }),
    expect: all(202),
  },
  {
    route: 'POST /api/auth/verify',
    note: 'public; an unknown token is a 400 on `token` for everyone',
    request: () => ({ body: { token: UNKNOWN_TOKEN } }),
    expect: all(400),
  },
  {
    route: 'POST /api/auth/verify/resend',
    note: '409 for an address that is already confirmed',
    expect: { anonymous: 401, unverified: 204, proposer: 409, staff: 409, admin: 409 },
  },
  {
    route: 'POST /api/auth/password-reset',
    request: () => ({ body: { email: uniqueEmail('reset') } }),
    expect: all(202),
  },
  {
    route: 'POST /api/auth/password-reset/confirm',
    request: () => ({ body: { token: UNKNOWN_TOKEN, password: NEW_PASSWORD } }),
    expect: all(400),
  },
  { route: 'GET /api/users', expect: adminOnly(200) },
  {
    route: 'PATCH /api/users/:id',
    request: async (t) => ({
      path: `/api/users/${(await makeUser(t.dataSource)).id}`,
      body: { roles: ['staff'] },
    }),
    expect: adminOnly(200),
  },
  {
    route: 'POST /api/users/:id/resend-verification',
    request: async (t) => ({
      path: `/api/users/${(await makeUser(t.dataSource, { emailVerifiedAt: null })).id}/resend-verification`,
    }),
    expect: adminOnly(204),
  },
  { route: 'GET /api/audit', expect: adminOnly(200) },
  ...CALLS_ROWS,
  ...PROPOSALS_ROWS,
  ...ASSESSMENTS_ROWS,
  ...REVIEW_ROWS,
  ...ALLOCATION_ROWS,
  ...PLAN_ROWS,
  ...DESK_ROWS,
];

/** Route prefixes whose every served route must have a row; a later issue adds its own. */
const MATRIX_PREFIXES = [
  '/api/health',
  '/api/auth',
  '/api/users',
  '/api/audit',
  ...CALLS_MATRIX_PREFIXES,
  ...PROPOSALS_MATRIX_PREFIXES,
  ...ASSESSMENTS_MATRIX_PREFIXES,
  ...REVIEW_MATRIX_PREFIXES,
  ...ALLOCATION_MATRIX_PREFIXES,
  ...PLAN_MATRIX_PREFIXES,
  ...DESK_MATRIX_PREFIXES,
];

describe('rights matrix', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const cells = ROWS.flatMap((row) =>
    (Object.entries(row.expect) as [ActorName, number][]).map(([actor, status]) => ({
      row,
      actor,
      status,
    })),
  );

  it.each(cells.map((c) => [c.row.route, c.actor, c.status, c] as const))(
    '%s as %s → %i',
    async (_route, actorName, status, { row }) => {
      const factory = ACTOR_FACTORIES[actorName];
      if (!factory)
        throw new Error(`no actor factory for ${actorName}: add one in support/rights.ts`);
      const actor = await factory(t, actorName);
      const [method, routePath] = row.route.split(' ') as [string, string];
      const request = (await row.request?.(t, actor)) ?? {};
      const res = await send(actor, method, request.path ?? routePath, request.body);
      // The body is in the comparison so that a failure shows what the server said.
      expect({ status: res.status, body: res.body }).toMatchObject({ status });
      if (status >= 400)
        expect(res.body).toMatchObject({ statusCode: status, code: expect.any(String) });
    },
  );

  it('refuses every write under its prefixes without the CSRF token', async () => {
    const writes = servedRoutes(t.app).filter(
      (route) =>
        !route.startsWith('GET ') &&
        MATRIX_PREFIXES.some((prefix) => route.split(' ')[1]!.startsWith(prefix)),
    );
    expect(writes).toContain('POST /api/auth/login');
    for (const route of writes) {
      const [method, path] = route.split(' ') as [string, string];
      const agent = t.agent();
      await agent.csrf(); // a session with a token exists; the request just does not send it
      const res = await agent.http[method.toLowerCase() as 'post'](
        path.replace(/:[a-zA-Z]+/g, randomUUID()),
      ).send({});
      expect({ route, status: res.status, code: res.body.code }).toEqual({
        route,
        status: 403,
        code: 'CSRF_INVALID',
      });
    }
  });

  it('has a row for every served route under its prefixes, and no row for a route not served', () => {
    const served = servedRoutes(t.app).filter((route) =>
      MATRIX_PREFIXES.some((prefix) => route.split(' ')[1]!.startsWith(prefix)),
    );
    expect(served).toContain('GET /api/auth/me');
    expect(new Set(ROWS.map((r) => r.route))).toEqual(new Set(served));
  });
});
