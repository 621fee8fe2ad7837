// @ts-check
/**
 * Time to compile a proposal's PDF (cover + a 4-page science case), goal: median < 300 ms.
 *
 *   npm run build -w @skyhours/calc -w @skyhours/api && node bench/compiled-pdf.mjs
 *
 * Plain ESM against the built API (the repository has no TypeScript runner). The science case
 * is made once with pdfkit (text and a vector figure on each page); the snapshot has the four
 * invented team members (one name beyond Latin-1, so a second font subset is embedded) and 8
 * observations. After 3 warm-up compilations, 30 are timed one after another; the first, cold
 * one (fonts read and parsed, pdf-lib and pdfkit loaded) is reported on its own. Each is timed
 * in wall-clock and CPU time: on a shared machine the CPU time is the steadier figure.
 */
const DIST = new URL('../apps/api/dist/apps/api/src/documents/', import.meta.url);
const { CompiledPdfService } = await import(new URL('compiled-pdf.service.js', DIST).href);
const { sampleSnapshot } = await import(new URL('testing/sample-snapshot.js', DIST).href);
const { samplePdf, SCIENCE_PROSE } = await import(new URL('testing/sample-pdf.js', DIST).href);

const GOAL_MS = 300;
// BENCH_SMOKE=1 (npm run bench -- --smoke, and CI) times a few only, to prove the script works.
const SMOKE = process.env.BENCH_SMOKE === '1';
const RUNS = SMOKE ? 3 : 30;
const WARM_UP = SMOKE ? 1 : 3;

const service = new CompiledPdfService();
const scienceCase = await samplePdf(
  [1, 2, 3, 4].map((n) => `${n}. Science case\n\n${SCIENCE_PROSE}${SCIENCE_PROSE}`),
  { figure: true },
);
const snapshot = sampleSnapshot({ observations: 8 });

/** One compilation's wall-clock and CPU milliseconds, and its size. */
async function compileOnce() {
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  const bytes = await service.compile(snapshot, scienceCase);
  const wall = performance.now() - start;
  const cpu = process.cpuUsage(cpuStart);
  return { wall, cpu: (cpu.user + cpu.system) / 1000, bytes: bytes.length };
}

const cold = await compileOnce();
for (let i = 1; i < WARM_UP; i++) await compileOnce();
/** @type {number[]} */
const wall = [];
/** @type {number[]} */
const cpu = [];
let size = 0;
for (let i = 0; i < RUNS; i++) {
  const run = await compileOnce();
  wall.push(run.wall);
  cpu.push(run.cpu);
  size = run.bytes;
}

const percentile = (/** @type {number[]} */ xs, /** @type {number} */ p) => {
  const sorted = [...xs].sort((a, b) => a - b);
  return /** @type {number} */ (
    sorted[Math.min(sorted.length - 1, Math.ceil(p * sorted.length) - 1)]
  );
};
const ms = (/** @type {number} */ x) => `${x.toFixed(1)} ms`;
const median = percentile(wall, 0.5);
console.log(
  `compiled PDF: cover for ${snapshot.observations.length} observations + a ${scienceCase.length.toLocaleString('en-US')}-byte 4-page science case → ${size.toLocaleString('en-US')} bytes`,
);
console.log(`  first (cold) compilation: ${ms(cold.wall)} wall, ${ms(cold.cpu)} CPU`);
console.log(
  `  ${RUNS} runs, wall clock: median ${ms(median)}, p95 ${ms(percentile(wall, 0.95))}` +
    ` — goal < ${GOAL_MS} ms: ${median < GOAL_MS ? 'met' : 'NOT met'}`,
);
console.log(
  `  ${RUNS} runs, CPU time:   median ${ms(percentile(cpu, 0.5))}, p95 ${ms(percentile(cpu, 0.95))}`,
);
if (!SMOKE && median >= GOAL_MS) process.exitCode = 1;
