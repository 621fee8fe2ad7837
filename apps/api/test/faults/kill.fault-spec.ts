import { createHash } from 'node:crypto';
import type { Call } from '../../src/calls/entities/call.entity.js';
import { SCIENCE_PROSE, samplePdf } from '../../src/documents/testing/sample-pdf.js';
import type { TestObservatory } from '../support/calls-factories.js';
import { makeUser } from '../support/factories.js';
import { makeOpenCall } from '../support/proposal-factories.js';
import { HttpAgent } from './support/client.js';
import { completeDraftOverHttp } from './support/data.js';
import { type ApiProcess, type FaultStack, startFaultStack } from './support/stack.js';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
/** When the kill comes after the request went out: from before the body is read to after commit. */
const KILL_AFTER_MS = [0, 15, 40, 80, 150, 300];

interface Snapshot {
  version: number;
  status: string;
  submittedVersion: number | null;
  documents: { id: string; sha256: string; current: boolean }[];
  versions: { number: number; pdfMatchesSha: boolean; scienceCaseId: string | null }[];
  audits: Record<string, number>;
  receipts: number;
}

/** Everything the database holds about one proposal that an upload or a submission changes. */
async function snapshot(stack: FaultStack, reference: string): Promise<Snapshot> {
  const ds = stack.dataSource;
  const [p] = (await ds.query(
    `SELECT id, version, status, submitted_version FROM proposals WHERE reference = $1`,
    [reference],
  )) as { id: string; version: number; status: string; submitted_version: number | null }[];
  const documents = (await ds.query(
    `SELECT id, sha256, superseded_at IS NULL AS current FROM documents
      WHERE proposal_id = $1 ORDER BY uploaded_at, id`,
    [p!.id],
  )) as Snapshot['documents'];
  const versions = (
    (await ds.query(
      `SELECT number, science_case_id,
              compiled_pdf_sha256 = encode(sha256(compiled_pdf), 'hex') AS ok
         FROM proposal_versions WHERE proposal_id = $1 ORDER BY number`,
      [p!.id],
    )) as { number: number; science_case_id: string | null; ok: boolean }[]
  ).map((v) => ({ number: v.number, pdfMatchesSha: v.ok, scienceCaseId: v.science_case_id }));
  const audits = Object.fromEntries(
    (
      (await ds.query(
        `SELECT action, count(*)::int AS n FROM audit_events WHERE subject_id = $1 GROUP BY action`,
        [p!.id],
      )) as { action: string; n: number }[]
    ).map((a) => [a.action, a.n]),
  );
  const [{ n: receipts }] = (await ds.query(
    `SELECT count(*)::int AS n FROM outbox_messages WHERE kind = 'proposal.receipt' AND subject LIKE $1`,
    [`%${reference}%`],
  )) as [{ n: number }];
  return {
    version: p!.version,
    status: p!.status,
    submittedVersion: p!.submitted_version,
    documents,
    versions,
    audits,
    receipts,
  };
}

/** Rows that belong to nothing: documents of no proposal, versions naming a missing document. */
async function orphans(stack: FaultStack): Promise<unknown[]> {
  return stack.dataSource.query(
    `SELECT 'document without proposal' AS what, d.id::text FROM documents d
       LEFT JOIN proposals p ON p.id = d.proposal_id WHERE p.id IS NULL
     UNION ALL
     SELECT 'version naming a missing document', v.id::text FROM proposal_versions v
       LEFT JOIN documents d ON d.id = v.science_case_id
      WHERE v.science_case_id IS NOT NULL AND d.id IS NULL
     UNION ALL
     SELECT 'two current science cases', proposal_id::text FROM documents
      WHERE superseded_at IS NULL GROUP BY proposal_id HAVING count(*) > 1`,
  );
}

/**
 * The API killed with SIGKILL (no shutdown hook runs) while it reads an upload, inspects it,
 * stores it, compiles a submission or commits one: after a restart each proposal is exactly as it
 * was or exactly as the request would have left it, and no document is left over.
 */
