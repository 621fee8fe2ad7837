import { createTestApp, type TestApp } from './support/app.js';
import { agentFor, makeCallInReview, submitReviews } from './support/review-factories.js';

/**
 * The review factories other specs build on: what they write must be what the API itself would
 * hold for a call past its deadline (submitted proposals a referee's PDF can come from, per-call
 * roles), so a spec using them tests the API and not a shape only the factory makes.
 */
describe('review factories', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('makes a call in review with submitted proposals, a chair and referees with their roles', async () => {
    const c = await makeCallInReview(t, { proposals: 3, referees: 4, compilePdf: false });
    expect(c.call.status).toBe('in_review');
    expect(c.call.deadlineAt.getTime()).toBeLessThan(Date.now());
    const roles = (await t.dataSource.query(
      `SELECT role, count(*)::int AS n FROM call_roles WHERE call_id = $1 GROUP BY role ORDER BY role`,
      [c.call.id],
    )) as { role: string; n: number }[];
    expect(roles).toEqual([
      { role: 'chair', n: 1 },
      { role: 'referee', n: 4 },
    ]);
    const proposals = (await t.dataSource.query(
      `SELECT p.status, p.submitted_version, count(o.id)::int AS observations
         FROM proposals p LEFT JOIN proposal_observations o ON o.proposal_id = p.id
        WHERE p.call_id = $1 GROUP BY p.id ORDER BY p.reference`,
      [c.call.id],
    )) as { status: string; submitted_version: number; observations: number }[];
    expect(proposals).toHaveLength(3);
    for (const p of proposals)
      expect(p).toMatchObject({ status: 'submitted', submitted_version: 1 });
    for (const p of proposals) expect(p.observations).toBeGreaterThan(0);
    // The PI is the proposal's member and can read it through the API.
    const pi = await agentFor(t, c.proposals[0]!.pi);
    const res = await pi.get(`/api/proposals/${c.proposals[0]!.proposal.reference}`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('submitted');
  });

  it('writes submitted reviews as given, referee j scoring proposal i, null for none', async () => {
    const c = await makeCallInReview(t, { proposals: 2, referees: 3, compilePdf: false });
    await submitReviews(t, c, [
      [7, null, 4],
      [null, 9, 2],
    ]);
    const rows = (await t.dataSource.query(
      `SELECT a.proposal_id, a.referee_id, a.status, a.score
         FROM review_assignments a JOIN proposals p ON p.id = a.proposal_id
        WHERE p.call_id = $1`,
      [c.call.id],
    )) as { proposal_id: string; referee_id: string; status: string; score: number }[];
    expect(rows).toHaveLength(4);
    const score = (i: number, j: number) =>
      rows.find(
        (r) => r.proposal_id === c.proposals[i]!.proposal.id && r.referee_id === c.referees[j]!.id,
      )?.score;
    expect([score(0, 0), score(0, 1), score(0, 2)]).toEqual([7, undefined, 4]);
    expect([score(1, 0), score(1, 1), score(1, 2)]).toEqual([undefined, 9, 2]);
    expect(new Set(rows.map((r) => r.status))).toEqual(new Set(['submitted']));
  });
});
