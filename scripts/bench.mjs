// @ts-check
/**
 * `npm run bench`: builds what the benchmarks need, runs every benchmark in bench/ one after
 * another and prints each one's figures with its goal beside it. `--smoke` runs each briefly
 * (BENCH_SMOKE=1), only to prove the scripts work — figures from a smoke run mean nothing.
 * `--only name,name` runs some (names as in the list below); `--no-build` skips the build (npm
 * test has built everything already). Exits non-zero when a benchmark
 * fails to run or misses its goal (in a full run).
 */
import { join } from 'node:path';
import { ROOT } from './lib/paths.mjs';
import { run, runStatus } from './lib/proc.mjs';

/** Each benchmark: its script in bench/ and the workspaces it needs built. */
const BENCHES = [
  { name: 'calc', file: 'calc.mjs', builds: ['@skyhours/calc'] },
  { name: 'compiled-pdf', file: 'compiled-pdf.mjs', builds: ['@skyhours/calc', '@skyhours/api'] },
  { name: 'web-bundle', file: 'web-bundle.mjs', builds: ['@skyhours/calc', '@skyhours/web'] },
  // Goal: API ≥ 0.5 × a bare http + pg baseline in req/s, p95 < 100 ms (1,000 × 5 reviews, 50 connections).
  {
    name: 'standing-read',
    file: 'standing-read.mjs',
    builds: ['@skyhours/calc', '@skyhours/mail-sink', '@skyhours/api'],
  },
  // Goal: 300 × (2 MB upload + submit) in a minute, every one landing once; submit p95 < 2 s; API RSS < 1 GB.
  {
    name: 'deadline-rush',
    file: 'deadline-rush.mjs',
    builds: ['@skyhours/calc', '@skyhours/mail-sink', '@skyhours/api'],
  },
];

const args = process.argv.slice(2);
const smoke = args.includes('--smoke');
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? (args[onlyAt + 1] ?? '').split(',').filter(Boolean) : null;
const unknown = only?.filter((n) => !BENCHES.some((b) => b.name === n)) ?? [];
if (unknown.length) {
  console.error(
    `unknown benchmark(s): ${unknown.join(', ')}; known: ${BENCHES.map((b) => b.name).join(', ')}`,
  );
  process.exit(2);
}
const chosen = BENCHES.filter((b) => !only || only.includes(b.name));

const builds = [...new Set(chosen.flatMap((b) => b.builds))];
if (!args.includes('--no-build')) {
  console.log(`Building ${builds.join(', ')}…`);
  await run('npm', ['run', 'build', ...builds.flatMap((w) => ['-w', w])], {
    cwd: ROOT,
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

const env = { ...process.env, ...(smoke ? { BENCH_SMOKE: '1' } : {}) };
/** @type {{ name: string, code: number }[]} */
const results = [];
for (const bench of chosen) {
  console.log(`\n━━━ ${bench.name}${smoke ? ' (smoke)' : ''} ━━━`);
  const code = await runStatus(process.execPath, [join(ROOT, 'bench', bench.file)], {
    cwd: ROOT,
    env,
  });
  results.push({ name: bench.name, code });
}

console.log('\nbenchmark      result');
for (const r of results)
  console.log(
    `${r.name.padEnd(14)} ${r.code !== 0 ? `exit ${r.code}` : smoke ? 'ran' : 'ran, goal met'}`,
  );
if (smoke) console.log('\n(smoke run: the figures above only show that each benchmark runs)');
process.exit(results.some((r) => r.code !== 0) ? 1 : 0);
