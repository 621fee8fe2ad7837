// @ts-check
/**
 * The deadline rush: 300 proposers, each with a complete draft, upload a 2 MB science case and
 * submit it, their starts spread evenly over one minute (as the last minute before a deadline).
 * Goals: every submission lands (each proposal submitted exactly once: one version, one receipt,
 * none lost, none doubled), p95 of the submit request under 2 s, and the API's resident memory
 * under 1 GB (VmRSS sampled from /proc every 200 ms, and VmHWM, its peak, at the end).
 *
 *   npm run bench -- --only deadline-rush          (BENCH_SMOKE=1: 10 proposers over 5 s)
 *
 * Each proposer signs in before the rush (its own address, as behind a proxy); the science case
 * is a valid 4-page PDF made to weigh 2 MB with an embedded file of random bytes (incompressible).
 */
import { randomBytes } from 'node:crypto';
import { PDFDocument, StandardFonts } from 'pdf-lib';
import { makeCall, makeProposals, makeUsers } from './lib/call-data.mjs';
import { memoryMb, percentile, signIn, startBenchStack } from './lib/stack.mjs';

const SMOKE = process.env.BENCH_SMOKE === '1';
const PROPOSERS = SMOKE ? 10 : 300;
const SPREAD_MS = SMOKE ? 5_000 : 60_000;
const SIZE_BYTES = 2 * 1024 * 1024;
const GOAL_P95_MS = 2000;
const GOAL_MEMORY_MB = 1024;

/** A 4-page PDF of about `size` bytes. @param {number} size */
async function heavyPdf(size) {
  const doc = await PDFDocument.create();
  const font = await doc.embedFont(StandardFonts.Helvetica);
  for (let i = 1; i <= 4; i++)
    doc.addPage().drawText(`Science case, page ${i} (invented)`, { x: 60, y: 760, size: 12, font });
  await doc.attach(randomBytes(size - 4000), 'simulated-data.bin', {
    mimeType: 'application/octet-stream',
  });
  return Buffer.from(await doc.save());
}

