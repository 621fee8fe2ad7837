import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { Configuration } from '../src/observatory/entities/configuration.entity.js';
import { Observatory } from '../src/observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../src/observatory/entities/receiver-band.entity.js';
import { createTestApp, randomTestIp, type TestApp } from './support/app.js';

/*
 * POST /api/calculator against numbers computed here, independently of @skyhours/calc, from the
 * formulas of SCIENCE.md with the exact SI constants, and against the published values of its
 * check table.
 */
const K = 1.380649e-23; // Boltzmann constant, SI 2019 (exact)
const C = 299_792_458; // speed of light, SI (exact)
const JY = 1e-26; // IAU jansky
const ARCSEC_PER_RAD = 648_000 / Math.PI;
const RAD = Math.PI / 180;
const HI_REST_GHZ = 1.420405751768; // Hellwig et al. 1970

type Body = Record<string, unknown>;

/** SCIENCE.md's contract example, with 4 h on source so that no check fires. */
const baseBody = (): Body => ({
  array: {
    antennas: 18,
    dishDiameterM: 16,
    latitudeDeg: 47.3,
    longitudeDeg: -118.9,
    elevationLimitDeg: 15,
    correlatorEfficiency: 0.88,
    overheadFraction: 0.2,
    beamFactor: 1.13,
  },
  configuration: { shortestBaselineM: 30, longestBaselineM: 3200 },
  band: { minGHz: 1, maxGHz: 2, tsysK: 28, apertureEfficiency: 0.65, maxBandwidthMHz: 1000 },
  frequencyGHz: 1.4,
  bandwidthMHz: 500,
  polarizations: 2,
  target: { raDeg: 150.1, decDeg: 22.5, extentArcsec: 0, resolutionGoalArcsec: null },
  rmsGoalMicroJy: 10,
  onSourceHours: 4,
});

/** A copy of the base body with some top-level fields or nested fields replaced. */
function bodyWith(changes: Record<string, unknown>): Body {
  const body = baseBody();
  for (const [path, value] of Object.entries(changes)) {
    const [head, tail] = path.split('.') as [string, string | undefined];
    if (tail === undefined) body[head] = value;
    else body[head] = { ...(body[head] as Body), [tail]: value };
  }
  return body;
}

const wrapHours = (h: number) => ((h % 24) + 24) % 24;

/** A stored observatory with one configuration and one band, holding the base body's numbers. */
async function storeObservatory(dataSource: DataSource) {
  const body = baseBody();
  const observatory = await dataSource.getRepository(Observatory).save({
    ...(body.array as object),
    name: `Calculator Test Array ${randomUUID().slice(0, 8)}`,
    elevationM: 500,
    timeZone: 'UTC',
  });
  const configuration = await dataSource.getRepository(Configuration).save({
    ...(body.configuration as object),
    observatoryId: observatory.id,
    name: 'test layout',
    inUseFrom: '2026-01-01',
    inUseTo: null,
  });
  const band = await dataSource.getRepository(ReceiverBand).save({
    ...(body.band as object),
    observatoryId: observatory.id,
    name: 'test band',
    ieeeLetter: 'L',
    polarizations: [1, 2],
  });
  return { observatory, configuration, band };
}

/** The base body with its array, configuration and band named by id instead. */
function bodyByIds(ids: { observatory?: string; configuration?: string; band?: string }): Body {
  const { array: _array, configuration: _configuration, band: _band, ...rest } = baseBody();
  return {
    ...rest,
    ...(ids.observatory ? { observatoryId: ids.observatory } : {}),
    ...(ids.configuration ? { configurationId: ids.configuration } : {}),
    ...(ids.band ? { bandId: ids.band } : {}),
  };
}

