import { randomUUID } from 'node:crypto';
import { PDFDocument } from 'pdf-lib';
import { CompiledPdfService } from '../src/documents/compiled-pdf.service.js';
import { ScienceCaseDocument } from '../src/documents/entities/science-case-document.entity.js';
import {
  type InspectedScienceCase,
  ScienceCaseService,
} from '../src/documents/science-case.service.js';
import { SCIENCE_PROSE, samplePdf } from '../src/documents/testing/sample-pdf.js';
import { sampleSnapshot } from '../src/documents/testing/sample-snapshot.js';
import { createTestApp, type TestApp } from './support/app.js';
import { makeCall, makeObservatory } from './support/calls-factories.js';
import { makeUser } from './support/factories.js';

const limits = { maxBytes: 5_000_000, maxPages: 4 };

/** The test clock runs on from where it was set: `date` must be a moment after `iso`. */
function expectJustAfter(date: Date | null | undefined, iso: string): void {
  const ms = (date?.getTime() ?? NaN) - new Date(iso).getTime();
  expect(ms >= 0 && ms < 5000).toBe(true);
}

describe('documents (science cases in PostgreSQL)', () => {
  let t: TestApp;
  let cases: ScienceCaseService;
  let uploader: string;
  let pdfA: Buffer;
  let pdfB: Buffer;
  let inspectedA: InspectedScienceCase;
  let inspectedB: InspectedScienceCase;
  let newProposal: () => Promise<string>;

  beforeAll(async () => {
    t = await createTestApp();
    cases = t.app.get(ScienceCaseService);
    uploader = (await makeUser(t.dataSource)).id;
    // documents.proposal_id is a foreign key: each test makes its own draft proposals.
    const call = await makeCall(t.dataSource, await makeObservatory(t.dataSource));
    let number = 0;
    newProposal = async () => {
      number += 1;
      const [row] = (await t.dataSource.query(
        `INSERT INTO proposals (call_id, number, reference, title, kind)
         VALUES ($1, $2, $3, 'A draft', 'standard') RETURNING id`,
        [call.id, number, `${call.code}-${String(number).padStart(4, '0')}`],
      )) as Array<{ id: string }>;
      return row!.id;
    };
    pdfA = await samplePdf(['First draft', SCIENCE_PROSE]);
    pdfB = await samplePdf(['Second draft', SCIENCE_PROSE, SCIENCE_PROSE]);
    inspectedA = await cases.inspect(pdfA, 'draft one.pdf', limits, null);
    inspectedB = await cases.inspect(pdfB, 'draft two.pdf', limits, null);
  });
  afterEach(() => t.clock.reset());
  afterAll(() => t.close());

  const store = (proposalId: string, bytes: Buffer, inspected: InspectedScienceCase) =>
    cases.store(t.dataSource.manager, { proposalId, bytes, inspected, uploadedBy: uploader });

  it('stores an upload as the current science case, its bytes read back only when asked', async () => {
    const proposalId = await newProposal();
    t.clock.set('2027-03-01T10:00:00Z');
    const stored = await store(proposalId, pdfA, inspectedA);

    const current = await cases.current(proposalId);
    expect(current).toMatchObject({
      id: stored.id,
      proposalId,
      filename: 'draft one.pdf',
      contentType: 'application/pdf',
      sizeBytes: pdfA.length,
      pages: 2,
      sha256: inspectedA.sha256,
      uploadedBy: uploader,
      supersededAt: null,
    });
    expectJustAfter(current?.uploadedAt, '2027-03-01T10:00:00Z');
    expect(current?.content).toBeUndefined();
    expect((await cases.content(stored.id)).equals(pdfA)).toBe(true);
  });

  it('supersedes the previous upload of the same proposal, and only of that one', async () => {
    const proposalId = await newProposal();
    const other = await newProposal();
    t.clock.set('2027-03-01T10:00:00Z');
    const first = await store(proposalId, pdfA, inspectedA);
    const untouched = await store(other, pdfA, inspectedA);
    t.clock.set('2027-03-02T08:30:00Z');
    const second = await store(proposalId, pdfB, inspectedB);

    expect((await cases.current(proposalId))?.id).toBe(second.id);
    expect((await cases.current(other))?.id).toBe(untouched.id);
    const old = await t.dataSource.getRepository(ScienceCaseDocument).findOneByOrFail({
      id: first.id,
    });
    expectJustAfter(old.supersededAt, '2027-03-02T08:30:00Z');
    expect(old.supersededAt).toEqual((await cases.current(proposalId))?.uploadedAt);
    // A superseded upload keeps its bytes: a submitted version may have been made from it.
    expect((await cases.content(first.id)).equals(pdfA)).toBe(true);
  });

  it("stores within the caller's transaction, so a failed submission leaves no trace", async () => {
    const proposalId = await newProposal();
    const kept = await store(proposalId, pdfA, inspectedA);
    await expect(
      t.dataSource.transaction(async (manager) => {
        await cases.store(manager, {
          proposalId,
          bytes: pdfB,
          inspected: inspectedB,
          uploadedBy: uploader,
        });
        // Inside the transaction the new upload is already the current one.
        expect((await cases.current(proposalId, manager))?.sha256).toBe(inspectedB.sha256);
        throw new Error('the submission failed after the upload');
      }),
    ).rejects.toThrow('the submission failed');
    expect(await cases.current(proposalId)).toMatchObject({ id: kept.id, supersededAt: null });
  });

  it('leaves exactly one current science case when two uploads arrive at once', async () => {
    const proposalId = await newProposal();
    const results = await Promise.all([
      store(proposalId, pdfA, inspectedA),
      store(proposalId, pdfB, inspectedB),
      store(proposalId, pdfA, inspectedA),
    ]);
    const rows = await t.dataSource.getRepository(ScienceCaseDocument).findBy({ proposalId });
    expect(rows).toHaveLength(3);
    expect(rows.filter((r) => r.supersededAt === null)).toHaveLength(1);
    expect(results.map((r) => r.id)).toContain((await cases.current(proposalId))?.id);
  });

  it('has the database refuse a second current row, whatever code writes it', async () => {
    const proposalId = await newProposal();
    await store(proposalId, pdfA, inspectedA);
    const insert = t.dataSource.query(
      `INSERT INTO documents (proposal_id, filename, content_type, size_bytes, pages, sha256,
         content, uploaded_by)
       VALUES ($1, 'x.pdf', 'application/pdf', 1, 1, $2, '\\x25'::bytea, $3)`,
      [proposalId, inspectedA.sha256, uploader],
    );
    await expect(insert).rejects.toMatchObject({ code: '23505' });
  });

  it('refuses to store bytes other than the inspected ones', async () => {
    await expect(store(randomUUID(), pdfB, inspectedA)).rejects.toThrow(/other than the ones/);
  });

  it('answers null for a proposal without upload and 404 NOT_FOUND for an unknown document', async () => {
    expect(await cases.current(randomUUID())).toBeNull();
    expect(await cases.current('not-a-uuid')).toBeNull();
    for (const id of [randomUUID(), 'not-a-uuid']) {
      await expect(cases.content(id)).rejects.toMatchObject({
        status: 404,
        response: { statusCode: 404, code: 'NOT_FOUND', message: 'Document not found' },
      });
    }
  });

  it('compiles the stored science case behind a cover, from the services the app injects', async () => {
    const proposalId = await newProposal();
    const bytes = await samplePdf(['1', '2', '3', '4'].map((n) => `Page ${n}. ${SCIENCE_PROSE}`));
    const inspected = await cases.inspect(bytes, 'case.pdf', limits, {
      names: ['Ada Quill', 'Zoë Ngũgĩ-Łukasik'],
    });
    expect(inspected.findings).toEqual([]);
    const stored = await store(proposalId, bytes, inspected);

    const compiler = t.app.get(CompiledPdfService);
    const snapshot = sampleSnapshot({ anonymous: true });
    const compiled = await compiler.compile(snapshot, await cases.content(stored.id));
    const coverOnly = await compiler.compile(snapshot, null);
    expect((await PDFDocument.load(compiled)).getPageCount()).toBe(
      (await PDFDocument.load(coverOnly)).getPageCount() + 4,
    );
  });
});
