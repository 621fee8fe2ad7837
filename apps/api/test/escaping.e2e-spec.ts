import Papa from 'papaparse';
import { standingCsv } from '../src/allocation/standing-csv.js';
import { StandingService } from '../src/allocation/standing.service.js';
import { extractPageTexts } from '../src/documents/pdf-text.js';
import { samplePdf, SCIENCE_PROSE } from '../src/documents/testing/sample-pdf.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';
import {
  completeDraft,
  mailsMatching,
  makeOpenCall,
  must,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';
import { makeCallInReview, submitReviews } from './support/review-factories.js';

/**
 * Text people type, as hostile as it gets: markup, both quotes, a spreadsheet formula, PDF string
 * delimiters and operators, a backslash and a non-Latin name.
 */
const HOSTILE = `=cmd|' /C calc'!A0 <script>alert("x")</script> & (a) Tj ET \\ Ölçü`;

const squash = (s: string) => s.replace(/\s+/g, ' ').trim();

/**
 * Stored text reaches four outputs: e-mail HTML (escaped), the compiled PDF (set as text, never
 * as PDF syntax), the standing's CSV (quoted per RFC 4180, formulas defused) and e-mail text.
 */
describe('stored text comes out escaped in HTML, PDF, CSV and e-mail', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('escapes a hostile title and name in the HTML of an invitation, keeps them in its text, and prints them as text in the compiled PDF', async () => {
    const { array, call } = await makeOpenCall(t.dataSource);
    const pi = await signedIn(t, { name: HOSTILE });
    const coi = await makeUser(t.dataSource);
    let p = await completeDraft(pi.agent, array, call, { title: HOSTILE });
    p = await must(
      pi.agent.post(`/api/proposals/${p.reference}/team`, {
        version: p.version,
        email: coi.email,
        canEdit: false,
      }),
      201,
    );
    const [mail] = await mailsMatching(coi.email, new RegExp(p.reference));
    const html = mail!.html!;
    expect(html).not.toContain('<script>');
    expect(html).not.toContain('alert("x")');
    expect(html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    expect(html).toContain('=cmd|&#39; /C calc&#39;!A0');
    // Only the markup of the message itself: one paragraph per line, no tag from the title.
    expect(html.match(/<script/gi)).toBeNull();
    expect(mail!.text).toContain(HOSTILE); // plain text needs no escaping and gets none

    const up = await uploadScienceCase(
      pi.agent,
      p.reference,
      p.version,
      await samplePdf([SCIENCE_PROSE]),
    );
    expect(up.status).toBe(201);
    const submitted = await must(
      pi.agent.post(`/api/proposals/${p.reference}/submit`, { version: up.body.version }),
    );
    expect(submitted.status).toBe('submitted');
    const pdf = await pi.agent
      .get(`/api/proposals/${p.reference}/pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const pages = await extractPageTexts(new Uint8Array(pdf.body as Buffer), 10000);
    // The cover sets the title and the PI's name as text: the PDF operators in them were
    // escaped, so the page still parses and shows them literally (pdf.js as the reader).
    expect(pages.length).toBe(2);
    expect(squash(pages[0]!)).toContain(squash(HOSTILE));
  });

  it("quotes and defuses a hostile title and PI name in the standing's CSV", async () => {
    const c = await makeCallInReview(t, { proposals: 2, referees: 2, compilePdf: false });
    await submitReviews(t, c, [
      [7, 8],
      [5, 6],
    ]);
    const hostileLines = `${HOSTILE}\r\nsecond line, with "quotes"`;
    await t.dataSource.query(`UPDATE proposals SET title = $1 WHERE id = $2`, [
      hostileLines,
      c.proposals[0]!.proposal.id,
    ]);
    await t.dataSource.query(`UPDATE users SET name = $1 WHERE id = $2`, [
      '@SUM(A1:A9)',
      c.proposals[1]!.pi.id,
    ]);
    // Until the standing's CSV route is served, through the service the route will call.
    const service = new StandingService(t.dataSource, t.clock);
    const standing = await service.build(await service.findCall(c.call.code).then((x) => x!));
    const csv = standingCsv(standing);
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(2); // the line break inside a title did not add a row
    const byRef = new Map(parsed.data.map((r) => [r.reference, r]));
    const first = byRef.get(c.proposals[0]!.proposal.reference)!;
    expect(first.title).toBe(`'${hostileLines}`); // the formula shows as text
    const second = byRef.get(c.proposals[1]!.proposal.reference)!;
    expect(Object.values(second)).toContain("'@SUM(A1:A9)");
    for (const row of parsed.data)
      for (const cell of Object.values(row)) expect(cell).not.toMatch(/^[=+@\t\r]/);
  });
});
