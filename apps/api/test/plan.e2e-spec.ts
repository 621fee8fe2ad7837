import ICAL from 'ical.js';
import nodeIcal from 'node-ical';
import { createTestApp, type TestApp } from './support/app.js';
import { insertRun, makeChairOf, makePlanCall } from './support/plan-factories.js';
import { agentFor } from './support/review-factories.js';
import { makeUser } from './support/factories.js';

interface Run {
  id: string;
  startsAt: string;
  endsAt: string;
  hours: number;
  status: string;
  locked: boolean;
  version: number;
  proposal: { reference: string };
  observation: { id: string };
  tier: string;
}

const DAY = 86_400_000;

describe('plan: generate, runs and exports', () => {
  let t: TestApp;
  let staff: Awaited<ReturnType<typeof agentFor>>;

  beforeAll(async () => {
    t = await createTestApp();
    staff = await agentFor(t, await makeUser(t.dataSource, { roles: ['staff'] }));
  });
  afterAll(() => t.close());

  it('generates runs inside the configuration’s dates, without overlap, tier 1 first, within the grants', async () => {
    const c = await makePlanCall(t, {
      proposals: 3,
      hours: [4, 3, 2],
      tiers: ['tier2', 'tier1', 'not_allocated'],
      days: 3,
    });
    const res = await staff.post(`/api/calls/${c.call.code}/plan/generate`);
    expect(res.status).toBe(200);
    const runs = res.body.runs as Run[];
    expect(runs.length).toBeGreaterThan(0);
    const from = Date.parse(`${c.period.start}T00:00:00Z`);
    const to = Date.parse(`${c.period.end}T00:00:00Z`) + DAY;
    for (const r of runs) {
      expect(Date.parse(r.startsAt)).toBeGreaterThanOrEqual(from);
      expect(Date.parse(r.endsAt)).toBeLessThanOrEqual(to);
      expect(Date.parse(r.endsAt)).toBeGreaterThan(Date.parse(r.startsAt));
    }
    const sorted = [...runs].sort((a, b) => a.startsAt.localeCompare(b.startsAt));
    for (let i = 1; i < sorted.length; i++)
      expect(Date.parse(sorted[i]!.startsAt)).toBeGreaterThanOrEqual(
        Date.parse(sorted[i - 1]!.endsAt),
      );
    const hoursOf = (ref: string) =>
      runs.filter((r) => r.proposal.reference === ref).reduce((s, r) => s + r.hours, 0);
    // Granted hours fit easily into three days of a target up ~12 h a day: all of it is planned,
    // never more; the not-allocated proposal gets nothing.
    expect(hoursOf(c.proposals[0]!.proposal.reference)).toBeCloseTo(4, 6);
    expect(hoursOf(c.proposals[1]!.proposal.reference)).toBeCloseTo(3, 6);
    expect(hoursOf(c.proposals[2]!.proposal.reference)).toBe(0);
    // Tier 1 (proposal 2) takes the earliest time.
    expect(sorted[0]!.proposal.reference).toBe(c.proposals[1]!.proposal.reference);
    expect(res.body.totals).toEqual([
      { tier: 'tier1', granted: 3, planned: 3, observed: 0 },
      { tier: 'tier2', granted: 4, planned: 4, observed: 0 },
      { tier: 'tier3', granted: 0, planned: 0, observed: 0 },
    ]);
    expect(res.body.unplaced).toEqual([]);
    expect(res.body.periods).toEqual([
      expect.objectContaining({ start: c.period.start, end: c.period.end }),
    ]);
    // LST pressure: the granted hours spread over 24 bins sum to what was granted.
    const bins = res.body.lstPressure as { granted: number; planned: number }[];
    expect(bins).toHaveLength(24);
    expect(bins.reduce((s, b) => s + b.granted, 0)).toBeCloseTo(7, 2);
    expect(bins.reduce((s, b) => s + b.planned, 0)).toBeCloseTo(7, 2);
    // Nothing overlaps in the whole database either (the exclusion constraint holds).
    const [{ n }] = await t.dataSource.query(
      `SELECT count(*)::int AS n FROM runs a JOIN runs b ON a.id < b.id
        AND tstzrange(a.starts_at, a.ends_at) && tstzrange(b.starts_at, b.ends_at)
        WHERE a.call_id = $1 OR b.call_id = $1`,
      [c.call.id],
    );
    expect(n).toBe(0);
    const audit = await t.dataSource.query(
      `SELECT details FROM audit_events WHERE action = 'plan.generated' AND subject_id = $1`,
      [c.call.id],
    );
    expect(audit).toHaveLength(1);
  });

  it('keeps locked and recorded runs when generating again and replaces the rest', async () => {
    const c = await makePlanCall(t, { proposals: 2, hours: [3, 2], days: 3 });
    const first = (await staff.post(`/api/calls/${c.call.code}/plan/generate`)).body.runs as Run[];
    const locked = first[0]!;
    const lock = await staff.patch(`/api/runs/${locked.id}`, { version: 1, locked: true });
    expect(lock.status).toBe(200);
    expect(lock.body).toMatchObject({ locked: true, version: 2 });
    const again = await staff.post(`/api/calls/${c.call.code}/plan/generate`);
    expect(again.status).toBe(200);
    const runs = again.body.runs as Run[];
    expect(runs.find((r) => r.id === locked.id)).toMatchObject({
      startsAt: locked.startsAt,
      locked: true,
    });
    const unlockedIds = first.filter((r) => r.id !== locked.id).map((r) => r.id);
    for (const id of unlockedIds) expect(runs.some((r) => r.id === id)).toBe(false);
    // The locked run counts for its observation: nothing more than the grant is planned.
    const total = runs.reduce((s, r) => s + r.hours, 0);
    expect(total).toBeCloseTo(5, 6);
  });

  it('refuses a plan for a call not published yet, and bad settings field by field', async () => {
    const c = await makePlanCall(t, { proposals: 1, published: false });
    const res = await staff.post(`/api/calls/${c.call.code}/plan/generate`);
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('CALL_NOT_PUBLISHED');
    const p = await makePlanCall(t, { proposals: 1 });
    const bad = await staff.put(`/api/calls/${p.call.code}/plan/settings`, {
      maintenanceStartHour: 24,
      maintenanceHours: 2,
      weatherReserve: 1.5,
    });
    expect(bad.status).toBe(400);
    expect((bad.body.issues as { path: string }[]).map((i) => i.path).sort()).toEqual([
      'maintenanceStartHour',
      'weatherReserve',
    ]);
    const ok = await staff.put(`/api/calls/${p.call.code}/plan/settings`, {
      maintenanceStartHour: 10,
      maintenanceHours: 3,
      weatherReserve: 0.2,
    });
    expect(ok.status).toBe(200);
    expect(ok.body.settings).toMatchObject({
      maintenanceStartHour: 10,
      maintenanceHours: 3,
      weatherReserve: 0.2,
    });
    expect((await staff.get('/api/calls/NOSUCHCALL/plan')).status).toBe(404);
  });

  it('applies the maintenance window in the site’s zone', async () => {
    const c = await makePlanCall(t, { proposals: 2, hours: [8, 8], days: 3 });
    // Africa/Johannesburg is UTC+2 all year: maintenance 08:00–14:00 local is 06:00–12:00 UTC.
    await staff.put(`/api/calls/${c.call.code}/plan/settings`, {
      maintenanceStartHour: 8,
      maintenanceHours: 6,
      weatherReserve: 0,
    });
    const runs = (await staff.post(`/api/calls/${c.call.code}/plan/generate`)).body.runs as Run[];
    expect(runs.length).toBeGreaterThan(0);
    for (const r of runs) {
      const s = Date.parse(r.startsAt);
      const e = Date.parse(r.endsAt);
      for (let day = Date.parse(`${c.period.start}T00:00:00Z`) - DAY; day < e; day += DAY) {
        const mFrom = day + 6 * 3_600_000;
        const mTo = day + 12 * 3_600_000;
        expect(s < mTo && e > mFrom).toBe(false);
      }
    }
  });

  it('moves a run, and answers 409 naming the other run for a move into a clash', async () => {
    const c = await makePlanCall(t, { proposals: 2 });
    const a = await insertRun(t, c, { proposal: 0 });
    const b = await insertRun(t, c, { proposal: 1 });
    const clash = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      startsAt: new Date(b.startsAt.getTime() + 30 * 60_000).toISOString(),
      endsAt: new Date(b.endsAt.getTime() + 30 * 60_000).toISOString(),
    });
    expect(clash.status).toBe(409);
    expect(clash.body.code).toBe('RUN_CLASH');
    expect(clash.body.message).toContain(c.proposals[1]!.proposal.reference);
    // Nothing changed.
    const [row] = await t.dataSource.query(`SELECT starts_at, version FROM runs WHERE id = $1`, [
      a.id,
    ]);
    expect(row).toEqual({ starts_at: a.startsAt, version: 1 });
    const backwards = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      startsAt: a.endsAt.toISOString(),
      endsAt: a.startsAt.toISOString(),
    });
    expect(backwards.status).toBe(400);
    expect(backwards.body.issues[0].path).toBe('endsAt');
    const noZone = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      startsAt: '2067-01-01T10:00:00',
      endsAt: '2067-01-01T11:00:00',
    });
    expect(noZone.status).toBe(400);
    expect(noZone.body.issues.map((i: { path: string }) => i.path)).toContain('startsAt');
    const earlier = new Date(a.startsAt.getTime() - 10 * 60_000);
    const moved = await staff.patch(`/api/runs/${a.id}`, {
      version: 1,
      startsAt: earlier.toISOString(),
      endsAt: a.endsAt.toISOString(),
    });
    // The ten minutes before may be taken by another file's run: then 409, never a 500.
    expect([200, 409]).toContain(moved.status);
    if (moved.status === 200) {
      expect(moved.body).toMatchObject({ startsAt: earlier.toISOString(), version: 2 });
      const stale = await staff.patch(`/api/runs/${a.id}`, { version: 1, locked: true });
      expect(stale.status).toBe(409);
      expect(stale.body.code).toBe('STALE_VERSION');
    }
    expect((await staff.patch(`/api/runs/not-a-uuid`, { version: 1 })).status).toBe(404);
  });

  it('splits a run in two and deletes a planned run, but not a recorded one', async () => {
    const c = await makePlanCall(t, { proposals: 1 });
    const run = await insertRun(t, c, { hours: 2 });
    const at = new Date(run.startsAt.getTime() + 45 * 60_000).toISOString();
    const outside = await staff.post(`/api/runs/${run.id}/split`, {
      version: 1,
      at: run.endsAt.toISOString(),
    });
    expect(outside.status).toBe(400);
    expect(outside.body.issues[0].path).toBe('at');
    const split = await staff.post(`/api/runs/${run.id}/split`, { version: 1, at });
    expect(split.status).toBe(200);
    expect(split.body).toEqual([
      expect.objectContaining({ id: run.id, startsAt: run.startsAt.toISOString(), endsAt: at }),
      expect.objectContaining({ startsAt: at, endsAt: run.endsAt.toISOString() }),
    ]);
    const second = split.body[1] as Run;
    const record = await staff.patch(`/api/runs/${second.id}`, {
      version: second.version,
      status: 'lost',
      lostReason: 'weather',
    });
    expect(record.status).toBe(200);
    expect(record.body).toMatchObject({ status: 'lost', lostReason: 'weather' });
    expect((await staff.delete(`/api/runs/${second.id}`)).status).toBe(409);
    expect((await staff.delete(`/api/runs/${run.id}`)).status).toBe(204);
    expect((await staff.delete(`/api/runs/${run.id}`)).status).toBe(404);
    const lostWithout = await staff.patch(`/api/runs/${second.id}`, {
      version: record.body.version,
      status: 'lost',
    });
    expect(lostWithout.status).toBe(400);
    expect(lostWithout.body.issues[0].path).toBe('lostReason');
  });

  it('exports plan.ics that node-ical and ical.js both read as the same runs', async () => {
    const c = await makePlanCall(t, { proposals: 2, hours: [3, 2], days: 2 });
    const plan = (await staff.post(`/api/calls/${c.call.code}/plan/generate`)).body as {
      runs: Run[];
    };
    const res = await staff.get(`/api/calls/${c.call.code}/plan.ics`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const text = res.text;
    expect(text).toContain(`X-WR-TIMEZONE:${c.array.observatory.timeZone}`);
    const expected = plan.runs
      .map((r) => ({ uid: r.id, start: r.startsAt, end: r.endsAt }))
      .sort((a, b) => a.start.localeCompare(b.start));

    const parsed = nodeIcal.sync.parseICS(text);
    const fromNodeIcal = Object.values(parsed)
      .filter((v) => v.type === 'VEVENT')
      .map((v) => {
        const e = v as nodeIcal.VEvent;
        return {
          uid: String(e.uid).split('@')[0],
          start: new Date(e.start).toISOString(),
          end: new Date(e.end!).toISOString(),
        };
      })
      .sort((a, b) => a.start.localeCompare(b.start));

    const component = new ICAL.Component(ICAL.parse(text) as unknown[]);
    const fromIcalJs = component
      .getAllSubcomponents('vevent')
      .map((v) => {
        const e = new ICAL.Event(v);
        return {
          uid: e.uid.split('@')[0],
          start: e.startDate.toJSDate().toISOString(),
          end: e.endDate.toJSDate().toISOString(),
        };
      })
      .sort((a, b) => a.start.localeCompare(b.start));

    expect(fromNodeIcal).toEqual(expected);
    expect(fromIcalJs).toEqual(expected);
  });

  it('exports runs.csv with formula-looking text defused', async () => {
    const c = await makePlanCall(t, { proposals: 1, days: 2 });
    await t.dataSource.query(`UPDATE proposal_targets SET name = $2 WHERE id = $1`, [
      c.proposals[0]!.target.id,
      '=HYPERLINK("http://example.org")',
    ]);
    await staff.post(`/api/calls/${c.call.code}/plan/generate`);
    const res = await staff.get(`/api/calls/${c.call.code}/runs.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toContain('start UTC');
    expect(lines.length).toBeGreaterThan(1);
    expect(lines[1]).toContain(`"'=HYPERLINK(""http://example.org"")"`);
    expect(lines[1]).not.toMatch(/,=HYPERLINK/);
  });

  it('lets the call’s chair read the plan but not change it', async () => {
    const c = await makePlanCall(t, { proposals: 1 });
    const chair = await agentFor(t, c.chair);
    expect((await chair.get(`/api/calls/${c.call.code}/plan`)).status).toBe(200);
    expect((await chair.post(`/api/calls/${c.call.code}/plan/generate`)).status).toBe(403);
    const other = await makeUser(t.dataSource);
    const d = await makePlanCall(t, { proposals: 1 });
    await makeChairOf(t, other, d.call.id);
    const otherChair = await agentFor(t, other);
    expect((await otherChair.get(`/api/calls/${c.call.code}/plan`)).status).toBe(404);
    const list = await otherChair.get('/api/plans');
    expect(list.status).toBe(200);
    expect((list.body as { code: string }[]).map((x) => x.code)).toEqual([d.call.code]);
  });

  it('answers the plan in a fixed number of statements however many runs', async () => {
    const c = await makePlanCall(t, { proposals: 6, hours: [2, 2, 2, 2, 2, 2], days: 4 });
    await staff.post(`/api/calls/${c.call.code}/plan/generate`);
    const res = await staff.get(`/api/calls/${c.call.code}/plan`);
    expect(res.status).toBe(200);
    expect((res.body.runs as Run[]).length).toBeGreaterThanOrEqual(6);
    const max = t.statements.maxima.get(`GET /api/calls/${c.call.code}/plan`);
    expect(max).toBeLessThanOrEqual(12);
  });
});