describe('the API killed during an upload and during a submission', () => {
  let stack: FaultStack;
  let api: ApiProcess;
  let array: TestObservatory;
  let call: Call;
  let agent: HttpAgent;
  let pdf: Buffer;
  /** What each kill left: 'before' (nothing happened) or 'whole' (all of it happened). */
  const outcomes = { upload: new Set<string>(), submission: new Set<string>() };

  beforeAll(async () => {
    stack = await startFaultStack('kill');
    api = await stack.startApi();
    ({ array, call } = await makeOpenCall(stack.dataSource));
    agent = new HttpAgent(api.base);
    await agent.signIn((await makeUser(stack.dataSource)).email);
    pdf = await samplePdf([SCIENCE_PROSE, SCIENCE_PROSE, SCIENCE_PROSE, SCIENCE_PROSE], {
      figure: true,
    });
  });
  afterAll(() => stack?.close());

  /** Kills the API and starts a fresh one; the session lives in PostgreSQL, so it carries over. */
  async function killAndRestart(): Promise<void> {
    await api.kill();
    api = await stack.startApi();
    agent.base = api.base;
  }

  it('an upload cut off half-way leaves the proposal as it was', async () => {
    const p = await completeDraftOverHttp(agent, array, call);
    const before = await snapshot(stack, p.reference);
    const upload = await agent.startPartialUpload(p.reference, p.version, pdf, pdf.length >> 1);
    await sleep(300);
    await killAndRestart();
    upload.abort();
    expect(await upload.answered).toBe('connection lost');
    expect(await snapshot(stack, p.reference)).toEqual(before);
    expect(await orphans(stack)).toEqual([]);
  });

  it.each(KILL_AFTER_MS)(
    'an upload killed %i ms in is either not there at all or whole',
    async (delay) => {
      const p = await completeDraftOverHttp(agent, array, call);
      // A first upload, so a second one has a current document to supersede.
      const first = await agent.upload(p.reference, p.version, await samplePdf(['First draft']));
      expect(first.status).toBe(201);
      const version = (first.body as { version: number }).version;
      const before = await snapshot(stack, p.reference);

      const answer = agent.upload(p.reference, version, pdf).catch(() => 'connection lost');
      await sleep(delay);
      await killAndRestart();
      const answered = await answer;
      const after = await snapshot(stack, p.reference);

      const sha = createHash('sha256').update(pdf).digest('hex');
      const whole: Snapshot = {
        ...before,
        version: before.version + 1,
        documents: [
          { ...before.documents[0]!, current: false },
          { id: expect.any(String) as unknown as string, sha256: sha, current: true },
        ],
        audits: {
          ...before.audits,
          'proposal.science_case_uploaded': before.audits['proposal.science_case_uploaded']! + 1,
        },
      };
      outcomes.upload.add(after.version === before.version ? 'before' : 'whole');
      if (after.version === before.version) expect(after).toEqual(before);
      else expect(after).toEqual(whole);
      // An answer that said it was stored must be true.
      if (typeof answered !== 'string' && answered.status === 201)
        expect(after.version).toBe(before.version + 1);
      expect(await orphans(stack)).toEqual([]);
    },
  );

  it.each(KILL_AFTER_MS)(
    'a submission killed %i ms in is either not there at all or whole',
    async (delay) => {
      const p = await completeDraftOverHttp(agent, array, call);
      const up = await agent.upload(p.reference, p.version, pdf);
      expect(up.status).toBe(201);
      const version = (up.body as { version: number }).version;
      const before = await snapshot(stack, p.reference);
      expect(before).toMatchObject({ status: 'draft', versions: [], receipts: 0 });

      const answer = agent
        .post(`/api/proposals/${p.reference}/submit`, { version })
        .catch(() => 'connection lost');
      await sleep(delay);
      await killAndRestart();
      const answered = await answer;
      const after = await snapshot(stack, p.reference);

      outcomes.submission.add(after.status === 'draft' ? 'before' : 'whole');
      if (after.status === 'draft') expect(after).toEqual(before);
      else
        expect(after).toEqual({
          ...before,
          version: before.version + 1,
          status: 'submitted',
          submittedVersion: 1,
          versions: [
            { number: 1, pdfMatchesSha: true, scienceCaseId: before.documents.at(-1)!.id },
          ],
          audits: { ...before.audits, 'proposal.submitted': 1 },
          receipts: 1,
        });
      if (typeof answered !== 'string' && answered.status === 200)
        expect(after.status).toBe('submitted');
      expect(await orphans(stack)).toEqual([]);
    },
  );

  it('the kills above fell both before and after the commit (so both outcomes were checked)', () => {
    expect([...outcomes.upload].sort()).toEqual(['before', 'whole']);
    expect([...outcomes.submission].sort()).toEqual(['before', 'whole']);
  });
});
