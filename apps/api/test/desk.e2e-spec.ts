import { createTestApp, type TestApp } from './support/app.js';
import { createProposal, makeOpenCall, signedIn } from './support/proposal-factories.js';
import { agentFor, assignReview, makeCallInReview } from './support/review-factories.js';

/**
 * The Desk answers each role's section from the tables, only about the user's own work, and keeps
 * the chair's decisions private until the call's outcomes are published.
 */
describe('GET /api/desk', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('answers 401 to a visitor', async () => {
    expect((await t.agent().get('/api/desk')).status).toBe(401);
  });

  it('gives a referee what they owe and a chair the review progress and pressure', async () => {
    const c = await makeCallInReview(t, {
      proposals: 3,
      referees: 2,
      refereesPerProposal: 2,
      hoursAsked: [4, 6, 10],
      compilePdf: false,
    });
    const [r0, r1] = c.referees;
    const [p0, p1, p2] = c.proposals.map((p) => p.proposal);
    await assignReview(t, p0!, r0!, { status: 'submitted', score: 7 });
    const owed = await assignReview(t, p1!, r0!, { status: 'accepted' });
    await assignReview(t, p2!, r0!, { status: 'declined' });
    await assignReview(t, p0!, r1!, { status: 'invited' });

    const referee = await (await agentFor(t, r0!)).get('/api/desk');
    expect(referee.status).toBe(200);
    expect(referee.body.chair).toBeUndefined();
    expect(referee.body.referee.toDo).toEqual([
      expect.objectContaining({
        id: owed.id,
        reference: p1!.reference,
        status: 'accepted',
        dueAt: c.call.reviewDueAt.toISOString(),
        link: { screen: 'review', params: { assignmentId: owed.id } },
      }),
    ]);
    // The declined one does not count; the submitted one is done.
    expect(referee.body.referee.calls).toContainEqual(
      expect.objectContaining({ code: c.call.code, done: 1, total: 2 }),
    );

    const chair = await (await agentFor(t, c.chair)).get('/api/desk');
    expect(chair.status).toBe(200);
    expect(chair.body.referee).toBeUndefined();
    const call = chair.body.chair.calls.find((x: { code: string }) => x.code === c.call.code);
    expect(call).toMatchObject({
      proposals: 3,
      reviewsDone: 1,
      reviewsExpected: 3,
      undecided: 3,
      link: { screen: 'standing', params: { code: c.call.code } },
    });
    const [{ offered }] = await t.dataSource.query(
      `SELECT hours_offered AS offered FROM call_capacities
        WHERE call_id = $1 AND configuration_id = $2`,
      [c.call.id, c.proposals[0]!.observation.configurationId],
    );
    const row = call.pressure.find((x: { hoursOffered: number }) => x.hoursOffered === offered);
    expect(row.hoursAsked).toBe(20);
    expect(row.ratio).toBeCloseTo(20 / offered, 2);
  });

  it('shows a PI their tier only once the outcomes are published, and their progress', async () => {
    const c = await makeCallInReview(t, { proposals: 1, referees: 1, compilePdf: false });
    const { proposal, pi, observation } = c.proposals[0]!;
    await t.dataSource.query(
      `INSERT INTO proposal_grants (proposal_id, tier, decided_by) VALUES ($1, 'tier1', $2)`,
      [proposal.id, c.chair.id],
    );
    await t.dataSource.query(
      `INSERT INTO observation_grants (observation_id, proposal_id, hours) VALUES ($1, $2, 3.5)`,
      [observation.id, proposal.id],
    );
    const agent = await agentFor(t, pi);
    const before = await agent.get('/api/desk');
    const mine = () =>
      (before.body.proposer.submitted as { reference: string; tier: string }[]).find(
        (s) => s.reference === proposal.reference,
      );
    expect(mine()).toMatchObject({ tier: null });
    expect(before.body.proposer.progress).toEqual([]);

    await t.dataSource.query(`UPDATE calls SET published_at = now() WHERE id = $1`, [c.call.id]);
    const after = await agent.get('/api/desk');
    expect(
      after.body.proposer.submitted.find(
        (s: { reference: string }) => s.reference === proposal.reference,
      ),
    ).toMatchObject({ tier: 'tier1' });
    expect(after.body.proposer.progress).toEqual([
      expect.objectContaining({
        reference: proposal.reference,
        hoursGranted: 3.5,
        hoursObtained: 0,
      }),
    ]);
  });

  it('lists a draft with its blockers and the open call with its deadline', async () => {
    const { call } = await makeOpenCall(t.dataSource);
    const { agent } = await signedIn(t);
    const draft = await createProposal(agent, call.code);
    const res = await agent.get('/api/desk');
    expect(res.status).toBe(200);
    expect(res.body.proposer.openCalls).toContainEqual(
      expect.objectContaining({
        code: call.code,
        deadlineAt: call.deadlineAt.toISOString(),
        link: { screen: 'call', params: { code: call.code } },
      }),
    );
    const item = res.body.proposer.drafts.find(
      (d: { reference: string }) => d.reference === draft.reference,
    );
    // A fresh draft has no observations and no science case: the checks say so.
    expect(item.blockers).toBeGreaterThan(0);
    expect(item.blockerMessages.length).toBeGreaterThan(0);
    expect(item.link).toEqual({
      screen: 'proposal',
      params: { reference: draft.reference, section: 'checks' },
    });
    expect(res.body.staff).toBeUndefined();
    expect(res.body.admin).toBeUndefined();
  });

  it('gives staff the assessments waiting and admin the accounts and recent events', async () => {
    const c = await makeCallInReview(t, { proposals: 2, referees: 1, compilePdf: false });
    await t.dataSource.query(
      `INSERT INTO technical_assessments (proposal_id, verdict) VALUES ($1, 'feasible')`,
      [c.proposals[0]!.proposal.id],
    );
    const staff = await signedIn(t, { roles: ['staff'] });
    const res = await staff.agent.get('/api/desk');
    expect(res.status).toBe(200);
    expect(res.body.staff.assessmentsWaiting).toContainEqual({
      callCode: c.call.code,
      waiting: 1,
      link: { screen: 'assessments', params: { code: c.call.code } },
    });
    expect(res.body.staff.calls.map((x: { code: string }) => x.code)).toContain(c.call.code);

    const admin = await signedIn(t, { roles: ['admin'] });
    const a = await admin.agent.get('/api/desk');
    expect(a.body.admin.accounts).toBeGreaterThan(1);
    expect(Array.isArray(a.body.admin.recentEvents)).toBe(true);
    expect(a.body.staff).toBeUndefined();
  });
});
