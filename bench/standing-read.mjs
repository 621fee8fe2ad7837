// @ts-check
/**
 * The standing's read path under load: `GET /api/calls/:code/standing` of a call with 1,000
 * submitted proposals × 5 reviews, signed in as staff, under autocannon at 50 connections, beside
 * a bare baseline measured in the same run: Node's `http` and `pg` running the very same SQL
 * (the built StandingService's statements, given a pg pool instead of TypeORM) and returning the
 * same JSON, with no Nest, no session, no guards. Goals: API ≥ 0.5 × baseline req/s, API p95 <
 * 100 ms.
 *
 *   npm run bench -- --only standing-read          (BENCH_SMOKE=1: 50 proposals, 2 s, one round)
 *
 * Everything runs on this machine: PostgreSQL, the API, the baseline and autocannon share its
 * cores, so the figures are for a 2-core box, not for a server.
 */
import 'reflect-metadata';
import { createServer } from 'node:http';
import autocannon from 'autocannon';
import pg from 'pg';
import { makeCall, makeProposals, makeReviews, makeUsers } from './lib/call-data.mjs';
import { api, median, percentile, signIn, startBenchStack } from './lib/stack.mjs';

const SMOKE = process.env.BENCH_SMOKE === '1';
const PROPOSALS = SMOKE ? 50 : 1000;
const REVIEWERS = 5;
const CONNECTIONS = SMOKE ? 10 : 50;
const SECONDS = SMOKE ? 2 : 10;
const ROUNDS = SMOKE ? 1 : 3;
const GOAL_RATIO = 0.5;
const GOAL_P95_MS = 100;

