// @ts-check
/**
 * Throughput of `evaluateObservation` (goal: ≥ 200,000 evaluations/s).
 *
 *   npm run build -w @skyhours/calc && node bench/calc.mjs
 *
 * Plain ESM against the built library: the repository has no TypeScript runner (no tsx, no
 * vite-node) and Node 20 cannot strip types. `// @ts-check` still type-checks it in editors
 * against dist/index.d.ts.
 *
 * Each of 5 rounds runs for 2 s over 1024 varied inputs (frequencies and lines in all three
 * conventions and redshift, mosaics, targets that never rise or never set; on average about 2.5
 * of the nine checks fire per input, each with its sentence), after a 1 s warm-up. The inputs are
 * parsed from JSON text, as the server receives request bodies. Rates are printed per second
 * of CPU time (the goal is judged on these: they hold on a shared, busy machine) and per
 * wall-clock second.
 */
import { evaluateObservation, HI_REST_FREQUENCY_GHZ } from '../libs/calc/dist/index.js';

const GOAL_PER_SECOND = 200_000;
// BENCH_SMOKE=1 (npm run bench -- --smoke, and CI) runs a short round only, to prove the script works.
const SMOKE = process.env.BENCH_SMOKE === '1';
const ROUNDS = SMOKE ? 1 : 5;
const ROUND_MS = SMOKE ? 200 : 2000;
const WARM_UP_MS = SMOKE ? 100 : 1000;
const INPUTS = 1024;

/** Deterministic pseudo-random numbers in [0, 1) (a 32-bit LCG), so every run sees the same inputs. */
function makeRandom(initialState = 20240601) {
  let state = initialState >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 4294967296;
  };
}

/** @returns {import('../libs/calc/dist/index.js').ObservationInput[]} */
function makeInputs() {
  const random = makeRandom();
  const pick = /** @template T @param {T[]} xs @returns {T} */ (xs) =>
    /** @type {T} */ (xs[Math.floor(random() * xs.length)]);
  const bands = [
    { minGHz: 1, maxGHz: 2, tsysK: 28, apertureEfficiency: 0.65, maxBandwidthMHz: 1000 },
    { minGHz: 4, maxGHz: 8, tsysK: 35, apertureEfficiency: 0.6, maxBandwidthMHz: 4000 },
    { minGHz: 18, maxGHz: 26, tsysK: 60, apertureEfficiency: 0.5, maxBandwidthMHz: 8000 },
  ];
  const configurations = [
    { shortestBaselineM: 30, longestBaselineM: 3200 },
    { shortestBaselineM: 120, longestBaselineM: 36_000 },
  ];
  /** @type {import('../libs/calc/dist/index.js').ObservationInput[]} */
  const inputs = [];
  for (let i = 0; i < INPUTS; i++) {
    const band = pick(bands);
    const common = {
      array: {
        antennas: 10 + Math.floor(random() * 40),
        dishDiameterM: pick([12, 16, 25]),
        latitudeDeg: 47.3,
        longitudeDeg: -118.9,
        elevationLimitDeg: 15,
        correlatorEfficiency: 0.88,
        overheadFraction: 0.2,
        beamFactor: 1.13,
      },
      configuration: pick(configurations),
      band,
      bandwidthMHz: band.maxBandwidthMHz * (0.1 + random() * 1.1),
      polarizations: /** @type {1 | 2} */ (pick([1, 2])),
      target: {
        raDeg: random() * 360,
        decDeg: -70 + random() * 160,
        extentArcsec: pick([0, 0, 30, 600, 3000]),
        resolutionGoalArcsec: pick([null, 1, 10]),
      },
      rmsGoalMicroJy: pick([null, 5, 10, 50]),
      onSourceHours: pick([null, 0.5, 2, 8]),
    };
    const kind = i % 5;
    const centreGHz = band.minGHz + random() * (band.maxGHz - band.minGHz) * 1.1;
    if (kind < 2) {
      inputs.push({ ...common, frequencyGHz: centreGHz });
    } else if (kind === 4) {
      inputs.push({
        ...common,
        line: { restGHz: HI_REST_FREQUENCY_GHZ, redshift: random() * 0.5 },
      });
    } else {
      inputs.push({
        ...common,
        line: {
          restGHz: HI_REST_FREQUENCY_GHZ,
          velocityKmS: -500 + random() * 20_000,
          convention: pick(['radio', 'optical', 'relativistic']),
        },
      });
    }
  }
  return inputs.map((input) => JSON.parse(JSON.stringify(input)));
}

/**
 * Evaluations per second over `ms`, by the wall clock and per second of this process's CPU time
 * (user + system, all threads). On a busy machine the two differ; the CPU figure is the one that
 * does not depend on what else is running, so the goal is judged on it.
 */
function run(inputs, ms) {
  let evaluations = 0;
  let sink = 0;
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  let now = start;
  while (now - start < ms) {
    for (let i = 0; i < inputs.length; i++) {
      const result = evaluateObservation(inputs[i]);
      sink += result.checks.length + result.pointings;
    }
    evaluations += inputs.length;
    now = performance.now();
  }
  const cpu = process.cpuUsage(cpuStart);
  if (sink < 0) console.log(sink); // keeps the results observable, so nothing is optimised away
  return {
    wall: (evaluations * 1000) / (now - start),
    cpu: (evaluations * 1e6) / (cpu.user + cpu.system),
  };
}

const fmt = (/** @type {number} */ x) => Math.round(x).toLocaleString('en-US');
const inputs = makeInputs();
const checksSeen = new Set(
  inputs.flatMap((input) => evaluateObservation(input).checks.map((c) => c.code)),
);
console.log(
  `evaluateObservation: ${inputs.length} inputs raising ${checksSeen.size} of the 9 checks`,
);
run(inputs, WARM_UP_MS);

/** @type {number[]} */
const cpuRates = [];
/** @type {number[]} */
const wallRates = [];
for (let round = 1; round <= ROUNDS; round++) {
  const { wall, cpu } = run(inputs, ROUND_MS);
  cpuRates.push(cpu);
  wallRates.push(wall);
  console.log(
    `  round ${round}: ${fmt(cpu)} evaluations per CPU second (${fmt(wall)} per wall-clock second)`,
  );
}
const summary = (/** @type {number[]} */ rates) => {
  const sorted = [...rates].sort((a, b) => a - b);
  return {
    median: /** @type {number} */ (sorted[Math.floor(sorted.length / 2)]),
    min: /** @type {number} */ (sorted[0]),
    max: /** @type {number} */ (sorted.at(-1)),
  };
};
const cpu = summary(cpuRates);
const wall = summary(wallRates);
console.log(
  `evaluations/s (CPU time): median ${fmt(cpu.median)}, min ${fmt(cpu.min)}, max ${fmt(cpu.max)}` +
    ` — goal ≥ ${fmt(GOAL_PER_SECOND)} evaluations/s: ${cpu.median >= GOAL_PER_SECOND ? 'met' : 'NOT met'}`,
);
console.log(
  `evaluations/s (wall clock): median ${fmt(wall.median)}, min ${fmt(wall.min)}, max ${fmt(wall.max)}`,
);
if (!SMOKE && cpu.median < GOAL_PER_SECOND) process.exitCode = 1;