const stack = await startBenchStack('rush');
const sleep = (/** @type {number} */ ms) => new Promise((r) => setTimeout(r, ms));
try {
  const ds = stack.dataSource;
  const c = await makeCall(ds, { status: 'open', deadlineInDays: 1, maxMb: 10 });
  const pis = await makeUsers(ds, PROPOSERS, 'proposer');
  const proposals = await makeProposals(ds, c, pis, 'draft');
  await ds.query(
    `UPDATE proposals SET abstract = 'An invented abstract for the deadline rush.' WHERE call_id = $1`,
    [c.call.id],
  );
  const pdf = await heavyPdf(SIZE_BYTES);

  // Sign in beforehand, a few at a time (scrypt is meant to be slow).
  /** @type {Awaited<ReturnType<typeof signIn>>[]} */
  const sessions = [];
  for (let i = 0; i < PROPOSERS; i += 8)
    sessions.push(
      ...(await Promise.all(
        pis
          .slice(i, i + 8)
          .map((pi, j) => signIn(stack.base, pi.email, `10.9.${(i + j) >> 8}.${(i + j) % 256}`)),
      )),
    );

  /** @type {number[]} */
  const rss = [];
  const sampler = setInterval(() => rss.push(memoryMb(stack.apiPid).rss), 200);
  /** @type {{ upload: number, submit: number, uploadStatus: number, submitStatus: number }[]} */
  const results = [];
  const start = Date.now();
  await Promise.all(
    proposals.map(async (p, i) => {
      await sleep((i * SPREAD_MS) / PROPOSERS);
      const s = /** @type {Awaited<ReturnType<typeof signIn>>} */ (sessions[i]);
      const form = new FormData();
      form.set('version', '1');
      form.set('file', new Blob([pdf], { type: 'application/pdf' }), 'science-case.pdf');
      let t0 = performance.now();
      const up = await fetch(`${stack.base}/api/proposals/${p.reference}/documents`, {
        method: 'POST',
        headers: { ...s.headers, 'x-csrf-token': s.csrfToken },
        body: form,
      });
      const uploadMs = performance.now() - t0;
      const uploaded = /** @type {{ version?: number }} */ (await up.json());
      t0 = performance.now();
      const sub = await fetch(`${stack.base}/api/proposals/${p.reference}/submit`, {
        method: 'POST',
        headers: { ...s.headers, 'x-csrf-token': s.csrfToken, 'content-type': 'application/json' },
        body: JSON.stringify({ version: uploaded.version ?? 2 }),
      });
      const submitMs = performance.now() - t0;
      const body = await sub.text();
      if (sub.status !== 200)
        console.error(`${p.reference}: submit ${sub.status} ${body.slice(0, 300)}`);
      results.push({
        upload: uploadMs,
        submit: submitMs,
        uploadStatus: up.status,
        submitStatus: sub.status,
      });
    }),
  );
  const wallS = (Date.now() - start) / 1000;
  clearInterval(sampler);
  const memory = memoryMb(stack.apiPid);

  const [landed] = await ds.query(
    `SELECT count(*) FILTER (WHERE p.status = 'submitted' AND p.submitted_version = 1)::int AS submitted,
            (SELECT count(*)::int FROM proposal_versions v JOIN proposals q ON q.id = v.proposal_id WHERE q.call_id = $1) AS versions,
            (SELECT count(*)::int FROM outbox_messages WHERE kind = 'proposal.receipt' AND subject LIKE $2) AS receipts,
            (SELECT count(*)::int FROM documents d JOIN proposals q ON q.id = d.proposal_id WHERE q.call_id = $1) AS documents
       FROM proposals p WHERE p.call_id = $1`,
    [c.call.id, `%${c.call.code}-%`],
  );
  const ok = results.filter((r) => r.uploadStatus === 201 && r.submitStatus === 200).length;
  const submitP95 = percentile(
    results.map((r) => r.submit),
    95,
  );
  const peakRss = Math.max(memory.hwm, ...rss);
  console.log(
    `${PROPOSERS} proposers, 2 MB science case each, starts over ${SPREAD_MS / 1000} s; all done in ${wallS.toFixed(1)} s`,
  );
  console.log(
    `answers   ${ok}/${PROPOSERS} upload 201 + submit 200; in the database: ${landed.submitted} submitted, ${landed.versions} versions, ${landed.documents} documents, ${landed.receipts} receipts queued`,
  );
  console.log(
    `upload    p50 ${percentile(
      results.map((r) => r.upload),
      50,
    ).toFixed(0)} ms   p95 ${percentile(
      results.map((r) => r.upload),
      95,
    ).toFixed(0)} ms`,
  );
  console.log(
    `submit    p50 ${percentile(
      results.map((r) => r.submit),
      50,
    ).toFixed(
      0,
    )} ms   p95 ${submitP95.toFixed(0)} ms   max ${Math.max(...results.map((r) => r.submit)).toFixed(0)} ms   goal p95 < ${GOAL_P95_MS} ms`,
  );
  console.log(
    `memory    API VmRSS peak sampled ${Math.max(...rss).toFixed(0)} MB, VmHWM ${memory.hwm.toFixed(0)} MB   goal < ${GOAL_MEMORY_MB} MB`,
  );
  const allLanded =
    ok === PROPOSERS &&
    landed.submitted === PROPOSERS &&
    landed.versions === PROPOSERS &&
    landed.receipts === PROPOSERS &&
    landed.documents === PROPOSERS;
  console.log(`landed    ${allLanded ? 'every submission once: met' : 'MISSED (lost or doubled)'}`);
  console.log(`p95       ${submitP95 < GOAL_P95_MS ? 'met' : 'MISSED'}`);
  console.log(`memory    ${peakRss < GOAL_MEMORY_MB ? 'met' : 'MISSED'}`);
  if (!allLanded) process.exitCode = 1;
  if (!SMOKE && !(submitP95 < GOAL_P95_MS && peakRss < GOAL_MEMORY_MB)) process.exitCode = 1;
} finally {
  await stack.close();
}
