import type { Call } from '../src/calls/entities/call.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeCall, makeObservatory, type TestObservatory } from './support/calls-factories.js';
import {
  completeDraft,
  createProposal,
  makeOpenCall,
  must,
  observationOf,
  type ProposalBody,
  signedIn,
} from './support/proposal-factories.js';

/** SI constants (exact since 2019) and the jansky (IAU), as SCIENCE.md gives them. */
const K_B = 1.380649e-23;
const C = 299_792_458;
const JY = 1e-26;

interface Observation {
  id: string;
  hoursAsked: number;
  frequencyGHz: number | null;
  result: {
    skyFrequencyGHz: number;
    pointings: number;
    sefdJy: number;
    rmsMicroJy: number;
    totalHours: number;
  };
  checks: { level: string; code: string; field: string; message: string }[];
}
const observations = (p: ProposalBody) => p.observations as Observation[];

describe('proposals: observations and checks', () => {
  let t: TestApp;
  let array: TestObservatory;
  let call: Call;
  let pi: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    ({ array, call } = await makeOpenCall(t.dataSource));
    pi = (await signedIn(t)).agent;
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  async function withTarget(target: Record<string, unknown>, on: Call = call) {
    let p = await createProposal(pi, on.code);
    const base = `/api/proposals/${p.reference}`;
    p = await must(pi.post(`${base}/targets`, { version: p.version, name: 'T', ...target }), 201);
    return { p, base, targetId: (p.targets as { id: string }[])[0]!.id };
  }

  it('stores the calculator’s numbers: the radiometer equation with hoursAsked spread over pointings and overhead', async () => {
    const { p: start, base, targetId } = await withTarget({ ra: '10:00:00', dec: '-30:00:00' });
    const p = await must(
      pi.post(`${base}/observations`, {
        version: start.version,
        ...observationOf(array, targetId, { hoursAsked: 5 }),
      }),
      201,
    );
    const o = observations(p)[0]!;
    // The test array: 12 dishes of 12 m, η_c 0.9, overhead 0.25; C band T_sys 35 K, η_a 0.6.
    const aEff = (0.6 * Math.PI * 12 ** 2) / 4;
    const sefd = (2 * K_B * 35) / aEff / JY;
    const onSource = 5 / (1 * 1.25);
    const rms = sefd / (0.9 * Math.sqrt(2 * 12 * 11 * 1000e6 * onSource * 3600));
    expect(o.result.pointings).toBe(1);
    expect(o.result.sefdJy).toBeCloseTo(sefd, 6);
    expect(o.result.rmsMicroJy).toBeCloseTo(rms * 1e6, 6);
    expect(o.result.totalHours).toBeCloseTo(5, 9);
    expect(o.checks).toEqual([]);
  });

  it('divides the time of a mosaic between its pointings, and notes the mosaic', async () => {
    const {
      p: start,
      base,
      targetId,
    } = await withTarget({ ra: '10:00:00', dec: '-30:00:00', extentArcsec: 1800 });
    const p = await must(
      pi.post(`${base}/observations`, {
        version: start.version,
        ...observationOf(array, targetId, { hoursAsked: 12 }),
      }),
      201,
    );
    const o = observations(p)[0]!;
    expect(o.result.pointings).toBeGreaterThan(1);
    expect(o.result.totalHours).toBeCloseTo(12, 9);
    const sefd = o.result.sefdJy;
    const perPointing = 12 / (o.result.pointings * 1.25);
    const rms = sefd / (0.9 * Math.sqrt(2 * 12 * 11 * 1000e6 * perPointing * 3600));
    expect(o.result.rmsMicroJy).toBeCloseTo(rms * 1e6, 6);
    expect(o.checks.map((c) => c.code)).toContain('MOSAIC_REQUIRED');
  });

  it('observes a line target at its sky frequency when no frequency is given', async () => {
    // 6.7 GHz methanol-like invented line at 3000 km/s, radio convention: ν = ν0 (1 − v/c).
    const {
      p: start,
      base,
      targetId,
    } = await withTarget({
      ra: '10:00:00',
      dec: '-30:00:00',
      line: { restGHz: 6.7, velocityKmS: 3000, convention: 'radio' },
    });
    const p = await must(
      pi.post(`${base}/observations`, {
        version: start.version,
        ...observationOf(array, targetId, { frequencyGHz: null, bandwidthMHz: 64 }),
      }),
      201,
    );
    const o = observations(p)[0]!;
    expect(o.frequencyGHz).toBeNull();
    expect(o.result.skyFrequencyGHz).toBeCloseTo(6.7 * (1 - 3000e3 / C), 12);
  });

  it('names bad fields with a 400: another observatory’s band, no frequency for a continuum target, resolution wider than the band', async () => {
    const { p, base, targetId } = await withTarget({ ra: '10:00:00', dec: '-30:00:00' });
    const other = await makeObservatory(t.dataSource);
    const cases: [Record<string, unknown>, string[]][] = [
      [{ bandId: other.bands[0]!.id }, ['bandId']],
      [{ configurationId: other.configurations[0]!.id }, ['configurationId']],
      [{ targetId: '00000000-0000-4000-8000-000000000000' }, ['targetId']],
      [{ frequencyGHz: null }, ['frequencyGHz']],
      [{ spectralResolutionKHz: 2_000_000 }, ['spectralResolutionKHz']],
      [{ polarizations: 3 }, ['polarizations']],
      [{ hoursAsked: 0 }, ['hoursAsked']],
      [{ bandwidthMHz: 'wide' }, ['bandwidthMHz']],
    ];
    for (const [over, paths] of cases) {
      const res = await pi.post(`${base}/observations`, {
        version: p.version,
        ...observationOf(array, targetId, over),
      });
      expect({
        over,
        status: res.status,
        // One field may carry several messages (type and range); the fields are what count.
        paths: [...new Set(res.body.issues?.map((i: { path: string }) => i.path))],
      }).toEqual({
        over,
        status: 400,
        paths,
      });
    }
    expect((await pi.get(base)).body).toMatchObject({ version: p.version, observations: [] });
  });

  it('keeps the calculator’s blockers as checks beside a saved observation, naming the form’s fields', async () => {
    const { p: start, base, targetId } = await withTarget({ ra: '10:00:00', dec: '-30:00:00' });
    const p = await must(
      pi.post(`${base}/observations`, {
        version: start.version,
        ...observationOf(array, targetId, {
          frequencyGHz: 9,
          bandwidthMHz: 4000,
          rmsGoalMicroJy: 1,
          hoursAsked: 1,
        }),
      }),
      201,
    );
    const checks = observations(p)[0]!.checks;
    expect(checks.map((c) => [c.level, c.code, c.field])).toEqual([
      ['blocker', 'FREQUENCY_OUTSIDE_BAND', 'frequencyGHz'],
      ['blocker', 'BANDWIDTH_TOO_WIDE', 'bandwidthMHz'],
      ['warning', 'TIME_SHORT_OF_GOAL', 'hoursAsked'],
    ]);
  });

  it('changes and removes an observation', async () => {
    const made = await withTarget({ ra: '10:00:00', dec: '-30:00:00' });
    const { base, targetId } = made;
    let p = made.p;
    p = await must(
      pi.post(`${base}/observations`, { version: p.version, ...observationOf(array, targetId) }),
      201,
    );
    const id = observations(p)[0]!.id;
    const before = observations(p)[0]!.result.rmsMicroJy;
    p = await must(pi.patch(`${base}/observations/${id}`, { version: p.version, hoursAsked: 16 }));
    // Four times the time: half the rms (radiometer equation).
    expect(observations(p)[0]!.result.rmsMicroJy).toBeCloseTo(before / 2, 9);
    expect(observations(p)[0]!.hoursAsked).toBe(16);
    p = await must(pi.delete(`${base}/observations/${id}?version=${p.version}`));
    expect(observations(p)).toEqual([]);
    const gone = await pi.delete(`${base}/observations/${id}?version=${p.version}`);
    expect(gone.status).toBe(404);
  });

  describe('GET /checks', () => {
    it('lists the proposal-level blockers of an empty draft, by section', async () => {
      const p = await createProposal(pi, call.code, { scienceCategory: undefined });
      const res = (await pi.get(`/api/proposals/${p.reference}/checks`).expect(200)).body;
      expect(res.items.map((c: { code: string; section: string }) => [c.code, c.section])).toEqual([
        ['ABSTRACT_MISSING', 'overview'],
        ['SCIENCE_CATEGORY_MISSING', 'overview'],
        ['NO_OBSERVATIONS', 'observations'],
        ['SCIENCE_CASE_MISSING', 'documents'],
      ]);
      expect(res).toMatchObject({ blockers: 4, warnings: 0, notes: 0 });
    });

    it('counts abstract words against the limit of 300', async () => {
      let p = await createProposal(pi, call.code);
      const base = `/api/proposals/${p.reference}`;
      p = await must(
        pi.patch(base, { version: p.version, abstract: Array(301).fill('word').join(' ') }),
      );
      let codes = (await pi.get(`${base}/checks`)).body.items.map((c: { code: string }) => c.code);
      expect(codes).toContain('ABSTRACT_TOO_LONG');
      await must(
        pi.patch(base, {
          version: p.version,
          abstract: ` ${Array(300).fill('word').join('\n ')} `,
        }),
      );
      codes = (await pi.get(`${base}/checks`)).body.items.map((c: { code: string }) => c.code);
      expect(codes).not.toContain('ABSTRACT_TOO_LONG');
      expect(codes).not.toContain('ABSTRACT_MISSING');
    });

    it('flags hours above the call’s largest request, a configuration not on offer, an unused target', async () => {
      // The call offers hours in the first configuration only.
      const narrow = await makeCall(t.dataSource, array, {
        hours: [100, 0],
        maxHoursPerProposal: 10,
      });
      const made = await withTarget({ ra: '10:00:00', dec: '-30:00:00' }, narrow);
      const { base, targetId } = made;
      let p = made.p;
      p = await must(
        pi.post(`${base}/observations`, {
          version: p.version,
          ...observationOf(array, targetId, {
            configurationId: array.configurations[1]!.id,
            hoursAsked: 8,
          }),
        }),
        201,
      );
      p = await must(
        pi.post(`${base}/observations`, {
          version: p.version,
          ...observationOf(array, targetId, { hoursAsked: 4 }),
        }),
        201,
      );
      p = await must(
        pi.post(`${base}/targets`, { version: p.version, name: 'Spare', ra: '1', dec: '-20' }),
        201,
      );
      const res = (await pi.get(`${base}/checks`)).body;
      const find = (code: string) => res.items.find((c: { code: string }) => c.code === code);
      expect(find('HOURS_ABOVE_CALL_LIMIT')).toMatchObject({
        level: 'blocker',
        section: 'observations',
        message: `The proposal asks for 12 h in all; call ${narrow.code} allows at most 10 h per proposal.`,
      });
      expect(find('CONFIGURATION_NOT_OFFERED')).toMatchObject({
        level: 'blocker',
        field: 'configurationId',
        observationId: observations(p)[0]!.id,
        targetId,
      });
      expect(find('CONFIGURATION_NOT_OFFERED').message).toMatch(
        /^Observation 1: .* no hours in the long configuration; it offers short\.$/,
      );
      expect(observations(p)[0]!.checks.map((c) => c.code)).toContain('CONFIGURATION_NOT_OFFERED');
      expect(find('TARGET_UNUSED')).toMatchObject({
        level: 'note',
        message: 'Target Spare has no observation.',
      });
    });

    it('follows the call: a kind it no longer takes, and its deadline by the server clock', async () => {
      const own = await makeCall(t.dataSource, array, { proposalKinds: ['standard', 'large'] });
      const p = await completeDraft(pi, array, own, { kind: 'large' });
      await t.dataSource.query(`UPDATE calls SET proposal_kinds = '{standard}' WHERE id = $1`, [
        own.id,
      ]);
      let codes = (await pi.get(`/api/proposals/${p.reference}/checks`)).body.items.map(
        (c: { code: string }) => c.code,
      );
      expect(codes).toContain('KIND_NOT_ACCEPTED');
      expect(codes).not.toContain('DEADLINE_PASSED');
      t.clock.set(new Date(own.deadlineAt.getTime() + 1));
      const res = (await pi.get(`/api/proposals/${p.reference}/checks`)).body;
      codes = res.items.map((c: { code: string }) => c.code);
      expect(codes).toContain('DEADLINE_PASSED');
      // And no write goes through any more.
      const edit = await pi.patch(`/api/proposals/${p.reference}`, {
        version: p.version,
        title: 'Late',
      });
      expect({ status: edit.status, code: edit.body.code }).toEqual({
        status: 409,
        code: 'DEADLINE_PASSED',
      });
    });
  });
});
