import ICAL from 'ical.js';
import { createTestApp, type TestApp } from './support/app.js';
import { messagesTo, waitForMessages } from './support/mail-sink.js';
import { insertRun, joinTeam, makePlanCall } from './support/plan-factories.js';
import { agentFor } from './support/review-factories.js';
import { makeUser } from './support/factories.js';

describe('plan: progress, completion and the private calendar feed', () => {
  let t: TestApp;
  let staff: Awaited<ReturnType<typeof agentFor>>;

  beforeAll(async () => {
    t = await createTestApp();
    staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
  });
  afterAll(() => t.close());

  it('shows the team granted, observed and remaining hours, completes the proposal and e-mails the team once', async () => {
    const c = await makePlanCall(t, { proposals: 1, hours: [3] });
    const p = c.proposals[0]!;
    const coi = await makeUser(t.dataSource);
    await joinTeam(t, p.proposal.id, coi);
    const a = await insertRun(t, c, { hours: 2 });
    const b = await insertRun(t, c, { hours: 2 });
    const pi = await agentFor(t, p.pi);
    const path = `/api/proposals/${p.proposal.reference}/progress`;

    const before = await pi.get(path);
    expect(before.status).toBe(200);
    expect(before.body).toMatchObject({
      published: true,
      tier: 'tier1',
      totals: { grantedHours: 3, observedHours: 0, remainingHours: 3 },
    });
    expect(before.body.observations[0]).toMatchObject({ grantedHours: 3, plannedHours: 4 });

    const tooMuch = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      status: 'observed',
      hoursObtained: 2.5,
    });
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.issues[0].path).toBe('hoursObtained');

    const first = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      status: 'observed',
      hoursObtained: 2,
      qualityNote: 'Clean data, some RFI at the band edge',
    });
    expect(first.status).toBe(200);
    const mid = (await pi.get(path)).body;
    expect(mid).toMatchObject({
      status: 'in_progress',
      completedAt: null,
      totals: { grantedHours: 3, observedHours: 2, remainingHours: 1 },
    });

    const second = await staff.patch(`/api/runs/${b.id}`, {
      version: 1,
      status: 'observed',
      hoursObtained: 1.5,
    });
    expect(second.status).toBe(200);
    const done = (await pi.get(path)).body;
    expect(done.status).toBe('completed');
    expect(done.completedAt).not.toBeNull();
    expect(done.totals).toEqual({ grantedHours: 3, observedHours: 3.5, remainingHours: 0 });

    const [mail] = await waitForMessages(p.pi.email, 1);
    expect(mail!.subject).toBe(`Observations of ${p.proposal.reference} are complete`);
    await waitForMessages(coi.email, 1);
    // Recording the same run again does not complete (nor e-mail) a second time.
    const again = await staff.patch(`/api/runs/${b.id}`, {
      version: second.body.version,
      status: 'observed',
      hoursObtained: 2,
    });
    expect(again.status).toBe(200);
    await new Promise((r) => setTimeout(r, 1500));
    expect(await messagesTo(p.pi.email)).toHaveLength(1);
    const outbox = await t.dataSource.query(
      `SELECT count(*)::int AS n FROM outbox_messages WHERE kind = 'plan.proposal_completed' AND to_address = $1`,
      [p.pi.email],
    );
    expect(outbox[0].n).toBe(1);
  });

  it('shows nothing of the grants before the call is published, and nothing to outsiders', async () => {
    const c = await makePlanCall(t, { proposals: 1, published: false });
    const p = c.proposals[0]!;
    const res = await (
      await agentFor(t, p.pi)
    ).get(`/api/proposals/${p.proposal.reference}/progress`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ published: false, tier: null, observations: [], runs: [] });
    const outsider = await agentFor(t, await makeUser(t.dataSource));
    expect((await outsider.get(`/api/proposals/${p.proposal.reference}/progress`)).status).toBe(
      404,
    );
  });

  it('gives each person a private feed of only their runs, and a rotated link stops the old one', async () => {
    const c = await makePlanCall(t, { proposals: 2 });
    const mine = await insertRun(t, c, { proposal: 0 });
    const theirs = await insertRun(t, c, { proposal: 1 });
    const pi = await agentFor(t, c.proposals[0]!.pi);
    const created = await pi.post('/api/me/calendar-feed');
    expect(created.status).toBe(201);
    const url = new URL(created.body.url as string);
    expect(url.pathname).toMatch(/^\/api\/calendar\/[A-Za-z0-9_-]{43}\.ics$/);
    // Only the hash is stored.
    const token = url.pathname
      .split('/')
      .at(-1)!
      .replace(/\.ics$/, '');
    const stored = await t.dataSource.query(
      `SELECT token_sha256 FROM calendar_feeds WHERE user_id = $1`,
      [c.proposals[0]!.pi.id],
    );
    expect(stored[0].token_sha256).not.toContain(token);

    const feed = await t.agent().get(url.pathname);
    expect(feed.status).toBe(200);
    expect(feed.headers['content-type']).toMatch(/^text\/calendar/);
    const events = new ICAL.Component(ICAL.parse(feed.text) as unknown[])
      .getAllSubcomponents('vevent')
      .map((v) => new ICAL.Event(v));
    expect(events.map((e) => e.uid.split('@')[0])).toEqual([mine.id]);
    expect(events[0]!.startDate.toJSDate().toISOString()).toBe(mine.startsAt.toISOString());
    expect(feed.text).not.toContain(theirs.id);

    const rotated = await pi.post('/api/me/calendar-feed');
    expect(rotated.body.url).not.toBe(created.body.url);
    expect((await t.agent().get(url.pathname)).status).toBe(404);
    expect((await t.agent().get(new URL(rotated.body.url as string).pathname)).status).toBe(200);
    expect((await t.agent().get(`/api/calendar/${'B'.repeat(43)}.ics`)).status).toBe(404);
    expect((await t.agent().get(`/api/calendar/short.ics`)).status).toBe(404);
  });
});
