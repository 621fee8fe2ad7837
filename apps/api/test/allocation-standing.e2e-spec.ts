import Papa from 'papaparse';
import { mean, sampleStandardDeviation } from 'simple-statistics';
import { createTestApp, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';
import {
  agentFor,
  assignReview,
  type CallInReview,
  makeCallInReview,
  submitReviews,
} from './support/review-factories.js';

/**
 * The chair's standing as served: its numbers against a case worked by hand (and by
 * simple-statistics, an independent implementation of the mean and the sample standard
 * deviation), ties, the disagreement flag, cumulative grants and where the offer runs out, and
 * the CSV with its cells defused against formula injection.
 */
describe('allocation: the standing', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const standingOf = async (c: CallInReview, query = '') => {
    const chair = await agentFor(t, c.chair);
    const res = await chair.get(`/api/calls/${c.call.code}/standing${query}`);
    expect({ status: res.status, body: res.body }).toMatchObject({ status: 200 });
    return res;
  };

  it('gives each proposal its raw mean, per-referee z, spread and rank, as worked by hand', async () => {
    const c = await makeCallInReview(t, { proposals: 3, referees: 3, compilePdf: false });
    // Referee j's score of proposal i. Each referee's two scores are 4 apart, so each referee's
    // sample sd is sqrt(8) and every z is ±2/sqrt(8) = ±0.7071 (worked by hand).
    const scores = [
      [9, 8, null],
      [5, null, 6],
      [null, 4, 2],
    ];
    await submitReviews(t, c, scores);
    const { body } = await standingOf(c);
    const refs = c.proposals.map((p) => p.proposal.reference);
    expect(body.rows.map((r: { reference: string }) => r.reference)).toEqual(refs);

    const z = 2 / Math.sqrt(8);
    const byHand = [
      { rank: 1, rawMean: 8.5, normalisedScore: z, spread: Math.SQRT1_2 },
      { rank: 2, rawMean: 5.5, normalisedScore: 0, spread: Math.SQRT1_2 },
      { rank: 3, rawMean: 3, normalisedScore: -z, spread: Math.SQRT2 },
    ];
    byHand.forEach((want, i) => {
      const row = body.rows[i];
      expect(row.rank).toBe(want.rank);
      expect(row.rawMean).toBeCloseTo(want.rawMean, 9);
      expect(row.normalisedScore).toBeCloseTo(want.normalisedScore, 9);
      expect(row.spread).toBeCloseTo(want.spread, 9);
      expect(row.disagreement).toBe(false);
      expect(row.reviewsIn).toBe(2);
      expect(row.hoursGranted).toBeNull();
      expect(row.tier).toBeNull();
    });

    // The same from simple-statistics: each review's z against its referee's own scores.
    const perReferee = [0, 1, 2].map((j) =>
      scores.map((row) => row[j]).filter((s): s is number => s !== null),
    );
    for (const [i, row] of body.rows.entries()) {
      const own = scores[i]!.filter((s): s is number => s !== null);
      expect(row.rawMean).toBeCloseTo(mean(own), 9);
      expect(row.spread).toBeCloseTo(sampleStandardDeviation(own), 9);
      for (const review of row.reviews) {
        const j = c.referees.findIndex((r) => r.id === review.refereeId);
        const theirs = perReferee[j]!;
        expect(review.z).toBeCloseTo(
          (review.score - mean(theirs)) / sampleStandardDeviation(theirs),
          9,
        );
        expect(review.refereeName).toBe(c.referees[j]!.name);
      }
    }
    expect(body.referees).toHaveLength(3);
    expect(body.undecided).toEqual(refs);
    expect(body.call).toMatchObject({ code: c.call.code, scoreMin: 1, scoreMax: 10 });
    expect(body.pressure).toHaveLength(body.configurations.length);
    for (const p of body.pressure) expect(p.bins).toHaveLength(24);
  });

  it('breaks a tie of normalised score and raw mean by reference, and puts unreviewed rows last', async () => {
    const c = await makeCallInReview(t, { proposals: 3, referees: 2, compilePdf: false });
    // Referee 1 prefers proposal 1, referee 2 proposal 2, by the same margin: z 0 each, raw
    // mean 5 each. Proposal 3 has no review.
    await submitReviews(t, c, [
      [6, 4],
      [4, 6],
    ]);
    const { body } = await standingOf(c);
    const [a, b, none] = body.rows;
    expect(a.normalisedScore).toBeCloseTo(0, 9);
    expect(b.normalisedScore).toBeCloseTo(0, 9);
    expect(a.rawMean).toBe(5);
    expect(b.rawMean).toBe(5);
    expect([a.reference, b.reference, none.reference]).toEqual(
      c.proposals.map((p) => p.proposal.reference),
    );
    expect([a.rank, b.rank, none.rank]).toEqual([1, 2, null]);
    expect(none).toMatchObject({
      reviewsIn: 0,
      rawMean: null,
      normalisedScore: null,
      spread: null,
    });
  });

  it('flags a spread above 20 % of the scale as disagreement', async () => {
    const c = await makeCallInReview(t, { proposals: 2, referees: 2, compilePdf: false });
    // Scale 1–10: the flag needs a sample sd above 1.8. 10 and 1: sd 6.36; 6 and 5: sd 0.71.
    await submitReviews(t, c, [
      [10, 1],
      [6, 5],
    ]);
    const { body } = await standingOf(c);
    const flag = Object.fromEntries(
      body.rows.map((r: { reference: string; disagreement: boolean; spread: number }) => [
        r.reference,
        [r.disagreement, r.spread],
      ]),
    );
    const [p1, p2] = c.proposals.map((p) => p.proposal.reference);
    expect(flag[p1!][0]).toBe(true);
    expect(flag[p1!][1]).toBeCloseTo(9 / Math.SQRT2, 9);
    expect(flag[p2!][0]).toBe(false);
  });

  it('sums grants down the ranks per configuration and names the row where the offer runs out', async () => {
    const c = await makeCallInReview(t, {
      status: 'deliberation',
      proposals: 3,
      referees: 3,
      hoursAsked: [6, 5, 4],
      compilePdf: false,
    });
    const [short, long] = c.array.configurations;
    await t.dataSource.query(
      `UPDATE call_capacities SET hours_offered = 10 WHERE call_id = $1 AND configuration_id = $2`,
      [c.call.id, short!.id],
    );
    await submitReviews(t, c, [
      [9, 8, null],
      [5, null, 6],
      [null, 4, 2],
    ]);
    const chair = await agentFor(t, c.chair);
    const [r1, r2, r3] = c.proposals.map((p) => p.proposal.reference);
    expect((await chair.put(`/api/proposals/${r1}/grant`, { tier: 'tier1' })).status).toBe(200);
    const second = await chair.put(`/api/proposals/${r2}/grant`, { tier: 'tier2' });
    expect(second.status).toBe(200);
    expect(second.body.row).toMatchObject({ reference: r2, tier: 'tier2', hoursGranted: 5 });
    expect(second.body.row.cumulativeGranted[short!.id]).toBe(11);
    expect(second.body.undecided).toEqual([r3]);

    const { body } = await standingOf(c);
    expect(
      body.rows.map(
        (r: { cumulativeGranted: Record<string, number> }) => r.cumulativeGranted[short!.id],
      ),
    ).toEqual([6, 11, 11]);
    expect(
      body.rows.map(
        (r: { cumulativeGranted: Record<string, number> }) => r.cumulativeGranted[long!.id],
      ),
    ).toEqual([0, 0, 0]);
    const totals = body.totals.find(
      (x: { configurationId: string }) => x.configurationId === short!.id,
    );
    expect(totals).toEqual({
      configurationId: short!.id,
      hoursOffered: 10,
      hoursAsked: 15,
      hoursGranted: 11,
      oversubscription: 1.5,
      offerRunsOutAt: r2,
    });
    // Granted hours land in the pressure of their tier; in total what was granted (each of the
    // 24 bins is rounded to 1e-6 h).
    const pressure = body.pressure.find(
      (p: { configurationId: string }) => p.configurationId === short!.id,
    );
    const sum = (k: 'tier1' | 'tier2' | 'tier3') =>
      pressure.bins.reduce(
        (s: number, b: { granted: Record<string, number> }) => s + (b.granted[k] ?? 0),
        0,
      );
    expect(sum('tier1')).toBeCloseTo(6, 4);
    expect(sum('tier2')).toBeCloseTo(5, 4);
    expect(sum('tier3')).toBe(0);
  });

  it('answers CSV with people’s text defused against formula injection and numbers left as numbers', async () => {
    const c = await makeCallInReview(t, { proposals: 2, referees: 2, compilePdf: false });
    await submitReviews(t, c, [
      [9, 8],
      [3, 4],
    ]);
    const [p1, p2] = c.proposals;
    await t.dataSource.query(
      `UPDATE proposals SET title = $2, science_category = $3 WHERE id = $1`,
      [p1!.proposal.id, '=HYPERLINK("http://example.invalid","click")', '@SUM(A1:A9)'],
    );
    await t.dataSource.query(`UPDATE proposals SET title = $2 WHERE id = $1`, [
      p2!.proposal.id,
      '-2+3, "quoted", and a comma',
    ]);
    await t.dataSource.query(`UPDATE users SET name = $2 WHERE id = $1`, [p1!.pi.id, '+cmd|x']);
    const res = await standingOf(c, '?format=csv');
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toContain(`${c.call.code}-standing.csv`);
    expect(res.text).toContain('\r\n');
    const parsed = Papa.parse<Record<string, string>>(res.text.trim(), { header: true });
    expect(parsed.errors).toEqual([]);
    const byRef = new Map(parsed.data.map((r) => [r.reference, r]));
    const a = byRef.get(p1!.proposal.reference)!;
    const b = byRef.get(p2!.proposal.reference)!;
    expect(a.title).toBe(`'=HYPERLINK("http://example.invalid","click")`);
    expect(a.category).toBe(`'@SUM(A1:A9)`);
    expect(a.PI).toBe(`'+cmd|x`);
    expect(b.title).toBe(`'-2+3, "quoted", and a comma`);
    // The lower-ranked proposal's normalised score is negative, and stays a number.
    const scores = parsed.data.map((r) => r['normalised score']!);
    expect(scores.some((s) => /^-\d/.test(s))).toBe(true);
    expect(a.tier).toBe('undecided');
  });

  it('is for the call’s chair and staff: another call’s chair and the call’s referees do not see it', async () => {
    const c = await makeCallInReview(t, { proposals: 1, referees: 1, compilePdf: false });
    const path = `/api/calls/${c.call.code}/standing`;
    const other = await makeCallInReview(t, { proposals: 1, referees: 0, compilePdf: false });
    expect((await (await agentFor(t, other.chair)).get(path)).status).toBe(404);
    expect((await (await agentFor(t, c.referees[0]!)).get(path)).status).toBe(403);
    expect((await (await agentFor(t, c.proposals[0]!.pi)).get(path)).status).toBe(403);
    const staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
    expect((await staff.get(path)).status).toBe(200);
    expect((await staff.get(`${path}?format=xlsx`)).body).toMatchObject({
      statusCode: 400,
      issues: [{ path: 'format' }],
    });
  });

  it('reads a call in the same number of statements whatever its size', async () => {
    const count = async (proposals: number) => {
      const c = await makeCallInReview(t, { proposals, referees: 3, compilePdf: false });
      await submitReviews(
        t,
        c,
        c.proposals.map((_, i) => [1 + (i % 10), 1 + ((i * 3) % 10), null]),
      );
      await assignReview(t, c.proposals[0]!.proposal, c.referees[2]!, { status: 'accepted' });
      await standingOf(c);
      return t.statements.maxima.get(`GET /api/calls/${c.call.code}/standing`);
    };
    const small = await count(1);
    expect(small).toBeGreaterThan(0);
    expect(await count(12)).toBe(small);
  });
});
