import { ProposalTarget } from '../src/proposals/entities/proposal-target.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';
import { agentFor, type CallInReview, makeCallInReview } from './support/review-factories.js';

const DAY = 86_400_000;

interface Row {
  reference: string;
  assessment: { verdict: string; note: string; assessedBy: { name: string } | null } | null;
  checks: { blockers: number; items: { code: string }[] };
  overlaps: { otherReference: string; separationArcmin: number; primaryBeamArcmin: number }[];
}

/**
 * Technical assessments: staff's verdicts, the overlap warnings between proposals of one call
 * (libs/calc primaryBeamArcmin and angularSeparationDeg) and who may read and write them.
 */
describe('technical assessments', () => {
  let t: TestApp;
  let staff: TestAgent;

  beforeAll(async () => {
    t = await createTestApp();
    staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
  });
  afterAll(() => t.close());

  const moveTarget = (c: CallInReview, i: number, raDeg: number, decDeg: number) =>
    t.dataSource.manager.update(
      ProposalTarget,
      { id: c.proposals[i]!.target.id },
      { raDeg, decDeg },
    );
  const ref = (c: CallInReview, i: number) => c.proposals[i]!.proposal.reference;
  /** A write through the agent (which fetches its CSRF token first), expecting a status. */
  const put = async (agent: TestAgent, status: number, path: string, body: object) => {
    const res = await agent.put(path, body);
    expect({ path, status: res.status, body: res.body }).toMatchObject({ status });
    return res;
  };

  it('warns of targets 1′ apart in two proposals, and not of one 5° away', async () => {
    // 6 GHz on 12 m dishes: primary beam 1.13 λ/D ≈ 16.17′, so 1′ is well inside its 8.09′ radius.
    const c = await makeCallInReview(t, { proposals: 3, compilePdf: false });
    await moveTarget(c, 0, 150, -30);
    await moveTarget(c, 1, 150, -30 + 1 / 60);
    await moveTarget(c, 2, 150, -25);

    const res = await staff.get(`/api/calls/${c.call.code}/assessments`).expect(200);
    const rows = res.body.items as Row[];
    expect(rows.map((r) => r.reference)).toEqual([ref(c, 0), ref(c, 1), ref(c, 2)]);
    const [first, second, third] = rows as [Row, Row, Row];
    expect(first.overlaps).toHaveLength(1);
    expect(first.overlaps[0]!.otherReference).toBe(ref(c, 1));
    expect(first.overlaps[0]!.separationArcmin).toBeCloseTo(1, 6);
    expect(first.overlaps[0]!.primaryBeamArcmin).toBeCloseTo(16.175, 2);
    expect(second.overlaps.map((o) => o.otherReference)).toEqual([ref(c, 0)]);
    expect(third.overlaps).toEqual([]);
    expect(res.body).toMatchObject({ code: c.call.code, assessable: true, assessed: 0 });
    // The server's own checks come beside each proposal.
    expect(first.checks).toEqual(expect.objectContaining({ blockers: expect.any(Number) }));
    expect(first.assessment).toBeNull();
  });

  it('does not warn of a proposal of another call at the same position', async () => {
    const a = await makeCallInReview(t, { proposals: 1, compilePdf: false });
    const b = await makeCallInReview(t, { proposals: 1, compilePdf: false, array: a.array });
    await moveTarget(a, 0, 10, 10);
    await moveTarget(b, 0, 10, 10);
    const res = await staff.get(`/api/calls/${a.call.code}/assessments`).expect(200);
    expect((res.body.items as Row[])[0]!.overlaps).toEqual([]);
  });

  it('saves a verdict, replaces it, and audits both writes', async () => {
    const c = await makeCallInReview(t, { proposals: 2, compilePdf: false });
    const saved = await put(staff, 200, `/api/proposals/${ref(c, 0)}/assessment`, {
      verdict: 'feasible_with_changes',
      note: '  Ask for the compact configuration instead.  ',
    });
    expect(saved.body.assessment).toMatchObject({
      verdict: 'feasible_with_changes',
      note: 'Ask for the compact configuration instead.',
    });
    await put(staff, 200, `/api/proposals/${ref(c, 0)}/assessment`, { verdict: 'feasible' });

    const list = await staff.get(`/api/calls/${c.call.code}/assessments`).expect(200);
    expect(list.body.assessed).toBe(1);
    expect((list.body.items as Row[])[0]!.assessment).toMatchObject({
      verdict: 'feasible',
      note: '',
    });

    const audit = (await t.dataSource.query(
      `SELECT action, details FROM audit_events WHERE subject_id = $1 ORDER BY at, action`,
      [c.proposals[0]!.proposal.id],
    )) as { action: string; details: Record<string, unknown> }[];
    expect(audit.map((a) => a.action)).toEqual(['assessment.created', 'assessment.updated']);
    expect(audit[1]!.details).toMatchObject({
      verdict: 'feasible',
      previousVerdict: 'feasible_with_changes',
    });

    const calls = await staff.get('/api/assessments/calls').expect(200);
    expect(calls.body).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ code: c.call.code, submitted: 2, assessed: 1 }),
      ]),
    );
  });

  it('answers 400 naming the field on bad input and keeps the saved verdict', async () => {
    const c = await makeCallInReview(t, { proposals: 1, compilePdf: false });
    const path = `/api/proposals/${ref(c, 0)}/assessment`;
    await put(staff, 200, path, { verdict: 'not_feasible', note: 'Too far south.' });

    const badVerdict = await put(staff, 400, path, { verdict: 'maybe' });
    expect(badVerdict.body.issues.map((i: { path: string }) => i.path)).toEqual(['verdict']);
    const missing = await put(staff, 400, path, { note: 'no verdict' });
    expect(missing.body.issues.map((i: { path: string }) => i.path)).toEqual(['verdict']);
    const longNote = await put(staff, 400, path, { verdict: 'feasible', note: 'x'.repeat(10_001) });
    expect(longNote.status).toBe(400);
    expect(longNote.body.issues.map((i: { path: string }) => i.path)).toEqual(['note']);
    const notText = await put(staff, 400, path, { verdict: 'feasible', note: 42 });
    expect(notText.body.issues.map((i: { path: string }) => i.path)).toContain('note');

    const after = await staff.get(path).expect(200);
    expect(after.body.assessment).toMatchObject({
      verdict: 'not_feasible',
      note: 'Too far south.',
    });
  });

  it('refuses a verdict before the deadline (409) and for an unknown proposal (404)', async () => {
    const c = await makeCallInReview(t, {
      proposals: 1,
      compilePdf: false,
      status: 'closed',
      call: { deadlineAt: new Date(t.clock.now().getTime() + DAY) },
    });
    const early = await put(staff, 409, `/api/proposals/${ref(c, 0)}/assessment`, {
      verdict: 'feasible',
    });
    expect(early.body.code).toBe('DEADLINE_NOT_PASSED');
    await put(staff, 404, `/api/proposals/ZZNONE-9999/assessment`, { verdict: 'feasible' });
    await staff.get(`/api/calls/NOSUCHCALL/assessments`).expect(404);
  });

  it('lets the call’s chair read but not write; the team reads only once published', async () => {
    const c = await makeCallInReview(t, { proposals: 2, compilePdf: false });
    await moveTarget(c, 1, 150, -30); // same position as proposal 1: an overlap the team must not see
    const path = `/api/proposals/${ref(c, 0)}/assessment`;
    await put(staff, 200, path, { verdict: 'feasible', note: 'Fine as asked.' });

    const chair = await agentFor(t, c.chair);
    const seen = await chair.get(path).expect(200);
    expect(seen.body.assessment.verdict).toBe('feasible');
    expect(seen.body.overlaps).toHaveLength(1);
    await put(chair, 403, path, { verdict: 'not_feasible' });
    await chair.get(`/api/calls/${c.call.code}/assessments`).expect(403);

    const referee = await agentFor(t, c.referees[0]!);
    await referee.get(path).expect(404);

    const pi = await agentFor(t, c.proposals[0]!.pi);
    await pi.get(path).expect(404);
    const otherPi = await agentFor(t, c.proposals[1]!.pi);
    await t.dataSource.query(
      `UPDATE calls SET status = 'published', published_at = now() WHERE id = $1`,
      [c.call.id],
    );
    const published = await pi.get(path).expect(200);
    expect(published.body.assessment).toMatchObject({
      verdict: 'feasible',
      note: 'Fine as asked.',
      assessedBy: null,
    });
    expect(published.body.overlaps).toEqual([]);
    // Another proposal's PI is not on this team.
    await otherPi.get(path).expect(404);
  });

  it('reads a call’s list in the same number of statements for 2 or 8 proposals', async () => {
    const small = await makeCallInReview(t, { proposals: 2, compilePdf: false });
    const large = await makeCallInReview(t, { proposals: 8, compilePdf: false });
    await staff.get(`/api/calls/${small.call.code}/assessments`).expect(200);
    await staff.get(`/api/calls/${large.call.code}/assessments`).expect(200);
    const count = (code: string) => t.statements.maxima.get(`GET /api/calls/${code}/assessments`);
    expect(count(small.call.code)).toBeGreaterThan(0);
    expect(count(large.call.code)).toBe(count(small.call.code));
  });
});
