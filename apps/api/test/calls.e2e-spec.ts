import { DateTime } from 'luxon';
import { AuditEvent } from '../src/audit/audit-event.entity.js';
import { CallDeadlineJob } from '../src/calls/call-deadline.job.js';
import { CallSubscribers } from '../src/calls/call-subscribers.js';
import { assertOpenForSubmission, CallsService } from '../src/calls/calls.service.js';
import { Call } from '../src/calls/entities/call.entity.js';
import { GrantedCallRole } from '../src/calls/entities/call-role.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import {
  makeCall,
  makeObservatory,
  type TestObservatory,
  uniqueCode,
} from './support/calls-factories.js';
import { makeUser, TEST_PASSWORD, uniqueEmail } from './support/factories.js';
import { waitForMessages } from './support/mail-sink.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const LA = 'America/Los_Angeles';

describe('calls', () => {
  let t: TestApp;
  let staff: TestAgent;
  let proposer: TestAgent;
  let array: TestObservatory;

  beforeAll(async () => {
    t = await createTestApp();
    const staffUser = await makeUser(t.dataSource, { roles: ['staff'] });
    const proposerUser = await makeUser(t.dataSource);
    staff = t.agent();
    proposer = t.agent();
    expect((await staff.signIn(staffUser.email, TEST_PASSWORD)).status).toBe(200);
    expect((await proposer.signIn(proposerUser.email, TEST_PASSWORD)).status).toBe(200);
    array = await makeObservatory(t.dataSource);
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  const iso = (ms: number) => new Date(ms).toISOString();
  const newCall = (over: Record<string, unknown> = {}) => {
    const now = t.clock.now().getTime();
    return {
      code: uniqueCode(),
      observatoryId: array.observatory.id,
      title: 'A call made by the tests',
      timeZone: LA,
      opensAt: iso(now - HOUR),
      deadlineAt: iso(now + 10 * DAY),
      reviewDueAt: iso(now + 40 * DAY),
      capacity: [{ configurationId: array.configurations[0]?.id, hours: 200 }],
      scienceCasePageLimit: 4,
      scienceCaseMaxMb: 10,
      proposalKinds: ['standard', 'target_of_opportunity'],
      maxHoursPerProposal: 50,
      ...over,
    };
  };
  const create = async (over: Record<string, unknown> = {}) => {
    const res = await staff.post('/api/calls', newCall(over));
    expect(res.status).toBe(201);
    return res.body as { code: string; status: string; deadlineAt: string };
  };
  const move = (code: string, to: string) => staff.post(`/api/calls/${code}/transition`, { to });
  const storedStatus = async (code: string) =>
    (await t.dataSource.getRepository(Call).findOneByOrFail({ code })).status;

  describe('rights', () => {
    it('lets staff create a call, and refuses a proposer (403) and a visitor (401)', async () => {
      const created = await create();
      expect(created.status).toBe('planned');
      expect((await proposer.post('/api/calls', newCall())).status).toBe(403);
      expect((await t.agent().post('/api/calls', newCall())).status).toBe(401);
    });

    it('lets only staff edit or move a call', async () => {
      const { code } = await create();
      expect((await proposer.patch(`/api/calls/${code}`, { title: 'Mine now' })).status).toBe(403);
      expect((await proposer.post(`/api/calls/${code}/transition`, { to: 'open' })).status).toBe(
        403,
      );
      const edited = await staff.patch(`/api/calls/${code}`, { title: 'Renamed by staff' });
      expect(edited.status).toBe(200);
      expect(edited.body.title).toBe('Renamed by staff');
    });

    it('hides a planned call from everyone but staff (404), and shows an open one to visitors', async () => {
      const { code } = await create();
      expect((await t.agent().get(`/api/calls/${code}`)).status).toBe(404);
      expect((await proposer.get(`/api/calls/${code}`)).status).toBe(404);
      expect((await staff.get(`/api/calls/${code}`)).status).toBe(200);
      expect((await move(code, 'open')).status).toBe(200);
      const read = await t.agent().get(`/api/calls/${code.toLowerCase()}`);
      expect(read.status).toBe(200);
      expect(read.body).toMatchObject({
        code,
        status: 'open',
        acceptingSubmissions: true,
        timeZone: LA,
        observatory: { id: array.observatory.id, name: array.observatory.name },
        capacity: [{ configurationName: 'short', hours: 200, longestBaselineM: 400 }],
        totalHours: 200,
      });
    });
  });

  describe('validation', () => {
    it('names each bad field in a 400', async () => {
      const res = await staff.post(
        '/api/calls',
        newCall({
          code: 'x',
          timeZone: 'Mars/Olympus_Mons',
          deadlineAt: '2027-01-15T17:00:00',
          capacity: [{ configurationId: array.configurations[0]?.id, hours: -1 }],
          proposalKinds: ['standard', 'whatever'],
          scienceCasePageLimit: 0,
        }),
      );
      expect(res.status).toBe(400);
      const paths = new Set(res.body.issues.map((i: { path: string }) => i.path));
      expect(paths).toEqual(
        new Set([
          'code',
          'timeZone',
          'deadlineAt',
          'capacity.0.hours',
          'proposalKinds',
          'scienceCasePageLimit',
        ]),
      );
    });

    it('refuses a deadline in the past, and dates out of order', async () => {
      const now = t.clock.now().getTime();
      const past = await staff.post('/api/calls', newCall({ deadlineAt: iso(now - 1000) }));
      expect(past.status).toBe(400);
      expect(past.body.issues).toContainEqual({
        path: 'deadlineAt',
        message: 'deadlineAt must be in the future',
      });
      const order = await staff.post(
        '/api/calls',
        newCall({ reviewDueAt: iso(now + 5 * DAY), deadlineAt: iso(now + 6 * DAY) }),
      );
      expect(order.status).toBe(400);
      expect(order.body.issues.map((i: { path: string }) => i.path)).toEqual(['reviewDueAt']);
    });

    it('refuses a configuration of another observatory, and a code already used', async () => {
      const other = await makeObservatory(t.dataSource);
      const res = await staff.post(
        '/api/calls',
        newCall({ capacity: [{ configurationId: other.configurations[0]?.id, hours: 10 }] }),
      );
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('capacity.0.configurationId');
      const { code } = await create();
      const again = await staff.post('/api/calls', newCall({ code: code.toLowerCase() }));
      expect(again.status).toBe(400);
      expect(again.body.issues[0].path).toBe('code');
    });
  });

  describe('lifecycle', () => {
    it('runs planned → open → (deadline) closed → in review → deliberation → published → archived', async () => {
      const { code, deadlineAt } = await create();
      expect((await move(code, 'open')).body.status).toBe('open');

      const early = await move(code, 'closed');
      expect(early.status).toBe(409);
      expect(early.body.code).toBe('CALL_DEADLINE_NOT_REACHED');

      t.clock.set(new Date(new Date(deadlineAt).getTime() + 1000));
      const after = await t.agent().get(`/api/calls/${code}`);
      expect(after.body).toMatchObject({ status: 'closed', nextStatus: 'in_review' });

      for (const to of ['in_review', 'deliberation']) {
        const res = await move(code, to);
        expect(res.status).toBe(200);
        expect(res.body.status).toBe(to);
      }
      // Publishing sends the outcomes: only the call's chair does it, from the standing.
      const direct = await move(code, 'published');
      expect(direct.status).toBe(409);
      expect(direct.body.code).toBe('CALL_PUBLISHED_BY_CHAIR');
      const chair = await makeUser(t.dataSource);
      const call = await t.dataSource.getRepository(Call).findOneByOrFail({ code });
      await t.dataSource.manager.insert(GrantedCallRole, {
        userId: chair.id,
        callId: call.id,
        role: 'chair',
        grantedAt: new Date(),
      });
      const chairAgent = t.agent();
      expect((await chairAgent.signIn(chair.email, TEST_PASSWORD)).status).toBe(200);
      const published = await chairAgent.post(`/api/calls/${code}/publish`, {});
      expect(published.status).toBe(200);
      expect(published.body.status).toBe('published');
      const archived = await move(code, 'archived');
      expect(archived.status).toBe(200);
      expect(archived.body.status).toBe('archived');
      const events = await t.dataSource.getRepository(AuditEvent).find({
        where: { action: 'call.status_changed', subjectType: 'call' },
        order: { id: 'ASC' },
      });
      const mine = events.filter((e) => e.details.code === code).map((e) => e.details.to);
      expect(mine).toEqual(['open', 'in_review', 'deliberation', 'published', 'archived']);
    });

    it('refuses each move that is not the next step, with a 409 and its reason', async () => {
      const { code } = await create();
      const cases: [string, string, RegExp][] = [
        ['closed', 'CALL_MOVE_SKIPS', /next step is open, not closed/],
        ['archived', 'CALL_MOVE_SKIPS', /next step is open, not archived/],
        ['planned', 'CALL_ALREADY_IN_STATUS', /already planned/],
      ];
      for (const [to, errorCode, reason] of cases) {
        const res = await move(code, to);
        expect(res.status).toBe(409);
        expect(res.body.code).toBe(errorCode);
        expect(res.body.message).toMatch(reason);
      }
      await move(code, 'open');
      const back = await move(code, 'planned');
      expect(back.status).toBe(409);
      expect(back.body).toMatchObject({ code: 'CALL_MOVE_BACKWARD' });
      expect(back.body.message).toMatch(/cannot move back to planned/);
      expect(await storedStatus(code)).toBe('open');
    });

    it('refuses a move to a status that does not exist (400 naming "to")', async () => {
      const { code } = await create();
      const res = await move(code, 'finished');
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('to');
    });

    it('opens only with a future deadline and some hours on offer', async () => {
      const empty = await create({ capacity: [] });
      const none = await move(empty.code, 'open');
      expect(none.status).toBe(409);
      expect(none.body.code).toBe('CALL_NOTHING_ON_OFFER');

      const late = await create();
      t.clock.set(new Date(new Date(late.deadlineAt).getTime() + 60_000));
      const res = await move(late.code, 'open');
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('CALL_DEADLINE_PASSED');
      expect(await storedStatus(late.code)).toBe('planned');
    });
  });

  describe('closing at the deadline', () => {
    it('counts the call closed from the deadline on, before any job has run', async () => {
      const now = t.clock.now().getTime();
      const call = await makeCall(t.dataSource, array, { deadlineAt: new Date(now + HOUR) });
      const service = t.app.get(CallsService);

      expect((await t.agent().get(`/api/calls/${call.code}`)).body.acceptingSubmissions).toBe(true);
      t.clock.set(call.deadlineAt);
      const res = await t.agent().get(`/api/calls/${call.code}`);
      expect(res.body).toMatchObject({ status: 'closed', acceptingSubmissions: false });
      expect(await storedStatus(call.code)).toBe('open');
      // What a submission will ask: refused by the server's clock.
      const loaded = await service.findByCode(call.code);
      expect(() => assertOpenForSubmission(loaded, t.clock.now())).toThrow(/deadline .* passed/);
      const listed = await t.agent().get('/api/calls?status=open&pageSize=100');
      expect(listed.body.items.map((c: { code: string }) => c.code)).not.toContain(call.code);
    });

    it('stores the close when the deadline job runs, and leaves calls before their deadline alone', async () => {
      const now = t.clock.now().getTime();
      const due = await makeCall(t.dataSource, array, { deadlineAt: new Date(now + HOUR) });
      const notYet = await makeCall(t.dataSource, array, { deadlineAt: new Date(now + 3 * HOUR) });
      t.clock.set(new Date(now + 2 * HOUR));

      await t.app.get(CallDeadlineJob).run();

      expect(await storedStatus(due.code)).toBe('closed');
      expect(await storedStatus(notYet.code)).toBe('open');
      const event = await t.dataSource
        .getRepository(AuditEvent)
        .findOneByOrFail({ action: 'call.status_changed', subjectId: due.id });
      expect(event.actorId).toBeNull();
      expect(event.details).toMatchObject({
        from: 'open',
        to: 'closed',
        reason: 'deadline passed',
      });
      // Running again changes nothing that is already closed.
      expect(await t.app.get(CallsService).closeDueCalls()).not.toContain(due.code);
    });
  });

  describe('time zones', () => {
    // The expected instants follow the zone rules of luxon 3.7.2 (IANA tz data): Los Angeles is
    // UTC−8 in January (PST) and UTC−7 in July (PDT), so 17:00 there is 01:00Z or 00:00Z next day.
    it.each([
      ['2027-01-15T17:00', '2027-01-16T01:00:00.000Z'],
      ['2027-07-15T17:00', '2027-07-16T00:00:00.000Z'],
    ])('stores 17:00 in America/Los_Angeles on %s as %s', async (local, expected) => {
      t.clock.set('2026-06-01T00:00:00Z');
      const zoned = DateTime.fromISO(local, { zone: LA });
      expect(zoned.toUTC().toISO()).toBe(expected);
      const { code, deadlineAt } = await create({
        opensAt: '2026-06-01T09:00:00-07:00',
        deadlineAt: zoned.toISO(),
        reviewDueAt: zoned.plus({ weeks: 6 }).toISO(),
      });
      expect(deadlineAt).toBe(expected);
      const row = await t.dataSource.getRepository(Call).findOneByOrFail({ code });
      expect(row.deadlineAt.toISOString()).toBe(expected);
      expect(row.timeZone).toBe(LA);
    });

    it('stores the canonical spelling of a zone name', async () => {
      const { code } = await create({ timeZone: 'europe/oslo' });
      expect((await staff.get(`/api/calls/${code}`)).body.timeZone).toBe('Europe/Oslo');
    });
  });

  describe('the list', () => {
    it('pages, filters by effective status and shows planned calls to staff only', async () => {
      const planned = await create();
      const open1 = await create();
      const open2 = await create();
      await move(open1.code, 'open');
      await move(open2.code, 'open');

      const page = await t.agent().get('/api/calls?status=open&page=1&pageSize=1');
      expect(page.status).toBe(200);
      expect(page.body).toMatchObject({ page: 1, pageSize: 1 });
      expect(page.body.items).toHaveLength(1);
      expect(page.body.total).toBeGreaterThanOrEqual(2);

      const codes = async (agent: TestAgent, query: string) =>
        ((await agent.get(`/api/calls?${query}`)).body.items as { code: string }[]).map(
          (c) => c.code,
        );
      const publicCodes = await codes(t.agent(), 'pageSize=100');
      expect(publicCodes).toEqual(expect.arrayContaining([open1.code, open2.code]));
      expect(publicCodes).not.toContain(planned.code);
      expect(await codes(proposer, 'status=planned&pageSize=100')).toEqual([]);
      expect(await codes(staff, 'status=planned&pageSize=100')).toContain(planned.code);
    });

    it('names a bad page or status in a 400', async () => {
      const res = await t.agent().get('/api/calls?page=0&pageSize=500&status=open,soon');
      expect(res.status).toBe(400);
      expect(new Set(res.body.issues.map((i: { path: string }) => i.path))).toEqual(
        new Set(['page', 'pageSize', 'status']),
      );
    });
  });

  describe('changes after opening', () => {
    it('audits a moved deadline and e-mails it, in the call’s zone and UTC, to the PIs with drafts', async () => {
      t.clock.set('2026-06-01T00:00:00Z');
      const { code } = await create({
        opensAt: '2026-05-01T09:00:00-07:00',
        deadlineAt: '2027-01-15T17:00:00-08:00',
        reviewDueAt: '2027-03-01T17:00:00-08:00',
      });
      await move(code, 'open');
      const pi = uniqueEmail('pi');
      const subscribers = t.app.get(CallSubscribers);
      // Proposals do not exist yet: stand in for the one PI with a draft in this call.
      const addressesFor = subscribers.addressesFor.bind(subscribers);
      subscribers.addressesFor = async (call) => (call.code === code ? [pi] : []);
      try {
        const res = await staff.patch(`/api/calls/${code}`, {
          deadlineAt: '2027-01-22T17:00:00-08:00',
          scienceCasePageLimit: 6,
          title: 'A call made by the tests',
        });
        expect(res.status).toBe(200);
        expect(res.body.deadlineAt).toBe('2027-01-23T01:00:00.000Z');
      } finally {
        subscribers.addressesFor = addressesFor;
      }
      const event = await t.dataSource.getRepository(AuditEvent).findOne({
        where: { action: 'call.updated' },
        order: { id: 'DESC' },
      });
      expect(event?.details).toMatchObject({
        code,
        changes: {
          deadlineAt: { from: '2027-01-16T01:00:00.000Z', to: '2027-01-23T01:00:00.000Z' },
          scienceCasePageLimit: { from: 4, to: 6 },
        },
      });
      expect(Object.keys(event?.details.changes as object)).toHaveLength(2);
      const [mail] = await waitForMessages(pi, 1);
      expect(mail?.subject).toBe(`Call ${code} has changed`);
      expect(mail?.text).toContain(
        'Deadline: was Fri 15 Jan 2027, 17:00 PST (01:00 UTC, Sat 16 Jan 2027); now Fri 22 Jan 2027, 17:00 PST (01:00 UTC, Sat 23 Jan 2027).',
      );
      expect(mail?.text).toContain('Page limit of the science case: was 4 pages; now 6 pages.');
      expect(mail?.text).toContain(`/calls/${code}`);
    });

    it('refuses to move an open call’s deadline into the past (400 deadlineAt)', async () => {
      const { code } = await create();
      await move(code, 'open');
      const res = await staff.patch(`/api/calls/${code}`, {
        deadlineAt: iso(t.clock.now().getTime() - HOUR),
      });
      expect(res.status).toBe(400);
      expect(res.body.issues[0].path).toBe('deadlineAt');
    });

    it('freezes the deadline once the call has closed (409 naming the field)', async () => {
      const { code, deadlineAt } = await create();
      await move(code, 'open');
      t.clock.set(new Date(new Date(deadlineAt).getTime() + HOUR));
      const res = await staff.patch(`/api/calls/${code}`, {
        deadlineAt: iso(t.clock.now().getTime() + 5 * DAY),
        title: 'Still editable',
      });
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('CALL_FIELD_LOCKED');
      expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(['deadlineAt']);
      const title = await staff.patch(`/api/calls/${code}`, { title: 'Still editable' });
      expect(title.status).toBe(200);
    });
  });
});