const stack = await startBenchStack('standing');
/** @type {import('node:http').Server | undefined} */
let baseline;
let pool;
try {
  const ds = stack.dataSource;
  const started = Date.now();
  const c = await makeCall(ds, { status: 'deliberation', deadlineInDays: -5 });
  const pis = await makeUsers(ds, PROPOSALS, 'pi');
  const referees = await makeUsers(ds, REVIEWERS, 'referee');
  const [staff] = await makeUsers(ds, 1, 'staff', ['staff']);
  const proposals = await makeProposals(ds, c, pis, 'submitted');
  await makeReviews(
    ds,
    proposals.map((p) => p.id),
    referees.map((r) => r.id),
  );
  await ds.query('ANALYZE');
  console.log(
    `loaded ${PROPOSALS} proposals × ${REVIEWERS} reviews in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );

  // The bare baseline: the same statements through a plain pg pool, the same JSON.
  const { StandingService } = await api('allocation/standing.service.js');
  pool = new pg.Pool({ connectionString: stack.databaseUrl, max: 20 });
  const manager = {
    query: async (/** @type {string} */ sql, /** @type {unknown[]} */ params) =>
      (await pool.query(sql, params)).rows,
  };
  const service = new StandingService(null, { now: () => new Date() });
  baseline = createServer(async (req, res) => {
    try {
      const call = await service.findCall(c.call.code, manager);
      const body = JSON.stringify(await service.build(call, manager));
      res.writeHead(200, { 'content-type': 'application/json; charset=utf-8' }).end(body);
    } catch (error) {
      res.writeHead(500).end(String(error));
    }
  });
  await new Promise((resolve) => baseline?.listen(0, '127.0.0.1', () => resolve(undefined)));
  const address = baseline.address();
  const baselineUrl = `http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}/`;

  const session = await signIn(stack.base, staff.email);
  const apiUrl = `${stack.base}/api/calls/${c.call.code}/standing`;
  const [fromApi, fromBaseline] = await Promise.all([
    fetch(apiUrl, { headers: session.headers }).then((r) => r.json()),
    fetch(baselineUrl).then((r) => r.json()),
  ]);
  if (fromApi.rows?.length !== PROPOSALS)
    throw new Error(`the API's standing has ${fromApi.rows?.length} rows`);
  if (JSON.stringify(fromApi) !== JSON.stringify(fromBaseline))
    throw new Error('the baseline does not answer the same JSON as the API');
  const bytes = JSON.stringify(fromApi).length;

  /** One autocannon run; latencies of every response, for exact percentiles. @param {string} url @param {Record<string, string>} headers */
  const load = (url, headers) =>
    new Promise((resolve, reject) => {
      /** @type {number[]} */
      const latencies = [];
      const instance = autocannon(
        // A long timeout: a slow answer is measured as slow, not dropped from the percentiles.
        { url, headers, connections: CONNECTIONS, duration: SECONDS, timeout: 120 },
        (error, result) =>
          error
            ? reject(error)
            : resolve({
                rps: result.requests.total / (result.duration || SECONDS),
                p50: percentile(latencies, 50),
                p95: percentile(latencies, 95),
                p99: percentile(latencies, 99),
                non2xx: result.non2xx + result.errors + result.timeouts,
                count: latencies.length,
              }),
      );
      instance.on('response', (_client, _status, _bytes, ms) => latencies.push(ms));
    });

  /** One request at a time, nothing else running: the floor under any latency. @param {string} url @param {Record<string, string>} headers */
  const alone = async (url, headers) => {
    const times = [];
    for (let i = 0; i < (SMOKE ? 2 : 7); i++) {
      const t0 = performance.now();
      await (await fetch(url, { headers })).arrayBuffer();
      times.push(performance.now() - t0);
    }
    return median(times.slice(1));
  };
  const aloneApi = await alone(apiUrl, session.headers);
  const aloneBase = await alone(baselineUrl, {});
  console.log(
    `one request alone (median): API ${aloneApi.toFixed(0)} ms, baseline ${aloneBase.toFixed(0)} ms`,
  );

  await load(apiUrl, session.headers); // warm-up (JIT, pools, caches), not counted
  /** @type {any[]} */
  const apiRuns = [];
  /** @type {any[]} */
  const baseRuns = [];
  for (let round = 0; round < ROUNDS; round++) {
    apiRuns.push(await load(apiUrl, session.headers));
    baseRuns.push(await load(baselineUrl, {}));
  }
  const summary = (/** @type {any[]} */ runs) => ({
    rps: median(runs.map((r) => r.rps)),
    p50: median(runs.map((r) => r.p50)),
    p95: median(runs.map((r) => r.p95)),
    p99: median(runs.map((r) => r.p99)),
    non2xx: runs.reduce((s, r) => s + r.non2xx, 0),
    count: runs.reduce((s, r) => s + r.count, 0),
  });
  const a = summary(apiRuns);
  const b = summary(baseRuns);
  const ratio = a.rps / b.rps;
  const line = (/** @type {string} */ name, /** @type {any} */ s) =>
    `${name.padEnd(9)} ${s.rps.toFixed(1).padStart(7)} req/s   p50 ${s.p50.toFixed(0)} ms   p95 ${s.p95.toFixed(0)} ms   p99 ${s.p99.toFixed(0)} ms   (${s.count} answers, ${s.non2xx} failed)`;
  console.log(
    `standing of ${PROPOSALS} proposals × ${REVIEWERS} reviews (${(bytes / 1024).toFixed(0)} KB of JSON), ${CONNECTIONS} connections, ${ROUNDS} × ${SECONDS} s each (medians):`,
  );
  console.log(line('API', a));
  console.log(line('baseline', b));
  const ratioOk = ratio >= GOAL_RATIO;
  const p95Ok = a.p95 < GOAL_P95_MS;
  console.log(
    `ratio     ${ratio.toFixed(2)} × baseline   goal ≥ ${GOAL_RATIO}   ${ratioOk ? 'met' : 'MISSED'}`,
  );
  console.log(
    `API p95   ${a.p95.toFixed(0)} ms   goal < ${GOAL_P95_MS} ms   ${p95Ok ? 'met' : 'MISSED'}`,
  );
  if (a.non2xx > 0 || b.non2xx > 0) throw new Error('some requests failed');
  if (!SMOKE && !(ratioOk && p95Ok)) process.exitCode = 1;
} finally {
  baseline?.close();
  await pool?.end();
  await stack.close();
}
