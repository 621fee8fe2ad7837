import { ProposalMember } from '../src/proposals/entities/proposal-member.entity.js';
import { extractPageTexts } from '../src/documents/pdf-text.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeUser, uniqueEmail } from './support/factories.js';
import { waitForMessages } from './support/mail-sink.js';
import { addCoi, agentFor, assignReview, makeCallInReview } from './support/review-factories.js';

/**
 * Publishing: the 409 with undecided proposals, the confirmed publish and what it changes, one
 * outcome e-mail per person per proposal through the outbox, the team's outcome route and the
 * committee report.
 */
describe('allocation: publish and outcomes', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const outbox = async (address: string) =>
    (await t.dataSource.query(
      `SELECT subject, text FROM outbox_messages WHERE to_address = $1 AND kind = 'allocation.outcome'`,
      [address],
    )) as { subject: string; text: string }[];

  /** Three proposals in deliberation, one Co-I on the first two, reviews with comments. */
  const scenario = async () => {
    const c = await makeCallInReview(t, {
      status: 'deliberation',
      proposals: 3,
      referees: 2,
      hoursAsked: [4, 6, 3],
      compilePdf: false,
    });
    const [p1, p2, p3] = c.proposals;
    const [ref1, ref2] = c.referees;
    const comments: [number, number, number, string][] = [
      [0, 0, 9, 'A compelling case; the mosaic is well justified.'],
      [0, 1, 8, 'Sound; consider a shorter integration per pointing.'],
      [1, 0, 4, 'The line sensitivity looks optimistic.'],
      [1, 1, 5, ''],
      [2, 0, 3, 'Too little detail on calibration.'],
      [2, 1, 2, 'The science goal is unclear.'],
    ];
    for (const [i, j, score, commentToPi] of comments)
      await assignReview(t, c.proposals[i]!.proposal, c.referees[j]!, {
        status: 'submitted',
        score,
        commentToPi,
        commentToCommittee: `Committee only: remark ${i}-${j}`,
      });
    const coi = await makeUser(t.dataSource, { name: 'Shared Coinvestigator' });
    await addCoi(t, p1!.proposal, coi);
    await addCoi(t, p2!.proposal, coi);
    // The third PI's member row keeps the address they were invited with; a pending Co-I
    // invitation went to the address their account has now: the same person, twice on a team.
    const oldAddress = uniqueEmail('old-address');
    await t.dataSource.query(
      `UPDATE proposal_members SET email = $2 WHERE proposal_id = $1 AND role = 'pi'`,
      [p3!.proposal.id, oldAddress],
    );
    await t.dataSource.manager.insert(ProposalMember, {
      proposalId: p3!.proposal.id,
      userId: null,
      email: p3!.pi.email.toLowerCase(),
      role: 'coi',
      canEdit: false,
      invitedById: p3!.pi.id,
      invitedAt: new Date(t.clock.now().getTime() - 86_400_000),
      joinedAt: null,
    });
    return {
      c,
      p1: p1!,
      p2: p2!,
      p3: p3!,
      coi,
      referees: [ref1!, ref2!],
      chair: await agentFor(t, c.chair),
    };
  };

  it('refuses to publish with undecided proposals, naming them, and publishes them as not allocated once confirmed', async () => {
    const s = await scenario();
    const { c, chair, p1, p2, p3 } = s;
    await chair.put(`/api/proposals/${p1.proposal.reference}/grant`, { tier: 'tier1' });
    await chair.put(`/api/proposals/${p2.proposal.reference}/grant`, {
      tier: 'tier2',
      observations: [{ id: p2.observation.id, hours: 3.5 }],
    });
    const path = `/api/calls/${c.call.code}/publish`;

    const refused = await chair.post(path, {});
    expect(refused.status).toBe(409);
    expect(refused.body).toMatchObject({
      statusCode: 409,
      code: 'UNDECIDED_PROPOSALS',
      references: [p3.proposal.reference],
    });
    expect(refused.body.message).toContain(p3.proposal.reference);
    expect((await chair.post(path, { confirm: 'yes' })).body.issues[0].path).toBe('confirm');
    const [still] = (await t.dataSource.query(
      `SELECT status, published_at FROM calls WHERE id = $1`,
      [c.call.id],
    )) as { status: string; published_at: Date | null }[];
    expect(still).toEqual({ status: 'deliberation', published_at: null });
    expect(await outbox(p1.pi.email)).toEqual([]);

    const published = await chair.post(path, { confirm: true });
    expect(published.status).toBe(200);
    // PI 1, PI 2, PI 3 once, the shared Co-I twice.
    expect(published.body).toMatchObject({
      code: c.call.code,
      status: 'published',
      emailsQueued: 5,
      undecidedAsNotAllocated: [p3.proposal.reference],
    });
    const [call] = (await t.dataSource.query(
      `SELECT status, published_at FROM calls WHERE id = $1`,
      [c.call.id],
    )) as { status: string; published_at: Date }[];
    expect(call!.status).toBe('published');
    expect(call!.published_at.toISOString()).toBe(published.body.publishedAt);
    const statuses = (await t.dataSource.query(
      `SELECT p.reference, p.status, g.tier FROM proposals p
         LEFT JOIN proposal_grants g ON g.proposal_id = p.id
        WHERE p.call_id = $1 ORDER BY p.reference`,
      [c.call.id],
    )) as { reference: string; status: string; tier: string }[];
    expect(statuses.map((x) => [x.status, x.tier])).toEqual([
      ['allocated', 'tier1'],
      ['allocated', 'tier2'],
      ['not_allocated', 'not_allocated'],
    ]);
    const events = (await t.dataSource.query(
      `SELECT action, details FROM audit_events WHERE subject_id = $1 ORDER BY id`,
      [c.call.id],
    )) as { action: string; details: Record<string, unknown> }[];
    expect(events.map((e) => e.action)).toEqual(['call.status_changed', 'allocation.published']);
    expect(events[0]!.details).toMatchObject({ from: 'deliberation', to: 'published' });
    expect(events[1]!.details.outcomes).toEqual({
      [p1.proposal.reference]: 'tier1',
      [p2.proposal.reference]: 'tier2',
      [p3.proposal.reference]: 'not_allocated',
    });

    // Once published, nothing about it changes.
    const again = await chair.post(path, { confirm: true });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe('CALL_ALREADY_PUBLISHED');
    const late = await chair.put(`/api/proposals/${p3.proposal.reference}/grant`, {
      tier: 'tier3',
    });
    expect(late.status).toBe(409);
    expect((await chair.delete(`/api/proposals/${p1.proposal.reference}/grant`)).status).toBe(409);
  });

  it('sends each person one outcome e-mail per proposal, with the comments to the PI and no referee names', async () => {
    const s = await scenario();
    const { c, chair, p1, p2, p3, coi, referees } = s;
    await chair.put(`/api/proposals/${p1.proposal.reference}/grant`, { tier: 'tier1' });
    await chair.put(`/api/proposals/${p2.proposal.reference}/grant`, { tier: 'not_allocated' });
    await chair.put(`/api/proposals/${p3.proposal.reference}/grant`, {
      tier: 'tier3',
      observations: [{ id: p3.observation.id, hours: 1.5 }],
    });
    expect((await chair.post(`/api/calls/${c.call.code}/publish`, {})).status).toBe(200);

    expect(await outbox(p1.pi.email)).toHaveLength(1);
    expect(await outbox(p2.pi.email)).toHaveLength(1);
    // PI and (pending) Co-I of the same proposal: one e-mail.
    expect(await outbox(p3.pi.email.toLowerCase())).toHaveLength(1);
    // Co-I of two proposals: one e-mail for each.
    const coiMail = await outbox(coi.email);
    expect(coiMail.map((m) => m.subject).sort()).toEqual(
      [
        `Outcome of proposal ${p1.proposal.reference}: Tier 1`,
        `Outcome of proposal ${p2.proposal.reference}: not allocated`,
      ].sort(),
    );

    const [delivered] = await waitForMessages(p1.pi.email, 1);
    const text = delivered!.text!;
    expect(text).toContain('Tier 1 (will be scheduled), with 4 h granted of the 4 h asked');
    expect(text).toContain('A compelling case; the mosaic is well justified.');
    expect(text).toContain('Sound; consider a shorter integration per pointing.');
    expect(text).not.toContain('Committee only');
    for (const r of referees) expect(text).not.toContain(r.name);
    expect(text).toContain(`/proposals/${p1.proposal.reference}`);

    const [third] = await waitForMessages(p3.pi.email.toLowerCase(), 1);
    expect(third!.text).toContain('Tier 3 (filler), with 1.5 h granted of the 3 h asked');
    const both = await waitForMessages(coi.email, 2);
    const refused = both.find((m) => m.subject.includes(p2.proposal.reference))!;
    expect(refused.text).toContain('could not allocate time');
    // An empty comment is left out, the others kept.
    expect(refused.text).toContain('The line sensitivity looks optimistic.');
    expect(refused.text).toContain('comments to the PI (1)');
  });

  it('shows the outcome to the team only, and only once the call is published', async () => {
    const s = await scenario();
    const { c, chair, p1, p2, coi, referees } = s;
    const path = `/api/proposals/${p1.proposal.reference}/outcome`;
    const pi = await agentFor(t, p1.pi);
    const before = await pi.get(path);
    expect(before.status).toBe(404);
    expect(before.body.code).toBe('OUTCOME_NOT_PUBLISHED');

    await chair.put(`/api/proposals/${p1.proposal.reference}/grant`, {
      tier: 'tier2',
      observations: [{ id: p1.observation.id, hours: 3 }],
    });
    await chair.post(`/api/calls/${c.call.code}/publish`, { confirm: true });

    const res = await pi.get(path);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      reference: p1.proposal.reference,
      callCode: c.call.code,
      tier: 'tier2',
      hoursGranted: 3,
      observations: [
        {
          id: p1.observation.id,
          targetName: p1.target.name,
          configurationName: c.array.configurations[0]!.name,
          bandName: c.array.bands[0]!.name,
          hoursAsked: 4,
          hoursGranted: 3,
        },
      ],
    });
    expect([...res.body.comments].sort()).toEqual(
      [
        'A compelling case; the mosaic is well justified.',
        'Sound; consider a shorter integration per pointing.',
      ].sort(),
    );
    expect(JSON.stringify(res.body)).not.toContain(referees[0]!.name);
    expect((await (await agentFor(t, coi)).get(path)).status).toBe(200);
    const undecided = await (
      await agentFor(t, p2.pi)
    ).get(`/api/proposals/${p2.proposal.reference}/outcome`);
    expect(undecided.body).toMatchObject({ tier: 'not_allocated', hoursGranted: 0 });
    expect(undecided.body.observations[0].hoursGranted).toBe(0);

    // Not the team: the chair, a referee, staff, a stranger: 404 as for the proposal itself.
    expect((await chair.get(path)).status).toBe(404);
    expect((await (await agentFor(t, referees[0]!)).get(path)).status).toBe(404);
    const staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
    expect((await staff.get(path)).status).toBe(404);
    expect((await (await agentFor(t, await makeUser(t.dataSource))).get(path)).status).toBe(404);
    expect((await t.agent().get(path)).status).toBe(401);
  });

  it('publishes only for the call’s chair', async () => {
    const c = await makeCallInReview(t, {
      status: 'deliberation',
      proposals: 1,
      referees: 0,
      compilePdf: false,
    });
    const path = `/api/calls/${c.call.code}/publish`;
    const staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
    expect((await staff.post(path, { confirm: true })).status).toBe(403);
    const other = await makeCallInReview(t, { proposals: 1, referees: 0, compilePdf: false });
    expect((await (await agentFor(t, other.chair)).post(path, { confirm: true })).status).toBe(404);
    const chair = await agentFor(t, other.chair);
    const early = await chair.post(`/api/calls/${other.call.code}/publish`, { confirm: true });
    expect(early.status).toBe(409);
    expect(early.body.code).toBe('CALL_NOT_IN_DELIBERATION');
  });

  it('makes the committee report: a PDF whose text holds the ranked references in rank order', async () => {
    const s = await scenario();
    const { c, chair, p1, p2, p3 } = s;
    await chair.put(`/api/proposals/${p1.proposal.reference}/grant`, { tier: 'tier1' });
    const res = await chair
      .get(`/api/calls/${c.call.code}/report.pdf`)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (d: Buffer) => chunks.push(d));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = (await extractPageTexts(new Uint8Array(bytes), 10_000)).join('\n');
    expect(text).toContain(`${c.call.code} — ${c.call.title}`);
    const at = [p1, p2, p3].map((p) => text.indexOf(p.proposal.reference));
    for (const i of at) expect(i).toBeGreaterThanOrEqual(0);
    // Ranked by the reviews: 9 and 8, then 4 and 5, then 3 and 2.
    expect(at[0]!).toBeLessThan(at[1]!);
    expect(at[1]!).toBeLessThan(at[2]!);
    expect(text).toContain('Tier 1');
    expect(text).toContain('undecided');
    const staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
    expect((await staff.get(`/api/calls/${c.call.code}/report.pdf`)).status).toBe(200);
    expect(
      (await (await agentFor(t, p1.pi)).get(`/api/calls/${c.call.code}/report.pdf`)).status,
    ).toBe(403);
  });
});
