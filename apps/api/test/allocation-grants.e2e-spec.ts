import { createTestApp, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';
import { agentFor, makeCallInReview, submitReviews } from './support/review-factories.js';

/** The chair's grants: defaults, validation naming the field, the undo, the phase and who may. */
describe('allocation: grants', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const deliberating = async () => {
    const c = await makeCallInReview(t, {
      status: 'deliberation',
      proposals: 2,
      referees: 2,
      hoursAsked: [4, 6],
      compilePdf: false,
    });
    await submitReviews(t, c, [
      [8, 7],
      [5, 4],
    ]);
    return { c, chair: await agentFor(t, c.chair) };
  };
  const grantOf = async (proposalId: string) =>
    (await t.dataSource.query(
      `SELECT g.tier, og.hours FROM proposal_grants g
         LEFT JOIN observation_grants og ON og.proposal_id = g.proposal_id
        WHERE g.proposal_id = $1`,
      [proposalId],
    )) as { tier: string; hours: number | null }[];

  it('grants the hours asked by default, fewer when told, and answers the row as the standing shows it', async () => {
    const { c, chair } = await deliberating();
    const [p1, p2] = c.proposals;
    const full = await chair.put(`/api/proposals/${p1!.proposal.reference}/grant`, {
      tier: 'tier1',
      note: 'Top of the list.',
    });
    expect(full.status).toBe(200);
    expect(full.body.row).toMatchObject({
      reference: p1!.proposal.reference,
      rank: 1,
      tier: 'tier1',
      hoursAsked: 4,
      hoursGranted: 4,
      observations: [{ id: p1!.observation.id, hoursAsked: 4, hoursGranted: 4 }],
    });
    const cut = await chair.put(`/api/proposals/${p2!.proposal.reference}/grant`, {
      tier: 'tier3',
      observations: [{ id: p2!.observation.id, hours: 2.5 }],
    });
    expect(cut.status).toBe(200);
    expect(cut.body.row).toMatchObject({ tier: 'tier3', hoursGranted: 2.5 });
    expect(cut.body.undecided).toEqual([]);
    const config = p1!.observation.configurationId;
    expect(cut.body.row.cumulativeGranted[config]).toBe(6.5);
    expect(
      cut.body.totals.find((x: { configurationId: string }) => x.configurationId === config),
    ).toMatchObject({ hoursGranted: 6.5, hoursAsked: 10 });
    // Not allocated: no hours, and the row counts as decided.
    const none = await chair.put(`/api/proposals/${p2!.proposal.reference}/grant`, {
      tier: 'not_allocated',
    });
    expect(none.body.row).toMatchObject({ tier: 'not_allocated', hoursGranted: 0 });
    expect(await grantOf(p2!.proposal.id)).toEqual([{ tier: 'not_allocated', hours: null }]);

    const audit = (await t.dataSource.query(
      `SELECT action, details FROM audit_events WHERE subject_id = $1 ORDER BY id`,
      [p2!.proposal.id],
    )) as { action: string; details: { before: unknown; after: { tier: string } } }[];
    expect(audit.map((a) => [a.action, a.details.after.tier])).toEqual([
      ['allocation.grant_set', 'tier3'],
      ['allocation.grant_set', 'not_allocated'],
    ]);
    expect(audit[1]!.details.before).toEqual({
      tier: 'tier3',
      hours: { [p2!.observation.id]: 2.5 },
    });
  });

  it('refuses bad hours with a 400 naming the field, and keeps the grant it had', async () => {
    const { c, chair } = await deliberating();
    const p = c.proposals[0]!;
    const path = `/api/proposals/${p.proposal.reference}/grant`;
    expect((await chair.put(path, { tier: 'tier2' })).status).toBe(200);
    const id = p.observation.id;
    const cases: [object, string][] = [
      [{ tier: 'tier1', observations: [{ id, hours: -1 }] }, 'observations.0.hours'],
      [{ tier: 'tier1', observations: [{ id, hours: 'lots' }] }, 'observations.0.hours'],
      [{ tier: 'tier1', observations: [{ id, hours: 4.5 }] }, 'observations.0.hours'],
      [
        { tier: 'tier1', observations: [{ id: c.proposals[1]!.observation.id, hours: 1 }] },
        'observations.0.id',
      ],
      [{ tier: 'tier1', observations: [{ id: 'not-an-id', hours: 1 }] }, 'observations.0.id'],
      [
        {
          tier: 'tier1',
          observations: [
            { id, hours: 1 },
            { id, hours: 2 },
          ],
        },
        'observations.1.id',
      ],
      [{ tier: 'not_allocated', observations: [{ id, hours: 1 }] }, 'observations.0.hours'],
      [{ tier: 'tier1', observations: [{ id, hours: 0 }] }, 'observations'],
      [{ tier: 'tier4' }, 'tier'],
      [{}, 'tier'],
      [{ tier: 'tier1', observations: 'all' }, 'observations'],
    ];
    for (const [body, field] of cases) {
      const res = await chair.put(path, body);
      expect({ body, status: res.status, code: res.body.code }).toEqual({
        body,
        status: 400,
        code: 'VALIDATION_FAILED',
      });
      expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(field);
    }
    expect(await grantOf(p.proposal.id)).toEqual([{ tier: 'tier2', hours: 4 }]);
  });

  it('undoes a grant: the proposal is undecided again, and the undo is audited', async () => {
    const { c, chair } = await deliberating();
    const p = c.proposals[1]!;
    const path = `/api/proposals/${p.proposal.reference}/grant`;
    await chair.put(path, { tier: 'tier2' });
    const undo = await chair.delete(path);
    expect(undo.status).toBe(200);
    expect(undo.body.row).toMatchObject({ tier: null, hoursGranted: null });
    expect(undo.body.undecided).toEqual(c.proposals.map((x) => x.proposal.reference));
    expect(await grantOf(p.proposal.id)).toEqual([]);
    const [event] = (await t.dataSource.query(
      `SELECT details FROM audit_events WHERE subject_id = $1 AND action = 'allocation.grant_cleared'`,
      [p.proposal.id],
    )) as { details: { before: { tier: string } } }[];
    expect(event!.details.before.tier).toBe('tier2');
    // Undoing what is already undecided changes nothing and says so with the same answer.
    expect((await chair.delete(path)).body.row.tier).toBeNull();
  });

  it('is for the call’s own chair, and only while the call is in deliberation', async () => {
    const { c } = await deliberating();
    const path = `/api/proposals/${c.proposals[0]!.proposal.reference}/grant`;
    const staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
    expect((await staff.put(path, { tier: 'tier1' })).status).toBe(403);
    const other = await makeCallInReview(t, { proposals: 1, referees: 0, compilePdf: false });
    const otherChair = await agentFor(t, other.chair);
    expect((await otherChair.put(path, { tier: 'tier1' })).status).toBe(404);
    expect((await otherChair.delete(path)).status).toBe(404);
    const referee = await agentFor(t, c.referees[0]!);
    expect((await referee.put(path, { tier: 'tier1' })).status).toBe(403);
    const pi = await agentFor(t, c.proposals[0]!.pi);
    expect((await pi.put(path, { tier: 'tier1' })).status).toBe(403);

    const inReview = await makeCallInReview(t, { proposals: 1, referees: 0, compilePdf: false });
    const chair = await agentFor(t, inReview.chair);
    const early = await chair.put(
      `/api/proposals/${inReview.proposals[0]!.proposal.reference}/grant`,
      { tier: 'tier1' },
    );
    expect(early.status).toBe(409);
    expect(early.body.code).toBe('CALL_NOT_IN_DELIBERATION');
    expect((await chair.put('/api/proposals/NOPE-0001/grant', { tier: 'tier1' })).status).toBe(404);
  });
});
