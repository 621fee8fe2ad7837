import { SCIENCE_PROSE, samplePdf } from '../src/documents/testing/sample-pdf.js';
import { CallSubscribers } from '../src/calls/call-subscribers.js';
import { ProposalRemindersJob } from '../src/proposals/proposal-reminders.job.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeCall, makeObservatory, type TestObservatory } from './support/calls-factories.js';
import { messagesTo } from './support/mail-sink.js';
import { uniqueEmail } from './support/factories.js';
import {
  completeDraft,
  createProposal,
  mailsMatching,
  must,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

describe('proposals: deadline reminders and call changes', () => {
  let t: TestApp;
  let array: TestObservatory;
  let job: ProposalRemindersJob;

  beforeAll(async () => {
    t = await createTestApp();
    array = await makeObservatory(t.dataSource);
    job = t.app.get(ProposalRemindersJob);
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  const count = async (address: string, subject: RegExp) =>
    (await messagesTo(address)).filter((m) => subject.test(m.subject)).length;
  /** Gives the outbox time to send whatever is queued, so a count of 1 stays 1. */
  const settle = () => new Promise((r) => setTimeout(r, 700));

  // The job reminds every draft in the database, and the other e2e files make calls with
  // deadlines ten days out while this one runs; these calls close far beyond theirs so that
  // moving the clock to their reminder windows reminds only this file's drafts.
  it('reminds the team of a draft 7 days and 1 day before the deadline, each once', async () => {
    const call = await makeCall(t.dataSource, array, {
      deadlineAt: new Date(Date.now() + 417 * DAY),
      reviewDueAt: new Date(Date.now() + 447 * DAY),
    });
    const pi = await signedIn(t, { name: 'Perpetua Lindqvist' });
    const coi = await signedIn(t);
    const draft = await createProposal(pi.agent, call.code, { title: 'Reminded draft' });
    await must(
      pi.agent.post(`/api/proposals/${draft.reference}/team`, {
        version: 1,
        email: coi.user.email,
        canEdit: true,
      }),
      201,
    );
    const pending = uniqueEmail('pending');
    await must(
      pi.agent.post(`/api/proposals/${draft.reference}/team`, {
        version: 2,
        email: pending,
        canEdit: true,
      }),
      201,
    );
    // A submitted proposal of someone else is not reminded.
    const done = await signedIn(t);
    let p = await completeDraft(done.agent, array, call);
    p = await must(
      uploadScienceCase(done.agent, p.reference, p.version, await samplePdf([SCIENCE_PROSE])),
      201,
    );
    await must(done.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version }));

    // Nine days before: nothing is due.
    t.clock.set(new Date(call.deadlineAt.getTime() - 9 * DAY));
    await job.sendDue();
    // Seven days less an hour before: the first reminder, however often the job runs.
    t.clock.set(new Date(call.deadlineAt.getTime() - 7 * DAY + HOUR));
    await Promise.all([job.sendDue(), job.sendDue()]);
    await job.sendDue();
    const [first] = await mailsMatching(pi.user.email, /^Deadline in/);
    expect(first!.subject).toBe(`Deadline in 7 days: ${draft.reference} is not submitted`);
    expect(first!.text).toContain('Dear Perpetua Lindqvist,');
    await mailsMatching(coi.user.email, /^Deadline in/);
    await settle();
    expect(await count(pi.user.email, /^Deadline in/)).toBe(1);
    expect(await count(coi.user.email, /^Deadline in/)).toBe(1);
    expect(await count(pending, /^Deadline in/)).toBe(0);
    expect(await count(done.user.email, /^Deadline in/)).toBe(0);

    // Twenty hours before: the last-day reminder, once.
    t.clock.set(new Date(call.deadlineAt.getTime() - 20 * HOUR));
    await job.sendDue();
    await job.sendDue();
    const both = await mailsMatching(pi.user.email, /^Deadline in/, 2);
    expect(both.map((m) => m.subject)).toContain(
      `Deadline in 20 hours: ${draft.reference} is not submitted`,
    );
    await settle();
    expect(await count(pi.user.email, /^Deadline in/)).toBe(2);

    // After the deadline nothing more.
    t.clock.set(new Date(call.deadlineAt.getTime() + HOUR));
    expect(await job.sendDue()).toBe(0);
    const recorded = (await t.dataSource.query(
      `SELECT r.kind FROM proposal_reminders r JOIN proposals p ON p.id = r.proposal_id
        WHERE p.reference = $1 ORDER BY r.kind`,
      [draft.reference],
    )) as { kind: string }[];
    expect(recorded.map((r) => r.kind)).toEqual(['1d', '7d']);
  });

  it('sends a draft first made in the last day only the last-day reminder', async () => {
    const call = await makeCall(t.dataSource, array, {
      deadlineAt: new Date(Date.now() + 333 * DAY + 12 * HOUR),
      reviewDueAt: new Date(Date.now() + 363 * DAY),
    });
    t.clock.set(new Date(call.deadlineAt.getTime() - 12 * HOUR));
    const pi = await signedIn(t);
    const draft = await createProposal(pi.agent, call.code);
    await job.sendDue();
    const [mail] = await mailsMatching(pi.user.email, /^Deadline in/);
    expect(mail!.subject).toMatch(new RegExp(`^Deadline in 1[12] hours: ${draft.reference}`));
    await settle();
    expect(await count(pi.user.email, /^Deadline in/)).toBe(1);
  });

  it('mails a change of an open call to the PIs with a draft in it, not to Co-Is or submitted ones', async () => {
    const call = await makeCall(t.dataSource, array);
    const staff = await signedIn(t, { roles: ['staff'] });
    const draftPi = await signedIn(t);
    const coi = await signedIn(t);
    const submittedPi = await signedIn(t);
    const draft = await createProposal(draftPi.agent, call.code);
    await must(
      draftPi.agent.post(`/api/proposals/${draft.reference}/team`, {
        version: 1,
        email: coi.user.email,
        canEdit: true,
      }),
      201,
    );
    let p = await completeDraft(submittedPi.agent, array, call);
    p = await must(
      uploadScienceCase(submittedPi.agent, p.reference, p.version, await samplePdf(['x'])),
      201,
    );
    await must(
      submittedPi.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version }),
    );

    const subscribers = await t.app.get(CallSubscribers).addressesFor(call, t.dataSource.manager);
    expect(subscribers).toEqual([draftPi.user.email]);

    const res = await staff.agent.patch(`/api/calls/${call.code}`, {
      title: 'A renamed test call',
    });
    expect(res.status).toBe(200);
    const [mail] = await mailsMatching(draftPi.user.email, /has changed/);
    expect(mail!.subject).toBe(`Call ${call.code} has changed`);
    await settle();
    expect(await count(coi.user.email, /has changed/)).toBe(0);
    expect(await count(submittedPi.user.email, /has changed/)).toBe(0);
  });
});
