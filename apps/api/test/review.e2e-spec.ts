import { extractPageTexts } from '../src/documents/pdf-text.js';
import { ReviewRemindersJob } from '../src/review/review-reminders.job.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';
import { messagesTo, waitForMessages } from './support/mail-sink.js';
import {
  addCoi,
  agentFor,
  assignReview,
  type CallInReview,
  makeCallInReview,
} from './support/review-factories.js';

/** A binary answer's bytes (supertest buffers application/pdf this way). */
const binary = (agent: TestAgent, path: string) =>
  agent.http
    .get(path)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });

async function assignmentsOf(t: TestApp, c: CallInReview) {
  return (await t.dataSource.query(
    `SELECT a.id, a.proposal_id, a.referee_id, a.status FROM review_assignments a
       JOIN proposals p ON p.id = a.proposal_id WHERE p.call_id = $1`,
    [c.call.id],
  )) as { id: string; proposal_id: string; referee_id: string; status: string }[];
}

describe('reviews', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  describe('the automatic pass', () => {
    it('gives every proposal K referees, never a conflicted one, loads within one, and e-mails each referee once', async () => {
      const c = await makeCallInReview(t, { proposals: 5, referees: 4, refereesPerProposal: 2 });
      // Referee 0 is a Co-I of proposal 0; referee 1 shares proposal 1's PI's affiliation.
      await addCoi(t, c.proposals[0]!.proposal, c.referees[0]!);
      await t.dataSource.query(`UPDATE users SET affiliation = $2 WHERE id = $1`, [
        c.referees[1]!.id,
        c.proposals[1]!.pi.affiliation,
      ]);
      const chair = await agentFor(t, c.chair);
      const res = await chair.post(`/api/calls/${c.call.code}/assign`, {});
      expect(res.status).toBe(200);
      expect(res.body.created).toBe(10);
      const rows = await assignmentsOf(t, c);
      expect(rows).toHaveLength(10);
      for (const p of c.proposals)
        expect(rows.filter((r) => r.proposal_id === p.proposal.id)).toHaveLength(2);
      const on = (i: number, j: number) =>
        rows.some(
          (r) =>
            r.proposal_id === c.proposals[i]!.proposal.id && r.referee_id === c.referees[j]!.id,
        );
      expect(on(0, 0)).toBe(false);
      expect(on(1, 1)).toBe(false);
      const loads = c.referees.map((r) => rows.filter((x) => x.referee_id === r.id).length);
      expect(Math.max(...loads) - Math.min(...loads)).toBeLessThanOrEqual(1);
      // The answer shows the same, with the automatic conflicts named.
      const pool = res.body.referees;
      expect(
        pool.referees.find((r: { userId: string }) => r.userId === c.referees[0]!.id).conflicts,
      ).toEqual([
        expect.objectContaining({ reference: c.proposals[0]!.proposal.reference, kind: 'team' }),
      ]);
      expect(pool.proposals.every((p: { missing: number }) => p.missing === 0)).toBe(true);

      for (const [j, referee] of c.referees.entries()) {
        const mails = await waitForMessages(referee.email, 1);
        expect(mails).toHaveLength(1);
        expect(mails[0]!.subject).toBe(`${loads[j]} proposals to review for call ${c.call.code}`);
      }

      // A second pass keeps everything and makes nothing.
      const again = await chair.post(`/api/calls/${c.call.code}/assign`, {});
      expect(again.body.created).toBe(0);
      expect(await assignmentsOf(t, c)).toHaveLength(10);
    });

    it('refuses with the proposal named when the pool is too small, and saves nothing', async () => {
      const c = await makeCallInReview(t, {
        proposals: 2,
        referees: 2,
        refereesPerProposal: 2,
        compilePdf: false,
      });
      await addCoi(t, c.proposals[1]!.proposal, c.referees[0]!);
      const chair = await agentFor(t, c.chair);
      const res = await chair.post(`/api/calls/${c.call.code}/assign`, {});
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('REFEREE_POOL_TOO_SMALL');
      const ref = c.proposals[1]!.proposal.reference;
      expect(res.body.message).toContain(`${ref} needs 2 more referees but only 1`);
      expect(res.body.issues).toEqual([{ path: `proposals.${ref}`, message: expect.any(String) }]);
      expect(await assignmentsOf(t, c)).toHaveLength(0);
    });

    it('lets only the chair of this call assign, refuses a conflicted referee by hand and a submitted review’s removal', async () => {
      const c = await makeCallInReview(t, { proposals: 1, referees: 2, compilePdf: false });
      const other = await makeCallInReview(t, { proposals: 1, referees: 1, compilePdf: false });
      const otherChair = await agentFor(t, other.chair);
      expect((await otherChair.get(`/api/calls/${c.call.code}/referees`)).status).toBe(404);
      expect((await otherChair.post(`/api/calls/${c.call.code}/assign`, {})).status).toBe(404);

      const p = c.proposals[0]!.proposal;
      await addCoi(t, p, c.referees[0]!);
      const chair = await agentFor(t, c.chair);
      const conflicted = await chair.post(`/api/calls/${c.call.code}/assignments`, {
        proposalId: p.id,
        refereeId: c.referees[0]!.id,
      });
      expect(conflicted.status).toBe(409);
      expect(conflicted.body.code).toBe('REFEREE_CONFLICTED');
      const stranger = await makeUser(t.dataSource);
      const notPool = await chair.post(`/api/calls/${c.call.code}/assignments`, {
        proposalId: p.id,
        refereeId: stranger.id,
      });
      expect(notPool.status).toBe(400);
      expect(notPool.body.issues).toEqual([{ path: 'refereeId', message: expect.any(String) }]);
      const bad = await chair.post(`/api/calls/${c.call.code}/assignments`, { proposalId: 'x' });
      expect(bad.status).toBe(400);

      const added = await chair.post(`/api/calls/${c.call.code}/assignments`, {
        proposalId: p.id,
        refereeId: c.referees[1]!.id,
      });
      expect(added.status).toBe(201);
      const id = added.body.proposals[0].assignments[0].id as string;
      await t.dataSource.query(
        `UPDATE review_assignments SET status = 'submitted', score = 3, expertise = 2, submitted_at = now() WHERE id = $1`,
        [id],
      );
      const removal = await chair.delete(`/api/calls/${c.call.code}/assignments/${id}`);
      expect(removal.status).toBe(409);
      expect(removal.body.code).toBe('REVIEW_SUBMITTED');
      expect(await assignmentsOf(t, c)).toHaveLength(1);
    });
  });

  describe("the referee's workspace", () => {
    it('lists only the referee’s own assignments and hides another referee’s review', async () => {
      const c = await makeCallInReview(t, { proposals: 2, referees: 2, compilePdf: false });
      const mine = await assignReview(t, c.proposals[0]!.proposal, c.referees[0]!);
      const theirs = await assignReview(t, c.proposals[0]!.proposal, c.referees[1]!, {
        status: 'submitted',
        score: 4,
        commentToCommittee: 'Secret words for the chair',
      });
      const me = await agentFor(t, c.referees[0]!);
      const list = await me.get('/api/reviews');
      expect(list.status).toBe(200);
      expect(list.body.items.map((i: { id: string }) => i.id)).toEqual([mine.id]);
      expect(JSON.stringify(list.body)).not.toContain('Secret words');
      expect((await me.get(`/api/reviews/${theirs.id}`)).status).toBe(404);
      expect((await me.get(`/api/reviews/${theirs.id}/pdf`)).status).toBe(404);
      expect((await me.get('/api/reviews/not-a-uuid')).status).toBe(404);
      const pi = await agentFor(t, c.proposals[0]!.pi);
      expect((await pi.get(`/api/reviews/${mine.id}`)).status).toBe(403);
    });

    it('saves a draft, refuses a score off the scale and a stale version, submits, and closes at the due date', async () => {
      const c = await makeCallInReview(t, {
        proposals: 1,
        referees: 1,
        compilePdf: false,
        call: { scoreMin: 1, scoreMax: 5 },
      });
      const a = await assignReview(t, c.proposals[0]!.proposal, c.referees[0]!);
      const me = await agentFor(t, c.referees[0]!);
      const path = `/api/reviews/${a.id}`;
      const form = { score: 4, commentToPi: '', commentToCommittee: 'Strong.', expertise: null };
      const draft = await me.put(path, { ...form, version: 1 });
      expect(draft.status).toBe(200);
      expect(draft.body).toMatchObject({
        status: 'accepted',
        score: 4,
        version: 2,
        editable: true,
      });

      const off = await me.put(path, { ...form, score: 6, version: 2 });
      expect(off.status).toBe(400);
      expect(off.body.issues).toEqual([
        { path: 'score', message: expect.stringContaining('between 1 and 5') },
      ]);
      const stale = await me.put(path, { ...form, version: 1 });
      expect(stale.status).toBe(409);
      expect(stale.body.code).toBe('STALE_VERSION');
      const incomplete = await me.put(path, { ...form, version: 2, submit: true });
      expect(incomplete.status).toBe(400);
      expect(incomplete.body.issues.map((i: { path: string }) => i.path).sort()).toEqual([
        'commentToPi',
        'expertise',
      ]);

      const submitted = await me.put(path, {
        ...form,
        commentToPi: 'A clear case.',
        expertise: 3,
        version: 2,
        submit: true,
      });
      expect(submitted.status).toBe(200);
      expect(submitted.body).toMatchObject({ status: 'submitted', expertise: 3 });
      expect(submitted.body.submittedAt).toEqual(expect.any(String));
      const audit = (await t.dataSource.query(
        `SELECT action FROM audit_events WHERE subject_id = $1 ORDER BY id`,
        [a.id],
      )) as { action: string }[];
      expect(audit.map((e) => e.action)).toEqual(['review.draft_saved', 'review.submitted']);

      t.clock.set(new Date(c.call.reviewDueAt.getTime() + 60_000));
      const late = await me.put(path, { ...form, commentToPi: 'Later.', expertise: 3, version: 3 });
      expect(late.status).toBe(409);
      expect(late.body.code).toBe('REVIEW_CLOSED');
      const row = (await t.dataSource.query(
        `SELECT comment_to_pi, status FROM review_assignments WHERE id = $1`,
        [a.id],
      )) as { comment_to_pi: string; status: string }[];
      expect(row[0]).toEqual({ comment_to_pi: 'A clear case.', status: 'submitted' });
    });

    it('declines with a reason, and a declared conflict keeps the automatic pass away', async () => {
      const c = await makeCallInReview(t, {
        proposals: 1,
        referees: 3,
        refereesPerProposal: 2,
        compilePdf: false,
      });
      const p = c.proposals[0]!.proposal;
      const a0 = await assignReview(t, p, c.referees[0]!);
      const a1 = await assignReview(t, p, c.referees[1]!);
      const r0 = await agentFor(t, c.referees[0]!);
      const r1 = await agentFor(t, c.referees[1]!);
      expect(
        (await r0.post(`/api/reviews/${a0.id}/decline`, { version: 1, reason: '' })).status,
      ).toBe(400);
      const declined = await r0.post(`/api/reviews/${a0.id}/decline`, {
        version: 1,
        reason: 'Away all month.',
      });
      expect(declined.body).toMatchObject({ status: 'declined', declineReason: 'Away all month.' });
      const conflict = await r1.post(`/api/reviews/${a1.id}/conflict`, {
        version: 1,
        reason: 'I supervised the PI.',
      });
      expect(conflict.body).toMatchObject({
        status: 'conflicted',
        conflictReason: 'I supervised the PI.',
        abstract: '',
      });
      expect((await r1.get(`/api/reviews/${a1.id}/pdf`)).status).toBe(409);

      // Two of three referees are out: the pool cannot give this proposal two any more.
      const chair = await agentFor(t, c.chair);
      const pass = await chair.post(`/api/calls/${c.call.code}/assign`, {});
      expect(pass.status).toBe(409);
      const view = await chair.get(`/api/calls/${c.call.code}/referees`);
      const r1Conflicts = view.body.referees.find(
        (r: { userId: string }) => r.userId === c.referees[1]!.id,
      ).conflicts;
      expect(r1Conflicts).toEqual([
        expect.objectContaining({ kind: 'declared', reason: 'I supervised the PI.' }),
      ]);
    });
  });

  describe('anonymous review', () => {
    it('names nobody of the team in anything a referee can reach', async () => {
      const c = await makeCallInReview(t, {
        proposals: 1,
        referees: 1,
        refereesPerProposal: 1,
        anonymous: true,
      });
      const p = c.proposals[0]!;
      const coi = await makeUser(t.dataSource, {
        name: 'Ottoline Vantrees',
        affiliation: 'Marrowgate Polytechnic',
      });
      await addCoi(t, p.proposal, coi);
      // The PI's name and affiliation are in the frozen version the PDF is compiled from; the
      // Co-I joined later, so only the live team names them.
      const needles = [
        p.pi.name,
        p.pi.affiliation,
        p.pi.email,
        'Ottoline',
        'Vantrees',
        'Marrowgate',
        coi.email,
      ];
      const chair = await agentFor(t, c.chair);
      expect((await chair.post(`/api/calls/${c.call.code}/assign`, {})).status).toBe(200);
      const referee = c.referees[0]!;
      const me = await agentFor(t, referee);

      const list = await me.get('/api/reviews');
      const id = list.body.items[0].id as string;
      const detail = await me.get(`/api/reviews/${id}`);
      const saved = await me.put(`/api/reviews/${id}`, {
        version: detail.body.version,
        score: 3,
        commentToPi: 'Fine.',
        commentToCommittee: '',
        expertise: 2,
      });
      const pdf = await binary(me, `/api/reviews/${id}/pdf`);
      expect(pdf.status).toBe(200);
      const pdfText = (await extractPageTexts(new Uint8Array(pdf.body as Buffer), 10_000)).join(
        '\n',
      );
      expect(pdfText).toContain(p.proposal.reference);
      const raw = (pdf.body as Buffer).toString('latin1');
      const mails = await waitForMessages(referee.email, 1);

      const reachable = [
        JSON.stringify(list.body),
        JSON.stringify(detail.body),
        JSON.stringify(saved.body),
        pdfText,
        raw,
        String(pdf.headers['content-disposition']),
        ...mails.map((m) => `${m.subject}\n${m.text}\n${m.html}`),
      ].join('\n');
      for (const needle of needles) expect(reachable).not.toContain(needle);
      // The chair, unlike the referee, sees the PI where review is not anonymous only.
      const view = await chair.get(`/api/calls/${c.call.code}/referees`);
      expect(view.body.proposals[0].piName).toBeNull();
    });
  });

  describe('reminders', () => {
    it('e-mails outstanding reviews 3 days and 1 day before the due date, each once', async () => {
      // Dates no other file uses: the job sees every call in the database.
      t.clock.set('2033-05-10T12:00:00Z');
      const c = await makeCallInReview(t, {
        proposals: 2,
        referees: 2,
        compilePdf: false,
        call: { reviewDueAt: new Date('2033-05-20T12:00:00Z') },
      });
      await assignReview(t, c.proposals[0]!.proposal, c.referees[0]!);
      await assignReview(t, c.proposals[1]!.proposal, c.referees[0]!, { status: 'accepted' });
      await assignReview(t, c.proposals[0]!.proposal, c.referees[1]!, { status: 'submitted' });
      const job = t.app.get(ReviewRemindersJob);

      t.clock.set('2033-05-16T12:00:00Z');
      expect(await job.sendDue()).toBe(0);
      t.clock.set('2033-05-17T18:00:00Z');
      await Promise.all([job.sendDue(), job.sendDue()]);
      const first = await waitForMessages(c.referees[0]!.email, 1);
      expect(first).toHaveLength(1);
      expect(first[0]!.subject).toBe(`Reviews for call ${c.call.code} are due in 3 days`);
      expect(first[0]!.text).toContain(c.proposals[0]!.proposal.reference);
      expect(first[0]!.text).toContain(c.proposals[1]!.proposal.reference);
      expect(await job.sendDue()).toBe(0);

      t.clock.set('2033-05-20T00:00:00Z');
      expect(await job.sendDue()).toBe(1);
      const both = await waitForMessages(c.referees[0]!.email, 2);
      expect(both.map((m) => m.subject)).toContain(
        `Reviews for call ${c.call.code} are due in 1 day`,
      );
      // The referee whose review is submitted hears nothing.
      await new Promise((r) => setTimeout(r, 1500));
      expect(await messagesTo(c.referees[1]!.email)).toEqual([]);
    });
  });
});