describe('POST /api/calculator', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  /**
   * An anonymous client without a session or a CSRF token, as a visitor's browser is, from an
   * address of its own so that the per-address rate limit does not count other tests' requests.
   */
  const post = (body: unknown) =>
    request(t.app.getHttpServer())
      .post('/api/calculator')
      .set('X-Forwarded-For', randomTestIp())
      .set('Content-Type', 'application/json')
      .send(body as object);

  it('answers every number of SCIENCE.md for the contract example', async () => {
    const res = await post(baseBody());
    expect(res.status).toBe(200);

    const lambda = C / 1.4e9; // λ = c/ν
    const area = (0.65 * Math.PI * 16 ** 2) / 4; // A_eff = η_a π D²/4
    const sefd = (2 * K * 28) / area / JY; // SEFD = 2kT_sys/A_eff
    // Wrobel & Walker 1999 radiometer equation, natural weighting, N = 18, n_pol = 2.
    const perSecond = 2 * 18 * 17 * 500e6;
    const rmsJy = sefd / (0.88 * Math.sqrt(perSecond * 4 * 3600));
    const goalS = (sefd / (0.88 * 10e-6)) ** 2 / perSecond; // its inverse for σ = 10 µJy
    const resolution = (lambda / 3200) * ARCSEC_PER_RAD; // λ/B_longest
    // Rayleigh–Jeans: ΔT_b = σλ²/(2kΩ), Ω = πθ²/(4 ln 2) for a Gaussian beam of FWHM θ.
    const omega = (Math.PI * (resolution / ARCSEC_PER_RAD) ** 2) / (4 * Math.LN2);
    // Meeus eq. 15.1: cos H0 = (sin e − sin φ sin δ)/(cos φ cos δ).
    const h0 =
      Math.acos(
        (Math.sin(15 * RAD) - Math.sin(47.3 * RAD) * Math.sin(22.5 * RAD)) /
          (Math.cos(47.3 * RAD) * Math.cos(22.5 * RAD)),
      ) / RAD;

    const expected = {
      skyFrequencyGHz: 1.4,
      wavelengthM: lambda,
      resolutionArcsec: resolution,
      largestScaleArcsec: 0.6 * (lambda / 30) * ARCSEC_PER_RAD,
      primaryBeamArcmin: ((1.13 * lambda) / 16) * (10_800 / Math.PI),
      pointings: 1,
      effectiveAreaM2: area,
      sefdJy: sefd,
      rmsMicroJy: rmsJy * 1e6,
      onSourceHoursForGoal: goalS / 3600,
      totalHours: 4 * 1 * 1.2,
      brightnessRmsK: (rmsJy * JY * lambda ** 2) / (2 * K * omega),
      maxElevationDeg: 90 - Math.abs(47.3 - 22.5),
      hoursAboveLimit: (2 * h0) / 15,
      lstRiseHours: wrapHours((150.1 - h0) / 15),
      lstSetHours: wrapHours((150.1 + h0) / 15),
    };
    for (const [key, value] of Object.entries(expected)) {
      expect([key, res.body[key]]).toEqual([key, expect.closeTo(value, 9)]);
    }
    expect(res.body.checks).toEqual([]);
    expect(Object.keys(res.body).sort()).toEqual([...Object.keys(expected), 'checks'].sort());
  });

  it('matches the published check values of SCIENCE.md', async () => {
    // SEFD row: T_sys 50 K, η_a 0.7, D 25 m → A_eff 343.611696 m², SEFD 401.805007 Jy.
    const sefdRow = await post(
      bodyWith({ 'array.dishDiameterM': 25, 'band.tsysK': 50, 'band.apertureEfficiency': 0.7 }),
    );
    expect(sefdRow.status).toBe(200);
    expect(sefdRow.body.effectiveAreaM2).toBeCloseTo(343.611696, 6);
    expect(sefdRow.body.sefdJy).toBeCloseTo(401.805007, 6);

    // Image-rms and time rows (Wrobel & Walker 1999 form): SEFD 400 Jy, η_c 1, n_pol 2, N 27,
    // 128 MHz, 1 h → 15.72607 µJy; σ 10 µJy needs 8903.134 s. T_sys is chosen to give SEFD 400 Jy.
    const area = (0.7 * Math.PI * 25 ** 2) / 4;
    const rmsRow = await post(
      bodyWith({
        'array.antennas': 27,
        'array.dishDiameterM': 25,
        'array.correlatorEfficiency': 1,
        'band.tsysK': (400 * JY * area) / (2 * K),
        'band.apertureEfficiency': 0.7,
        bandwidthMHz: 128,
        onSourceHours: 1,
        rmsGoalMicroJy: 10,
      }),
    );
    expect(rmsRow.status).toBe(200);
    expect(rmsRow.body.sefdJy).toBeCloseTo(400, 9);
    expect(rmsRow.body.rmsMicroJy).toBeCloseTo(15.72607, 5);
    expect(rmsRow.body.onSourceHoursForGoal * 3600).toBeCloseTo(8903.134, 3);

    // 21-cm wavelength: c / 1420.405751768 MHz = 21.1061140542 cm.
    const hi = await post(bodyWith({ frequencyGHz: HI_REST_GHZ }));
    expect(hi.body.wavelengthM * 100).toBeCloseTo(21.1061140542, 10);

    // Meeus, Example 15.a: φ 42.3333°, e −0.5667°, δ 18.44092° → H0 108.5344°.
    const meeus = await post(
      bodyWith({
        'array.latitudeDeg': 42.3333,
        'array.elevationLimitDeg': -0.5667,
        'target.decDeg': 18.44092,
      }),
    );
    expect((meeus.body.hoursAboveLimit * 15) / 2).toBeCloseTo(108.5344, 4);

    // Rayleigh–Jeans row: 1 Jy/beam at 1.4 GHz in a 1″ beam → 623 530.79 K. The longest baseline
    // gives λ/B = 1″; with no on-source time the brightness rms is that of the goal, 1 Jy.
    const rj = await post(
      bodyWith({
        'configuration.longestBaselineM': (C / 1.4e9) * ARCSEC_PER_RAD,
        rmsGoalMicroJy: 1e6,
        onSourceHours: null,
      }),
    );
    expect(rj.status).toBe(200);
    expect(rj.body.resolutionArcsec).toBeCloseTo(1, 12);
    expect(rj.body.brightnessRmsK).toBeCloseTo(623_530.79, 2);
    expect(rj.body.rmsMicroJy).toBeNull();
  });

  it('answers null for the numbers that do not apply', async () => {
    const noGoal = await post(bodyWith({ rmsGoalMicroJy: null, onSourceHours: null }));
    expect(noGoal.status).toBe(200);
    expect(noGoal.body).toMatchObject({
      rmsMicroJy: null,
      onSourceHoursForGoal: null,
      totalHours: null,
      brightnessRmsK: null,
    });
    // δ 80° at φ 47.3°: the lowest elevation is 90° − (180° − 47.3° − 80°) = 37.3° > 15°.
    const circumpolar = await post(bodyWith({ 'target.decDeg': 80 }));
    expect(circumpolar.body).toMatchObject({
      hoursAboveLimit: 24,
      lstRiseHours: null,
      lstSetHours: null,
    });
  });

  describe('each of the nine checks fires on its own', () => {
    const lambda = C / 1.4e9;
    const cases: [string, Record<string, unknown>, string, string][] = [
      ['FREQUENCY_OUTSIDE_BAND', { frequencyGHz: 2.5 }, 'blocker', 'frequencyGHz'],
      // The wider band also shortens the time the goal needs, to 1.71 h: 2 h stays within 1.5×.
      ['BANDWIDTH_TOO_WIDE', { bandwidthMHz: 1200, onSourceHours: 2 }, 'blocker', 'bandwidthMHz'],
      // Culminates at 90° − |47.3° + 60°| = −17.3°, below the 15° limit.
      ['NEVER_RISES', { 'target.decDeg': -60 }, 'blocker', 'target.decDeg'],
      // λ/B at 1.4 GHz over 3200 m is 13.8″.
      [
        'RESOLUTION_NOT_REACHED',
        { 'target.resolutionGoalArcsec': 1 },
        'warning',
        'target.resolutionGoalArcsec',
      ],
      // 0.6 λ/30 m = 883″ < 1000″ < half the primary beam, 1.13 λ/(2·16 m) = 1560″.
      [
        'EXTENT_EXCEEDS_LARGEST_SCALE',
        { 'target.extentArcsec': 1000 },
        'warning',
        'target.extentArcsec',
      ],
      // 2000″ > 1560″ needs a mosaic; a 10 m shortest baseline keeps the largest scale at 2650″.
      [
        'MOSAIC_REQUIRED',
        { 'target.extentArcsec': 2000, 'configuration.shortestBaselineM': 10 },
        'note',
        'target.extentArcsec',
      ],
      // 1 h reaches 2.03 × the 10 µJy goal (the goal needs 4.1 h).
      ['TIME_SHORT_OF_GOAL', { onSourceHours: 1 }, 'warning', 'onSourceHours'],
      ['TIME_ABOVE_NEED', { onSourceHours: 10 }, 'warning', 'onSourceHours'],
      // Culminates at 90° − 72.3° = 17.7°: above the 15° limit, below 30° (common practice).
      ['LOW_ELEVATION', { 'target.decDeg': -25 }, 'warning', 'target.decDeg'],
    ];

    it.each(cases)('%s', async (code, changes, level, field) => {
      const res = await post(bodyWith(changes));
      expect(res.status).toBe(200);
      expect(res.body.checks).toEqual([
        { code, level, field, message: expect.stringMatching(/\d/) },
      ]);
    });

    it('counts the mosaic pointings on the hexagonal grid of spacing λ/(2D)', async () => {
      const res = await post(
        bodyWith({ 'target.extentArcsec': 2000, 'configuration.shortestBaselineM': 10 }),
      );
      const s = (lambda / 32) * ARCSEC_PER_RAD;
      const pointings = Math.ceil(((Math.PI / 4) * 2000 ** 2) / ((Math.sqrt(3) / 2) * s ** 2));
      expect(pointings).toBeGreaterThan(1);
      expect(res.body.pointings).toBe(pointings);
      expect(res.body.totalHours).toBeCloseTo(4 * pointings * 1.2, 12);
      expect(res.body.checks[0].message).toContain(String(pointings));
    });

    it('puts blockers before warnings before notes', async () => {
      const res = await post(
        bodyWith({
          'target.extentArcsec': 5000,
          'target.decDeg': -60,
          bandwidthMHz: 1200,
        }),
      );
      const levels = (res.body.checks as { level: string }[]).map((c) => c.level);
      expect(levels).toEqual([...levels].sort((a, b) => rank(a) - rank(b)));
      expect(new Set(levels)).toEqual(new Set(['blocker', 'warning', 'note']));
    });
  });

  describe('line targets', () => {
    it('shifts the rest frequency in the radio convention, ν = ν0(1 − v/c)', async () => {
      const res = await post(
        bodyWith({
          frequencyGHz: null,
          line: { restGHz: HI_REST_GHZ, velocityKmS: 3000, convention: 'radio' },
        }),
      );
      expect(res.status).toBe(200);
      const sky = HI_REST_GHZ * (1 - 3_000_000 / C);
      expect(res.body.skyFrequencyGHz).toBeCloseTo(sky, 12);
      expect(res.body.wavelengthM).toBeCloseTo(C / (sky * 1e9), 12);
    });

    it('shifts by a redshift, ν = ν0/(1 + z), and blocks a line that leaves the band', async () => {
      const inBand = await post(
        bodyWith({ frequencyGHz: undefined, line: { restGHz: HI_REST_GHZ, redshift: 0.05 } }),
      );
      expect(inBand.status).toBe(200);
      expect(inBand.body.skyFrequencyGHz).toBeCloseTo(HI_REST_GHZ / 1.05, 12);

      // z = 0.5 puts the line at 0.947 GHz, under the band's 1 GHz edge.
      const outside = await post(
        bodyWith({ frequencyGHz: undefined, line: { restGHz: HI_REST_GHZ, redshift: 0.5 } }),
      );
      expect(outside.body.skyFrequencyGHz).toBeCloseTo(HI_REST_GHZ / 1.5, 12);
      expect(outside.body.checks).toEqual([
        expect.objectContaining({ code: 'FREQUENCY_OUTSIDE_BAND', field: 'line.restGHz' }),
      ]);
    });

    it('takes "redshift": null beside a velocity as no redshift', async () => {
      const res = await post(
        bodyWith({
          frequencyGHz: null,
          line: { restGHz: HI_REST_GHZ, velocityKmS: 3000, convention: 'optical', redshift: null },
        }),
      );
      expect(res.status).toBe(200);
      expect(res.body.skyFrequencyGHz).toBeCloseTo(HI_REST_GHZ / (1 + 3_000_000 / C), 12);
    });
  });

  describe('bad requests name their fields', () => {
    const issuePaths = (res: request.Response) =>
      (res.body.issues as { path: string }[]).map((i) => i.path).sort();

    const bad: [string, unknown, string[]][] = [
      [
        'a declination beyond the pole (the library)',
        bodyWith({ 'target.decDeg': 95 }),
        ['target.decDeg'],
      ],
      ['a bandwidth that is text (the DTO)', bodyWith({ bandwidthMHz: 'wide' }), ['bandwidthMHz']],
      [
        'both a frequency and a line',
        bodyWith({ line: { restGHz: HI_REST_GHZ, redshift: 0.01 } }),
        ['frequencyGHz', 'line'],
      ],
      ['neither a frequency nor a line', bodyWith({ frequencyGHz: null }), ['frequencyGHz']],
      ['a missing target', bodyWith({ target: undefined }), ['target']],
      ['a target that is an array', bodyWith({ target: [{ raDeg: 1 }] }), ['target']],
      ['a band that is text', bodyWith({ band: 'L' }), ['band']],
      ['an unknown field', bodyWith({ colour: 'blue' }), ['colour']],
      ['an unknown nested field', bodyWith({ 'array.feeds': 2 }), ['array.feeds']],
      ['a numeric string', bodyWith({ 'array.antennas': '18' }), ['array.antennas']],
      ['a fractional antenna count', bodyWith({ 'array.antennas': 17.5 }), ['array.antennas']],
      ['three polarisations', bodyWith({ polarizations: 3 }), ['polarizations']],
      [
        'a shortest baseline above the longest',
        bodyWith({ 'configuration.shortestBaselineM': 5000 }),
        ['configuration.shortestBaselineM'],
      ],
      [
        'a velocity without its convention',
        bodyWith({ frequencyGHz: null, line: { restGHz: HI_REST_GHZ, velocityKmS: 100 } }),
        ['line.convention'],
      ],
      [
        'a convention beside a redshift',
        bodyWith({
          frequencyGHz: null,
          line: { restGHz: HI_REST_GHZ, redshift: 0.1, convention: 'radio' },
        }),
        ['line.convention'],
      ],
      [
        'an unknown convention',
        bodyWith({
          frequencyGHz: null,
          line: { restGHz: HI_REST_GHZ, velocityKmS: 100, convention: 'sideways' },
        }),
        ['line.convention'],
      ],
      [
        'two range errors at once',
        bodyWith({ 'target.raDeg': 360, 'array.correlatorEfficiency': 1.5 }),
        ['array.correlatorEfficiency', 'target.raDeg'],
      ],
    ];

    it.each(bad)('%s', async (_label, body, paths) => {
      const res = await post(body);
      expect(res.status).toBe(400);
      expect(res.body).toMatchObject({ statusCode: 400, code: 'VALIDATION_FAILED' });
      expect(issuePaths(res)).toEqual(paths);
      for (const issue of res.body.issues as { message: string }[]) {
        expect(issue.message.length).toBeGreaterThan(5);
      }
    });

    it('answers 400 for a body that is not JSON', async () => {
      const res = await request(t.app.getHttpServer())
        .post('/api/calculator')
        .set('X-Forwarded-For', randomTestIp())
        .set('Content-Type', 'application/json')
        .send('{"array": ');
      expect(res.status).toBe(400);
      expect(res.body.code).toBe('BAD_REQUEST');
    });
  });

  describe('stored records named by id', () => {
    it('gives the same answer as the same numbers inline', async () => {
      const { observatory, configuration, band } = await storeObservatory(t.dataSource);
      const inline = await post(baseBody());
      const byIds = await post(
        bodyByIds({
          observatory: observatory.id,
          configuration: configuration.id,
          band: band.id,
        }),
      );
      expect(byIds.status).toBe(200);
      expect(byIds.body).toEqual(inline.body);

      // Mixed: the stored array and band with a configuration of one's own.
      const mixed = await post({
        ...bodyByIds({ observatory: observatory.id, band: band.id }),
        configuration: { shortestBaselineM: 30, longestBaselineM: 6400 },
      });
      expect(mixed.status).toBe(200);
      expect(mixed.body.resolutionArcsec).toBeCloseTo(inline.body.resolutionArcsec / 2, 12);
    });

    it('answers 404 naming each id that matches nothing', async () => {
      const { observatory } = await storeObservatory(t.dataSource);
      const res = await post(
        bodyByIds({ observatory: observatory.id, configuration: randomUUID(), band: randomUUID() }),
      );
      expect(res.status).toBe(404);
      expect(res.body).toMatchObject({ statusCode: 404, code: 'NOT_FOUND' });
      expect((res.body.issues as { path: string }[]).map((i) => i.path)).toEqual([
        'configurationId',
        'bandId',
      ]);
    });

    it('refuses a part given twice or not at all, a malformed id and a foreign record', async () => {
      const first = await storeObservatory(t.dataSource);
      const second = await storeObservatory(t.dataSource);
      const paths = (res: request.Response) =>
        (res.body.issues as { path: string }[]).map((i) => i.path).sort();

      const twice = await post({ ...baseBody(), observatoryId: first.observatory.id });
      expect(twice.status).toBe(400);
      expect(paths(twice)).toEqual(['array', 'observatoryId']);

      const none = await post(bodyByIds({ configuration: first.configuration.id }));
      expect(none.status).toBe(400);
      expect(paths(none)).toEqual(['array', 'band']);
      expect(none.body.issues[0].message).toMatch(/observatoryId/);

      // The DTO refuses the malformed id before the rest is looked at.
      const malformed = await post(bodyByIds({ observatory: first.observatory.id, band: 'L' }));
      expect(malformed.status).toBe(400);
      expect(paths(malformed)).toEqual(['bandId']);

      const foreign = await post(
        bodyByIds({
          observatory: first.observatory.id,
          configuration: second.configuration.id,
          band: first.band.id,
        }),
      );
      expect(foreign.status).toBe(400);
      expect(paths(foreign)).toEqual(['configurationId']);
    });
  });

  it('needs no session and no CSRF token, although other writes do', async () => {
    const ip = randomTestIp();
    const http = request(t.app.getHttpServer());
    const res = await http.post('/api/calculator').set('X-Forwarded-For', ip).send(baseBody());
    expect(res.status).toBe(200);
    expect(res.headers['set-cookie']).toBeUndefined();
    // The same anonymous client is refused on a write that is not exempt.
    const logout = await http.post('/api/auth/logout').set('X-Forwarded-For', ip);
    expect(logout.status).toBe(403);
    expect(logout.body.code).toBe('CSRF_INVALID');
  });
});

