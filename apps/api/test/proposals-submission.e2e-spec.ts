import { PDFDocument } from 'pdf-lib';
import type { Call } from '../src/calls/entities/call.entity.js';
import { SCIENCE_PROSE, samplePdf } from '../src/documents/testing/sample-pdf.js';
import { ProposalVersion } from '../src/proposals/entities/proposal-version.entity.js';
import { createTestApp, type TestAgent, type TestApp } from './support/app.js';
import { makeCall, type TestObservatory } from './support/calls-factories.js';
import {
  completeDraft,
  mailsMatching,
  makeOpenCall,
  must,
  type ProposalBody,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';

const DAY = 86_400_000;

describe('proposals: submission, versions, compiled PDF, receipts', () => {
  let t: TestApp;
  let array: TestObservatory;
  let call: Call;
  let pdf3: Buffer;

  beforeAll(async () => {
    t = await createTestApp();
    ({ array, call } = await makeOpenCall(t.dataSource));
    pdf3 = await samplePdf(['Aims', SCIENCE_PROSE, 'Technical case'], { figure: true });
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  /** A draft ready to submit, as the PI; with a Co-I who can edit when `coi` is given. */
  async function ready(pi: TestAgent, coiEmail?: string, on: Call = call) {
    let p = await completeDraft(pi, array, on);
    if (coiEmail)
      p = await must(
        pi.post(`/api/proposals/${p.reference}/team`, {
          version: p.version,
          email: coiEmail,
          canEdit: true,
        }),
        201,
      );
    return must(uploadScienceCase(pi, p.reference, p.version, pdf3), 201);
  }

  it('submits: a frozen version 1, the compiled PDF (cover + science case), receipts with it to PI and Co-I', async () => {
    const pi = await signedIn(t, { name: 'Ines Thorvaldsen' });
    const coi = await signedIn(t, { name: 'Kwame Oduya-Farrell' });
    const p = await ready(pi.agent, coi.user.email);
    const base = `/api/proposals/${p.reference}`;

    const submitted = await must(pi.agent.post(`${base}/submit`, { version: p.version }));
    expect(submitted).toMatchObject({
      status: 'submitted',
      submittedVersion: 1,
      version: p.version + 1,
    });
    expect(typeof submitted.submittedAt).toBe('string');

    const versions = await pi.agent.get(`${base}/versions`).expect(200);
    expect(versions.body).toEqual([
      {
        number: 1,
        submittedAt: submitted.submittedAt,
        submittedBy: 'Ines Thorvaldsen',
        totalHours: 4,
      },
    ]);
    const snapshot = (await pi.agent.get(`${base}/versions/1`).expect(200)).body;
    expect(snapshot).toMatchObject({
      reference: p.reference,
      version: 1,
      title: p.title,
      totalHours: 4,
      team: [
        expect.objectContaining({ name: 'Ines Thorvaldsen', role: 'pi' }),
        expect.objectContaining({ name: 'Kwame Oduya-Farrell', role: 'coi' }),
      ],
      scienceCase: { pages: 3, sizeBytes: pdf3.length },
    });
    expect(snapshot.observations[0].result.totalHours).toBeCloseTo(4, 9);

    const download = await pi.agent.get(`${base}/pdf`).buffer(true).expect(200);
    expect(download.headers['content-type']).toBe('application/pdf');
    expect(download.headers['x-content-type-options']).toBe('nosniff');
    expect(download.headers['content-disposition']).toBe(
      `attachment; filename="${p.reference}-v1.pdf"`,
    );
    // Read back with pdf-lib, an independent PDF reader: the cover page(s) plus the 3 pages.
    const compiled = await PDFDocument.load(download.body as Buffer);
    const cover = compiled.getPageCount() - 3;
    expect(cover).toBeGreaterThanOrEqual(1);
    expect(compiled.getTitle()).toBe(`${p.reference}: ${p.title}`);

    for (const who of [pi.user, coi.user]) {
      const [receipt] = await mailsMatching(who.email, /^Submitted/);
      expect(receipt?.subject).toBe(`Submitted: ${p.reference} version 1`);
      expect(receipt?.text).toContain(
        'The compiled PDF, exactly as the reviewers will read it, is attached.',
      );
      expect(receipt?.attachments).toEqual([
        expect.objectContaining({
          filename: `${p.reference}-v1.pdf`,
          contentType: 'application/pdf',
          size: (download.body as Buffer).length,
        }),
      ]);
    }

    // Submitted means read-only.
    const edit = await pi.agent.patch(base, { version: submitted.version, title: 'Changed' });
    expect(edit.status).toBe(409);
    expect(edit.body.code).toBe('PROPOSAL_SUBMITTED');
  });

  it('refuses a submission one second after the deadline, with the deadline in the message', async () => {
    const soon = await makeCall(t.dataSource, array, { deadlineAt: new Date(Date.now() + DAY) });
    const pi = await signedIn(t);
    const p = await ready(pi.agent, undefined, soon);
    t.clock.set(new Date(soon.deadlineAt.getTime() + 1000));
    const res = await pi.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('DEADLINE_PASSED');
    const utc = soon.deadlineAt.toISOString().slice(0, 19).replace('T', ' ');
    expect(res.body.message).toContain(
      `The deadline of ${soon.code} passed at ${utc.replace(/:00$/, '')}`,
    );
    expect(res.body.message).toMatch(/UTC; submissions are closed$/);
    expect(
      await t.dataSource.getRepository(ProposalVersion).countBy({ proposalId: await idOf(p) }),
    ).toBe(0);

    // One second before the deadline it goes through.
    t.clock.set(new Date(soon.deadlineAt.getTime() - 1000));
    await must(pi.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version }));
  });

  it('makes one version of a double-clicked submit: the second gets 409 STALE_VERSION', async () => {
    const pi = await signedIn(t);
    const p = await ready(pi.agent);
    const url = `/api/proposals/${p.reference}/submit`;
    const [a, b] = await Promise.all([
      pi.agent.post(url, { version: p.version }),
      pi.agent.post(url, { version: p.version }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect((a.status === 409 ? a : b).body.code).toBe('STALE_VERSION');
    expect(
      await t.dataSource.getRepository(ProposalVersion).countBy({ proposalId: await idOf(p) }),
    ).toBe(1);
    expect(await mailsMatching(pi.user.email, /^Submitted/)).toHaveLength(1);
    // The outbox has sent everything once the receipt is in: no second one follows.
    await new Promise((r) => setTimeout(r, 500));
    expect(await mailsMatching(pi.user.email, /^Submitted/)).toHaveLength(1);
  });

  it('refuses to submit with blockers (409 HAS_BLOCKERS naming them), and for an unverified account (403)', async () => {
    const pi = await signedIn(t);
    const p = await completeDraft(pi.agent, array, call);
    const res = await pi.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('HAS_BLOCKERS');
    expect(res.body.issues).toEqual([
      { path: 'documents.scienceCase', message: 'Upload the science case (a PDF).' },
    ]);

    const unverified = await signedIn(t, { emailVerifiedAt: null });
    const draft = await ready(unverified.agent);
    const refused = await unverified.agent.post(`/api/proposals/${draft.reference}/submit`, {
      version: draft.version,
    });
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/Confirm your e-mail address/);
  });

  it('reopens before the deadline, resubmits as version 2, and compares the versions', async () => {
    const pi = await signedIn(t);
    let p = await ready(pi.agent);
    const base = `/api/proposals/${p.reference}`;
    p = await must(pi.agent.post(`${base}/submit`, { version: p.version }));
    p = await must(pi.agent.post(`${base}/reopen`, { version: p.version }));
    expect(p).toMatchObject({ status: 'draft', submittedVersion: 1 });
    p = await must(pi.agent.patch(base, { version: p.version, title: 'A better title' }));
    const obs = (p.observations as { id: string }[])[0]!;
    p = await must(
      pi.agent.patch(`${base}/observations/${obs.id}`, { version: p.version, hoursAsked: 6 }),
    );
    const pdf2 = await samplePdf(['Shorter case', SCIENCE_PROSE]);
    p = await must(uploadScienceCase(pi.agent, p.reference, p.version, pdf2, 'v2.pdf'), 201);
    p = await must(pi.agent.post(`${base}/submit`, { version: p.version }));
    expect(p).toMatchObject({ status: 'submitted', submittedVersion: 2 });

    const list = (await pi.agent.get(`${base}/versions`).expect(200)).body;
    expect(
      list.map((v: { number: number; totalHours: number }) => [v.number, v.totalHours]),
    ).toEqual([
      [1, 4],
      [2, 6],
    ]);
    const { changes } = (await pi.agent.get(`${base}/versions/compare?from=1&to=2`).expect(200))
      .body;
    const byLabel = Object.fromEntries(changes.map((c: { label: string }) => [c.label, c]));
    expect(byLabel.Title).toMatchObject({ path: 'title', after: 'A better title' });
    expect(byLabel['Observation 1 · hours asked']).toEqual({
      path: 'observations.0.hoursAsked',
      label: 'Observation 1 · hours asked',
      before: 4,
      after: 6,
    });
    expect(byLabel['Total hours asked']).toMatchObject({ before: 4, after: 6 });
    expect(byLabel['Science case']).toMatchObject({
      before: expect.objectContaining({ pages: 3 }),
      after: expect.objectContaining({ pages: 2, filename: 'v2.pdf' }),
    });
    expect(changes).toHaveLength(4);
    // The PDF now is version 2's: cover + 2 pages.
    const latest = await pi.agent.get(`${base}/pdf`).buffer(true).expect(200);
    const first = await t.dataSource
      .getRepository(ProposalVersion)
      .createQueryBuilder('v')
      .addSelect('v.compiledPdf')
      .where('v.proposal_id = :id AND v.number = 1', { id: await idOf(p) })
      .getOneOrFail();
    const pages = async (b: Buffer) => (await PDFDocument.load(b)).getPageCount();
    expect((await pages(first.compiledPdf!)) - (await pages(latest.body as Buffer))).toBe(1);
    expect(latest.headers['content-disposition']).toContain(`${p.reference}-v2.pdf`);

    const missing = await pi.agent.get(`${base}/versions/compare?from=1&to=9`);
    expect(missing.status).toBe(404);
    expect((await pi.agent.get(`${base}/versions/9`)).status).toBe(404);
  });

  it('refuses to reopen after the deadline', async () => {
    const soon = await makeCall(t.dataSource, array, { deadlineAt: new Date(Date.now() + DAY) });
    const pi = await signedIn(t);
    let p = await ready(pi.agent, undefined, soon);
    p = await must(pi.agent.post(`/api/proposals/${p.reference}/submit`, { version: p.version }));
    t.clock.set(new Date(soon.deadlineAt.getTime() + 1));
    const res = await pi.agent.post(`/api/proposals/${p.reference}/reopen`, { version: p.version });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('DEADLINE_PASSED');
  });

  it('lets the PI withdraw (a Co-I may not), and a withdrawn proposal no longer changes', async () => {
    const pi = await signedIn(t);
    const coi = await signedIn(t);
    let p = await ready(pi.agent, coi.user.email);
    const base = `/api/proposals/${p.reference}`;
    p = await must(pi.agent.post(`${base}/submit`, { version: p.version }));
    const byCoi = await coi.agent.post(`${base}/withdraw`, { version: p.version });
    expect(byCoi.status).toBe(403);
    p = await must(pi.agent.post(`${base}/withdraw`, { version: p.version }));
    expect(p.status).toBe('withdrawn');
    const edit = await pi.agent.patch(base, { version: p.version, title: 'x' });
    expect(edit.status).toBe(409);
    expect(edit.body.code).toBe('PROPOSAL_READ_ONLY');
    const again = await pi.agent.post(`${base}/withdraw`, { version: p.version });
    expect(again.body.code).toBe('CANNOT_WITHDRAW');
    // The submitted version and its PDF stay for the team.
    await pi.agent.get(`${base}/pdf`).expect(200);
  });

  it('answers 404 for the PDF before the first submission', async () => {
    const pi = await signedIn(t);
    const p = await ready(pi.agent);
    const res = await pi.agent.get(`/api/proposals/${p.reference}/pdf`);
    expect(res.status).toBe(404);
    expect((await pi.agent.get(`/api/proposals/${p.reference}/versions`)).body).toEqual([]);
  });

  async function idOf(p: ProposalBody): Promise<string> {
    const [row] = (await t.dataSource.query('SELECT id FROM proposals WHERE reference = $1', [
      p.reference,
    ])) as { id: string }[];
    return row!.id;
  }
});
