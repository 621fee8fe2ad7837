import { readFileSync } from 'node:fs';
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import type { Call } from '../src/calls/entities/call.entity.js';
import { REPO_ROOT } from '../src/documents/repo-root.js';
import { SCIENCE_PROSE, samplePdf } from '../src/documents/testing/sample-pdf.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeCall, type TestObservatory } from './support/calls-factories.js';
import {
  completeDraft,
  createProposal,
  makeOpenCall,
  must,
  type ProposalBody,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';

const FIXTURES = join(REPO_ROOT, 'apps/api/test/fixtures/pdf');

describe('proposals: the science case', () => {
  let t: TestApp;
  let array: TestObservatory;
  let call: Call;

  beforeAll(async () => {
    t = await createTestApp();
    ({ array, call } = await makeOpenCall(t.dataSource));
  });
  afterAll(() => t.close());

  /** The proposal's stored version and documents rows, straight from the database. */
  async function stored(p: ProposalBody) {
    const [row] = (await t.dataSource.query(
      `SELECT p.version, (SELECT count(*)::int FROM documents d WHERE d.proposal_id = p.id) AS documents
         FROM proposals p WHERE p.reference = $1`,
      [p.reference],
    )) as { version: number; documents: number }[];
    return row!;
  }

  it('stores a real PDF with its SHA-256 and page count, and serves it back byte for byte', async () => {
    const pi = await signedIn(t);
    const p = await createProposal(pi.agent, call.code);
    const pdf = await samplePdf(['One', SCIENCE_PROSE]);
    const res = await uploadScienceCase(pi.agent, p.reference, 1, pdf, 'Résumé "final" case.pdf');
    expect(res.status).toBe(201);
    expect(res.body.version).toBe(2);
    expect(res.body.scienceCase).toMatchObject({
      pages: 2,
      sizeBytes: pdf.length,
      // Checked against node:crypto, not the server's own hashing.
      sha256: createHash('sha256').update(pdf).digest('hex'),
      filename: 'Résumé _final_ case.pdf',
    });
    const back = await pi.agent
      .get(`/api/proposals/${p.reference}/documents/science-case`)
      .buffer(true)
      .expect(200);
    expect((back.body as Buffer).equals(pdf)).toBe(true);
    expect(back.headers['x-content-type-options']).toBe('nosniff');
    expect(back.headers['content-type']).toBe('application/pdf');
    const disposition = back.headers['content-disposition'] as string;
    // A plain ASCII fallback with no quote inside it, and the UTF-8 name per RFC 5987.
    expect(disposition).toMatch(/^attachment; filename="[^"]*"; filename\*=UTF-8''/);
    expect(disposition).toContain(`filename*=UTF-8''R%C3%A9sum%C3%A9%20_final_%20case.pdf`);

    // A second upload replaces it.
    const next = await samplePdf(['Only one page']);
    const replaced = await must(uploadScienceCase(pi.agent, p.reference, 2, next), 201);
    expect((replaced.scienceCase as { pages: number }).pages).toBe(1);
    expect((await stored(p)).documents).toBe(2);
  });

  it('judges by the bytes: a PDF sent as text/plain under another name is accepted as a PDF', async () => {
    const pi = await signedIn(t);
    const p = await createProposal(pi.agent, call.code);
    const pdf = await samplePdf(['A page']);
    const res = await uploadScienceCase(pi.agent, p.reference, 1, pdf, 'notes.txt', 'text/plain');
    expect(res.status).toBe(201);
    expect(res.body.scienceCase).toMatchObject({ pages: 1, filename: 'notes.txt.pdf' });
  });

  describe('refuses, naming the problem, and stores nothing', () => {
    const cases: [string, () => Promise<Buffer>, number, string, string?][] = [
      [
        'a text file named .pdf',
        async () => Buffer.from('Just some text, not a PDF.\n'),
        415,
        'NOT_A_PDF',
      ],
      [
        'an encrypted PDF (password to open)',
        async () => readFileSync(join(FIXTURES, 'aes256-password.pdf')),
        422,
        'PDF_ENCRYPTED',
      ],
      [
        'an encrypted PDF that opens without a password',
        async () => readFileSync(join(FIXTURES, 'rc4-128-restrictions.pdf')),
        422,
        'PDF_ENCRYPTED',
      ],
      [
        'too many pages (5 of at most 4)',
        () => samplePdf(['1', '2', '3', '4', '5']),
        422,
        'TOO_MANY_PAGES',
      ],
      ['zero bytes', async () => Buffer.alloc(0), 400, 'EMPTY_FILE'],
      [
        'a PDF cut short',
        async () => (await samplePdf(['x', SCIENCE_PROSE])).subarray(0, 400),
        415,
        'NOT_A_PDF',
      ],
    ];
    it.each(cases)('%s', async (_what, make, status, code) => {
      const pi = await signedIn(t);
      const p = await createProposal(pi.agent, call.code);
      const res = await uploadScienceCase(pi.agent, p.reference, 1, await make(), 'case.pdf');
      expect({ status: res.status, code: res.body.code }).toEqual({ status, code });
      expect(res.body.issues).toEqual([expect.objectContaining({ path: 'file' })]);
      expect(await stored(p)).toEqual({ version: 1, documents: 0 });
    });

    it('a file above the call’s size limit: 413 while it streams in', async () => {
      const small = await makeCall(t.dataSource, array, { scienceCaseMaxMb: 0.05 });
      const pi = await signedIn(t);
      const p = await createProposal(pi.agent, small.code);
      const big = Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(80_000, 0x20)]);
      const res = await uploadScienceCase(pi.agent, p.reference, 1, big);
      expect(res.status).toBe(413);
      expect(res.body).toMatchObject({ code: 'FILE_TOO_LARGE', statusCode: 413 });
      expect(res.body.message).toContain('0.05 MB');
      expect(await stored(p)).toEqual({ version: 1, documents: 0 });
    });

    it('no file, a second file field, a stale version, a bad version field', async () => {
      const pi = await signedIn(t);
      const p = await createProposal(pi.agent, call.code);
      const token = await pi.agent.csrf();
      const url = `/api/proposals/${p.reference}/documents`;
      const none = await pi.agent.http.post(url).set('X-CSRF-Token', token).field('version', '1');
      expect({ status: none.status, code: none.body.code }).toEqual({
        status: 400,
        code: 'FILE_MISSING',
      });
      const pdf = await samplePdf(['x']);
      const wrongField = await pi.agent.http
        .post(url)
        .set('X-CSRF-Token', token)
        .field('version', '1')
        .attach('document', pdf, 'case.pdf');
      expect({ status: wrongField.status, path: wrongField.body.issues?.[0]?.path }).toEqual({
        status: 400,
        path: 'document',
      });
      const stale = await uploadScienceCase(pi.agent, p.reference, 7, pdf);
      expect({ status: stale.status, code: stale.body.code }).toEqual({
        status: 409,
        code: 'STALE_VERSION',
      });
      const bad = await pi.agent.http
        .post(url)
        .set('X-CSRF-Token', token)
        .field('version', 'seven')
        .attach('file', pdf, 'case.pdf');
      expect({ status: bad.status, path: bad.body.issues?.[0]?.path }).toEqual({
        status: 400,
        path: 'version',
      });
      expect(await stored(p)).toEqual({ version: 1, documents: 0 });
    });
  });

  describe('in an anonymous call', () => {
    let anonymous: Call;
    beforeAll(async () => {
      anonymous = await makeCall(t.dataSource, array, { anonymousReview: true });
    });

    it("finds a team member's name in the text, names the page, and blocks the submission", async () => {
      const pi = await signedIn(t, { name: 'Ada Quillfeather' });
      let p = await completeDraft(pi.agent, array, anonymous);
      const pdf = await samplePdf([
        SCIENCE_PROSE,
        `As shown by A. Quillfeather et al., the gas is cold. ${SCIENCE_PROSE}`,
      ]);
      p = await must(uploadScienceCase(pi.agent, p.reference, p.version, pdf), 201);
      const checks = (await pi.agent.get(`/api/proposals/${p.reference}/checks`).expect(200)).body;
      const finding = checks.items.find(
        (c: { code: string }) => c.code === 'TEAM_NAME_IN_ANONYMOUS_PDF',
      );
      expect(finding).toMatchObject({
        level: 'blocker',
        section: 'documents',
        field: 'documents.scienceCase',
      });
      expect(finding.message).toMatch(/^Page 2 names "Ada Quillfeather"/);
      const res = await pi.agent.post(`/api/proposals/${p.reference}/submit`, {
        version: p.version,
      });
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('HAS_BLOCKERS');
    });

    it('checks the text again when someone whose name it contains joins the team', async () => {
      const pi = await signedIn(t, { name: 'Lioba Marrast' });
      const coi = await signedIn(t, { name: 'Bram Oyelaran' });
      let p = await completeDraft(pi.agent, array, anonymous);
      const pdf = await samplePdf([
        `Earlier maps by Oyelaran, B. show the ridge. ${SCIENCE_PROSE}`,
      ]);
      p = await must(uploadScienceCase(pi.agent, p.reference, p.version, pdf), 201);
      let checks = (await pi.agent.get(`/api/proposals/${p.reference}/checks`)).body;
      expect(checks.blockers).toBe(0);
      p = await must(
        pi.agent.post(`/api/proposals/${p.reference}/team`, {
          version: p.version,
          email: coi.user.email,
          canEdit: false,
        }),
        201,
      );
      checks = (await pi.agent.get(`/api/proposals/${p.reference}/checks`)).body;
      expect(checks.items).toEqual([
        expect.objectContaining({ code: 'TEAM_NAME_IN_ANONYMOUS_PDF', level: 'blocker' }),
      ]);
      expect(checks.items[0].message).toContain('"Bram Oyelaran"');
    });

    it('does not look for names when the call is not anonymous', async () => {
      const pi = await signedIn(t, { name: 'Ada Quillfeather' });
      let p = await completeDraft(pi.agent, array, call);
      const pdf = await samplePdf([`Ada Quillfeather wrote this. ${SCIENCE_PROSE}`]);
      p = await must(uploadScienceCase(pi.agent, p.reference, p.version, pdf), 201);
      const checks = (await pi.agent.get(`/api/proposals/${p.reference}/checks`)).body;
      expect(checks.blockers).toBe(0);
    });
  });
});