const rank = (level: string) => ['blocker', 'warning', 'note'].indexOf(level);

describe('POST /api/calculator with random bodies', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  /** Any JSON value, or the valid body with one field at any depth replaced by any JSON value. */
  const bodies = fc.oneof(
    fc.jsonValue(),
    fc.dictionary(fc.string(), fc.jsonValue()),
    fc
      .tuple(
        fc.constantFrom(
          ...Object.entries(baseBody()).flatMap(([key, value]) =>
            typeof value === 'object' && value !== null
              ? [key, ...Object.keys(value).map((inner) => `${key}.${inner}`)]
              : [key],
          ),
          'line',
          'line.restGHz',
          'line.redshift',
          'observatoryId',
          'configurationId',
          'bandId',
        ),
        fc.oneof(
          fc.jsonValue(),
          fc.double(),
          fc.constantFrom(0, -0, 1e308, -1e308, 5e-324, null, [], {}, ''),
        ),
      )
      .map(([path, value]) => bodyWith({ [path]: value })),
  );

  it('never answers 5xx, and answers 200 or a 400 with issues', async () => {
    await fc.assert(
      fc.asyncProperty(bodies, async (body) => {
        const res = await request(t.app.getHttpServer())
          .post('/api/calculator')
          .set('X-Forwarded-For', randomTestIp())
          .set('Content-Type', 'application/json')
          .send(JSON.stringify(body));
        expect(res.status).toBeLessThan(500);
        if (res.status === 400 && res.body.code === 'VALIDATION_FAILED') {
          expect(res.body.issues.length).toBeGreaterThan(0);
        } else if (res.status !== 200) {
          // Only a body that is not an object may fail before validation.
          expect([400, 413]).toContain(res.status);
        }
      }),
      { numRuns: 100 },
    );
  });
});

describe('POST /api/calculator rate limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('answers 429 in the error envelope after 120 requests a minute from one address', async () => {
    const ip = randomTestIp();
    const send = (body: object, from = ip) =>
      request(t.app.getHttpServer())
        .post('/api/calculator')
        .set('X-Forwarded-For', from)
        .send(body);
    // Invalid bodies count too: the limit is checked before validation.
    for (let i = 0; i < 120; i++) {
      expect((await send({})).status).toBe(400);
    }
    const res = await send(baseBody());
    expect(res.status).toBe(429);
    expect(res.body).toMatchObject({ statusCode: 429, code: 'RATE_LIMITED' });
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    // Another address is not held back.
    expect((await send(baseBody(), randomTestIp())).status).toBe(200);
  });
});
