import { samplePdf } from '../src/documents/testing/sample-pdf.js';
import { createTestApp, type TestApp } from './support/app.js';
import {
  completeDraft,
  makeOpenCall,
  signedIn,
  uploadScienceCase,
} from './support/proposal-factories.js';

/**
 * File names as a hostile or careless client sends them. Each is stored as a plain name (no
 * folder, no control character) and comes back in a Content-Disposition that nothing in it can
 * end or extend, with nosniff.
 */
const NAMES: [label: string, sent: string][] = [
  ['a Unix path climbing out', '../../../etc/passwd.pdf'],
  ['a Windows path', 'C:\\Users\\someone\\Desktop\\case.pdf'],
  ['a header split', 'case.pdf"\r\nSet-Cookie: stolen=1\r\nX-Evil: 1'],
  ['control and format characters', 'ca\tse\u0085\u200b\u2028\u0091.pdf'],
  ['bidirectional override', 'case\u202Efdp.exe.pdf'],
  ['a parameter injection', "case.pdf\"; filename*=UTF-8''evil.html"],
  ['markup', '<img src=x onerror=alert(1)>.pdf'],
  ['a reserved Windows name', 'CON.pdf'],
  ['only dots', '....'],
  ['non-Latin', 'Ölçü 観測 計画.pdf'],
  ['very long', `${'long'.repeat(200)}.pdf`],
];

describe('science-case file names are stored and served safely', () => {
  let t: TestApp;
  let pdf: Buffer;
  beforeAll(async () => {
    t = await createTestApp();
    pdf = await samplePdf(['One page']);
  });
  afterAll(() => t.close());

  it.each(NAMES)('%s', async (_label, sent) => {
    const { array, call } = await makeOpenCall(t.dataSource);
    const { agent } = await signedIn(t);
    const p = await completeDraft(agent, array, call);
    const up = await uploadScienceCase(agent, p.reference, p.version, pdf, sent);
    expect({ status: up.status, body: up.body }).toMatchObject({ status: 201 });

    const [row] = (await t.dataSource.query(
      `SELECT d.filename FROM documents d JOIN proposals p ON p.id = d.proposal_id
        WHERE p.reference = $1 AND d.superseded_at IS NULL`,
      [p.reference],
    )) as { filename: string }[];
    const stored = row!.filename;
    expect(stored).not.toMatch(/[/\\]/); // no folder
    expect(stored).not.toMatch(/[\p{Cc}\p{Cf}]/u); // no control or format character
    expect(stored).not.toMatch(/["<>]/);
    expect(stored).toMatch(/\.pdf$/);
    expect([...stored].length).toBeLessThanOrEqual(200);

    const res = await agent.get(`/api/proposals/${p.reference}/documents/science-case`);
    expect(res.status).toBe(200);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(String(res.headers['set-cookie'] ?? '')).not.toContain('stolen');
    expect(res.headers['x-evil']).toBeUndefined();
    const disposition = res.headers['content-disposition'] as string;
    // attachment; a quoted ASCII filename; and at most one RFC 5987 filename* — nothing else.
    expect(disposition).toMatch(
      /^attachment; filename="[\x20-\x21\x23-\x24\x26-\x5b\x5d-\x7e]*"(; filename\*=UTF-8''[A-Za-z0-9!#$&+.^_`|~%-]+)?$/,
    );
    const star = /filename\*=UTF-8''(.+)$/.exec(disposition)?.[1];
    expect(
      star === undefined ? /filename="(.*)"/.exec(disposition)![1] : decodeURIComponent(star),
    ).toBe(stored);
  });

  it('refuses with a 400 envelope a part header that is not well-formed (a NUL in the name)', async () => {
    const { array, call } = await makeOpenCall(t.dataSource);
    const { agent } = await signedIn(t);
    const p = await completeDraft(agent, array, call);
    const up = await uploadScienceCase(agent, p.reference, p.version, pdf, 'ca\u0000se.pdf');
    expect({ status: up.status, body: up.body }).toMatchObject({
      status: 400,
      body: { statusCode: 400, code: 'BAD_UPLOAD', issues: [{ path: 'file' }] },
    });
    const [{ n }] = (await t.dataSource.query(
      `SELECT count(*)::int AS n FROM documents d JOIN proposals p ON p.id = d.proposal_id
        WHERE p.reference = $1`,
      [p.reference],
    )) as [{ n: number }];
    expect(n).toBe(0);
  });
});
