import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import type { TestApp } from './app.js';
import { makeCall, makeObservatory, uniqueCode } from './calls-factories.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './factories.js';
import type { ActorFactory, Expected, RightsRow } from './rights.js';

/** The prefixes of the observatory and calls routes, for the rights matrix. */
export const CALLS_MATRIX_PREFIXES = ['/api/observatories', '/api/calls'];

/**
 * A user who holds a per-call role (referee or chair) in a call of their own: it must give no
 * staff rights anywhere.
 */
export const callRoleActor =
  (role: 'referee' | 'chair'): ActorFactory =>
  async (t, name) => {
    const user = await makeUser(t.dataSource);
    const call = await makeCall(t.dataSource, await makeObservatory(t.dataSource));
    await t.dataSource.manager.insert(GrantedCallRole, {
      userId: user.id,
      callId: call.id,
      role,
      grantedById: null,
      grantedAt: new Date(),
    });
    const agent = t.agent();
    const res = await agent.signIn(user.email, TEST_PASSWORD);
    if (res.status !== 200) throw new Error(`${name} could not sign in: ${res.status}`);
    if (!(res.body.roles as string[]).includes(role)) throw new Error(`${name} lacks ${role}`);
    return { name, agent, user };
  };

const everyone = (status: number): Expected => ({
  anonymous: status,
  unverified: status,
  proposer: status,
  referee: status,
  chair: status,
  staff: status,
  admin: status,
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

const configurationBody = () => ({
  name: `layout ${uniqueCode()}`,
  shortestBaselineM: 40,
  longestBaselineM: 900,
  inUseFrom: '2027-02-01',
});
const bandBody = () => ({
  name: `band ${uniqueCode()}`,
  minGHz: 1,
  maxGHz: 2,
  tsysK: 30,
  apertureEfficiency: 0.6,
  maxBandwidthMHz: 500,
  polarizations: [2],
});
const DAY = 86_400_000;
const callBody = async (t: TestApp) => {
  const array = await makeObservatory(t.dataSource);
  const now = Date.now();
  return {
    code: uniqueCode(),
    observatoryId: array.observatory.id,
    title: 'Rights matrix call',
    timeZone: 'UTC',
    opensAt: new Date(now).toISOString(),
    deadlineAt: new Date(now + 10 * DAY).toISOString(),
    reviewDueAt: new Date(now + 30 * DAY).toISOString(),
    capacity: [{ configurationId: array.configurations[0]?.id, hours: 10 }],
    scienceCasePageLimit: 4,
    scienceCaseMaxMb: 10,
    proposalKinds: ['standard'],
    maxHoursPerProposal: 10,
  };
};
const newArray = (t: TestApp) => makeObservatory(t.dataSource);
const newCall = async (t: TestApp, status: 'open' | 'planned' = 'open') =>
  makeCall(t.dataSource, await newArray(t), { status });
const grantIn = async (t: TestApp, callId: string) => {
  const user = await makeUser(t.dataSource);
  return t.dataSource.manager.save(GrantedCallRole, {
    userId: user.id,
    callId,
    role: 'referee',
    grantedById: null,
    grantedAt: new Date(),
  });
};

/** Role × route → status for the observatory and calls routes. */
export const CALLS_ROWS: RightsRow[] = [
  { route: 'GET /api/observatories', expect: everyone(200) },
  {
    route: 'GET /api/observatories/:id',
    request: async (t) => ({ path: `/api/observatories/${(await newArray(t)).observatory.id}` }),
    expect: everyone(200),
  },
  {
    route: 'POST /api/observatories',
    request: () => ({
      body: {
        name: `Array ${uniqueCode()}`,
        latitudeDeg: 10,
        longitudeDeg: 20,
        elevationM: 100,
        elevationLimitDeg: 10,
        antennas: 6,
        dishDiameterM: 10,
        correlatorEfficiency: 0.9,
        overheadFraction: 0.1,
        timeZone: 'UTC',
      },
    }),
    expect: staffOnly(201),
  },
  {
    route: 'PATCH /api/observatories/:id',
    request: async (t) => ({
      path: `/api/observatories/${(await newArray(t)).observatory.id}`,
      body: { antennas: 7 },
    }),
    expect: staffOnly(200),
  },
  {
    route: 'GET /api/observatories/:id/configurations',
    request: async (t) => ({
      path: `/api/observatories/${(await newArray(t)).observatory.id}/configurations`,
    }),
    expect: everyone(200),
  },
  {
    route: 'POST /api/observatories/:id/configurations',
    request: async (t) => ({
      path: `/api/observatories/${(await newArray(t)).observatory.id}/configurations`,
      body: configurationBody(),
    }),
    expect: staffOnly(201),
  },
  {
    route: 'PATCH /api/observatories/:id/configurations/:configurationId',
    request: async (t) => {
      const { observatory, configurations } = await newArray(t);
      return {
        path: `/api/observatories/${observatory.id}/configurations/${configurations[0]?.id}`,
        body: { longestBaselineM: 450 },
      };
    },
    expect: staffOnly(200),
  },
  {
    route: 'DELETE /api/observatories/:id/configurations/:configurationId',
    request: async (t) => {
      const { observatory, configurations } = await newArray(t);
      return {
        path: `/api/observatories/${observatory.id}/configurations/${configurations[1]?.id}`,
      };
    },
    expect: staffOnly(204),
  },
  {
    route: 'GET /api/observatories/:id/bands',
    request: async (t) => ({
      path: `/api/observatories/${(await newArray(t)).observatory.id}/bands`,
    }),
    expect: everyone(200),
  },
  {
    route: 'POST /api/observatories/:id/bands',
    request: async (t) => ({
      path: `/api/observatories/${(await newArray(t)).observatory.id}/bands`,
      body: bandBody(),
    }),
    expect: staffOnly(201),
  },
  {
    route: 'PATCH /api/observatories/:id/bands/:bandId',
    request: async (t) => {
      const { observatory, bands } = await newArray(t);
      return {
        path: `/api/observatories/${observatory.id}/bands/${bands[0]?.id}`,
        body: { tsysK: 33 },
      };
    },
    expect: staffOnly(200),
  },
  {
    route: 'DELETE /api/observatories/:id/bands/:bandId',
    request: async (t) => {
      const { observatory, bands } = await newArray(t);
      return { path: `/api/observatories/${observatory.id}/bands/${bands[0]?.id}` };
    },
    expect: staffOnly(204),
  },
  { route: 'GET /api/calls', expect: everyone(200) },
  {
    route: 'GET /api/calls/:code',
    note: 'an open call: public',
    request: async (t) => ({ path: `/api/calls/${(await newCall(t)).code}` }),
    expect: everyone(200),
  },
  {
    route: 'GET /api/calls/:code',
    note: 'a planned call: staff only, 404 for everyone else (nothing leaks)',
    request: async (t) => ({ path: `/api/calls/${(await newCall(t, 'planned')).code}` }),
    expect: { ...everyone(404), staff: 200 },
  },
  {
    route: 'POST /api/calls',
    request: async (t) => ({ body: await callBody(t) }),
    expect: staffOnly(201),
  },
  {
    route: 'PATCH /api/calls/:code',
    request: async (t) => ({
      path: `/api/calls/${(await newCall(t)).code}`,
      body: { title: 'Renamed by the matrix' },
    }),
    expect: staffOnly(200),
  },
  {
    route: 'POST /api/calls/:code/transition',
    request: async (t) => ({
      path: `/api/calls/${(await newCall(t, 'planned')).code}/transition`,
      body: { to: 'open' },
    }),
    expect: staffOnly(200),
  },
  {
    route: 'GET /api/calls/:code/roles',
    request: async (t) => ({ path: `/api/calls/${(await newCall(t)).code}/roles` }),
    expect: staffOnly(200),
  },
  {
    route: 'POST /api/calls/:code/roles',
    request: async (t) => ({
      path: `/api/calls/${(await newCall(t)).code}/roles`,
      body: { email: uniqueEmail('invited'), role: 'referee' },
    }),
    expect: staffOnly(201),
  },
  {
    route: 'DELETE /api/calls/:code/roles/:id',
    request: async (t) => {
      const call = await newCall(t);
      const grant = await grantIn(t, call.id);
      return { path: `/api/calls/${call.code}/roles/${grant.id}` };
    },
    expect: staffOnly(204),
  },
];
