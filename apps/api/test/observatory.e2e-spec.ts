import { randomUUID } from 'node:crypto';
import { AuditEvent } from '../src/audit/audit-event.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeCall, makeObservatory } from './support/calls-factories.js';
import { makeUser, TEST_PASSWORD } from './support/factories.js';

describe('observatory setup', () => {
  let t: TestApp;
  let staff: TestAgent;
  let proposer: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    staff = t.agent();
    proposer = t.agent();
    await staff.signIn((await makeUser(t.dataSource, { roles: ['staff'] })).email, TEST_PASSWORD);
    await proposer.signIn((await makeUser(t.dataSource)).email, TEST_PASSWORD);
  });
  afterAll(() => t.close());

  const site = (over: Record<string, unknown> = {}) => ({
    name: `Array ${randomUUID().slice(0, 8)}`,
    latitudeDeg: 47.3,
    longitudeDeg: -118.9,
    elevationM: 520,
    elevationLimitDeg: 15,
    antennas: 18,
    dishDiameterM: 16,
    correlatorEfficiency: 0.88,
    overheadFraction: 0.2,
    timeZone: 'America/Los_Angeles',
    ...over,
  });
  const paths = (body: { issues?: { path: string }[] }) =>
    new Set((body.issues ?? []).map((i) => i.path));

  it('lets staff describe an array that anyone can then read', async () => {
    const created = await staff.post('/api/observatories', site());
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ antennas: 18, beamFactor: 1.13, configurations: [] });
    const id = created.body.id as string;

    const compact = await staff.post(`/api/observatories/${id}/configurations`, {
      name: 'compact',
      shortestBaselineM: 30,
      longestBaselineM: 600,
      inUseFrom: '2027-02-01',
    });
    expect(compact.status).toBe(201);
    expect(compact.body).toMatchObject({ inUseFrom: '2027-02-01', inUseTo: null });
    const band = await staff.post(`/api/observatories/${id}/bands`, {
      name: 'L band',
      ieeeLetter: 'L',
      minGHz: 1,
      maxGHz: 2,
      tsysK: 28,
      apertureEfficiency: 0.65,
      maxBandwidthMHz: 1000,
      polarizations: [2, 1],
    });
    expect(band.status).toBe(201);

    const read = await t.agent().get(`/api/observatories/${id}`);
    expect(read.status).toBe(200);
    expect(read.body.configurations).toEqual([
      expect.objectContaining({ name: 'compact', longestBaselineM: 600 }),
    ]);
    expect(read.body.bands).toEqual([
      expect.objectContaining({ name: 'L band', polarizations: [1, 2], ieeeLetter: 'L' }),
    ]);
    const list = await t.agent().get('/api/observatories');
    expect(list.body.map((o: { id: string }) => o.id)).toContain(id);
    expect((await t.agent().get(`/api/observatories/${id}/bands`)).body).toHaveLength(1);
  });

  it('refuses proposers (403) and visitors (401) every change', async () => {
    const { observatory } = await makeObservatory(t.dataSource);
    const base = `/api/observatories/${observatory.id}`;
    expect((await proposer.post('/api/observatories', site())).status).toBe(403);
    expect((await proposer.patch(base, { antennas: 30 })).status).toBe(403);
    expect((await proposer.post(`${base}/configurations`, {})).status).toBe(403);
    expect((await t.agent().patch(base, { antennas: 30 })).status).toBe(401);
  });

  it('names each bad field of the site in a 400', async () => {
    const res = await staff.post(
      '/api/observatories',
      site({
        latitudeDeg: 91,
        antennas: 1.5,
        correlatorEfficiency: 1.2,
        timeZone: 'UTC+8',
        dishDiameterM: 'sixteen',
      }),
    );
    expect(res.status).toBe(400);
    expect(paths(res.body)).toEqual(
      new Set(['latitudeDeg', 'antennas', 'correlatorEfficiency', 'timeZone', 'dishDiameterM']),
    );
  });

  it('checks a configuration and a band against themselves', async () => {
    const { observatory } = await makeObservatory(t.dataSource);
    const base = `/api/observatories/${observatory.id}`;
    const config = await staff.post(`${base}/configurations`, {
      name: 'odd',
      shortestBaselineM: 900,
      longestBaselineM: 300,
      inUseFrom: '2027-03-01',
      inUseTo: '2027-02-01',
    });
    expect(config.status).toBe(400);
    expect(paths(config.body)).toEqual(new Set(['longestBaselineM', 'inUseTo']));

    const date = await staff.post(`${base}/configurations`, {
      name: 'odd',
      shortestBaselineM: 10,
      longestBaselineM: 300,
      inUseFrom: '2027-02-30',
    });
    expect(date.status).toBe(400);
    expect(paths(date.body)).toEqual(new Set(['inUseFrom']));

    const band = await staff.post(`${base}/bands`, {
      name: 'Upside down',
      minGHz: 8,
      maxGHz: 4,
      tsysK: 30,
      apertureEfficiency: 0.6,
      maxBandwidthMHz: 500,
      polarizations: [3],
      ieeeLetter: 'Q',
    });
    expect(band.status).toBe(400);
    expect(paths(band.body)).toEqual(new Set(['polarizations', 'ieeeLetter']));
    const inverted = await staff.post(`${base}/bands`, {
      name: 'Upside down',
      minGHz: 8,
      maxGHz: 4,
      tsysK: 30,
      apertureEfficiency: 0.6,
      maxBandwidthMHz: 500,
      polarizations: [2],
    });
    expect(paths(inverted.body)).toEqual(new Set(['maxGHz']));

    const duplicate = await staff.post(`${base}/configurations`, {
      name: 'short',
      shortestBaselineM: 10,
      longestBaselineM: 300,
      inUseFrom: '2027-01-01',
    });
    expect(duplicate.status).toBe(400);
    expect(paths(duplicate.body)).toEqual(new Set(['name']));
  });

  it('edits with an audit entry, and checks the edit against the stored values', async () => {
    const { observatory, configurations } = await makeObservatory(t.dataSource);
    const base = `/api/observatories/${observatory.id}`;
    const edited = await staff.patch(base, { antennas: 20, elevationLimitDeg: 12 });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ antennas: 20, elevationLimitDeg: 12 });
    const event = await t.dataSource
      .getRepository(AuditEvent)
      .findOneByOrFail({ action: 'observatory.updated', subjectId: observatory.id });
    expect(event.details).toEqual({
      changes: { antennas: { from: 12, to: 20 }, elevationLimitDeg: { from: 15, to: 12 } },
    });
    // "short" runs 20–400 m: a longest baseline under 20 m contradicts the stored shortest one.
    const bad = await staff.patch(`${base}/configurations/${configurations[0]?.id}`, {
      longestBaselineM: 10,
    });
    expect(bad.status).toBe(400);
    expect(paths(bad.body)).toEqual(new Set(['longestBaselineM']));
  });

  it('removes a configuration no call uses, and refuses one that a call offers (409)', async () => {
    const array = await makeObservatory(t.dataSource);
    const base = `/api/observatories/${array.observatory.id}`;
    await makeCall(t.dataSource, array, { hours: [100, 0] });
    const [used, unused] = array.configurations;
    const refused = await staff.delete(`${base}/configurations/${used?.id}`);
    expect(refused.status).toBe(409);
    expect(refused.body.code).toBe('IN_USE');
    expect((await staff.delete(`${base}/configurations/${unused?.id}`)).status).toBe(204);
    expect((await t.agent().get(`${base}/configurations`)).body).toHaveLength(1);
  });

  it('answers 404 for an unknown or malformed id, and for a configuration of another array', async () => {
    const a = await makeObservatory(t.dataSource);
    const b = await makeObservatory(t.dataSource);
    expect((await t.agent().get(`/api/observatories/${randomUUID()}`)).status).toBe(404);
    expect((await t.agent().get('/api/observatories/42')).status).toBe(404);
    const cross = await staff.patch(
      `/api/observatories/${a.observatory.id}/configurations/${b.configurations[0]?.id}`,
      { name: 'stolen' },
    );
    expect(cross.status).toBe(404);
  });
});
