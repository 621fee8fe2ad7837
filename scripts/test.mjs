// @ts-check
/**
 * `npm test`: lint, typecheck, build, then every suite against throwaway services — its own
 * PostgreSQL cluster and mail sink, removed afterwards — ending with one line
 * `N passed, N failed`. `npm test -- --only api-e2e,web` runs some suites, `--filter auth` only the
 * test files whose path contains "auth"; `--list` names the suites.
 */
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { checkNode, ensureBuilt, ensureDependencies } from './lib/preflight.mjs';

checkNode();
await ensureDependencies();

const { ROOT, WEB_DIST } = await import('./lib/paths.mjs');
const { freePort, runStatus } = await import('./lib/proc.mjs');
const { ensureDatabase, startCluster } = await import('./lib/postgres.mjs');
const { loadDemo, migrate, startApi, startMailSink } = await import('./lib/stack.mjs');
const { ensureChromium } = await import('./lib/chromium.mjs');

const SUITES = [
  'lint',
  'typecheck',
  'calc',
  'mail-sink',
  'api-unit',
  'web',
  'bench',
  'api-e2e',
  'faults',
  'browser',
];
const argv = process.argv.slice(2);
if (argv.includes('--list')) {
  console.log(SUITES.join('\n'));
  process.exit(0);
}
const onlyArg = argv[argv.indexOf('--only') + 1];
const only = argv.includes('--only') && onlyArg ? new Set(onlyArg.split(',')) : null;
const wanted = (/** @type {string} */ name) => !only || only.has(name);
/** `--filter text`: only test files whose path contains text (passed to jest and vitest). */
const filter = argv.includes('--filter') ? argv[argv.indexOf('--filter') + 1] : undefined;

const work = mkdtempSync(join(tmpdir(), 'skyhours-test-'));
chmodSync(work, 0o755); // the postgres user must reach the cluster's folder
const reports = join(work, 'reports');
mkdirSync(reports);
/** @type {(() => Promise<void>)[]} */
const cleanups = [];
/** @type {{ name: string, passed: number, failed: number, skipped: number, note?: string }[]} */
const results = [];
let interrupted = false;

async function cleanup() {
  for (const step of cleanups.reverse()) await step().catch((err) => console.error(String(err)));
  cleanups.length = 0;
  rmSync(work, { recursive: true, force: true });
}
for (const signal of /** @type {const} */ (['SIGINT', 'SIGTERM'])) {
  process.on(signal, () => {
    interrupted = true;
    void cleanup().finally(() => process.exit(130));
  });
}

/**
 * A suite whose runner writes a jest-style JSON report (jest --json, vitest's json reporter).
 * @param {string} name
 * @param {string[]} args command and arguments
 * @param {NodeJS.ProcessEnv} [env]
 */
async function suite(name, args, env = process.env) {
  if (!wanted(name) || interrupted) return;
  banner(name);
  const report = join(reports, `${name}.json`);
  const [command, ...rest] = args;
  const code = await runStatus(
    /** @type {string} */ (command),
    rest.map((a) => a.replace('{report}', report)),
    { cwd: ROOT, env },
  );
  if (existsSync(report)) {
    const r = JSON.parse(readFileSync(report, 'utf8'));
    const failed = r.numFailedTests + (code !== 0 && r.numFailedTests === 0 ? 1 : 0);
    results.push({
      name,
      passed: r.numPassedTests,
      failed,
      skipped: r.numPendingTests + (r.numTodoTests ?? 0),
      note: failed > r.numFailedTests ? `runner exit ${code}` : undefined,
    });
  } else {
    results.push({
      name,
      passed: 0,
      failed: 1,
      skipped: 0,
      note: `runner exit ${code}, no report`,
    });
  }
}

/**
 * A check that passes or fails as a whole (lint, typecheck).
 * @param {string} name
 * @param {string[]} args
 */
async function check(name, args) {
  if (!wanted(name) || interrupted) return;
  banner(name);
  const [command, ...rest] = args;
  const code = await runStatus(/** @type {string} */ (command), rest, { cwd: ROOT });
  results.push({ name, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1, skipped: 0 });
}

/** @param {string} name */
function banner(name) {
  console.log(`\n━━━ ${name} ━━━`);
}

const vitest = (/** @type {string} */ config) => [
  'npx',
  'vitest',
  'run',
  '--config',
  config,
  '--reporter=default',
  '--reporter=json',
  '--outputFile.json={report}',
  ...(filter ? [filter] : []),
];
const jest = (/** @type {string} */ config, /** @type {string[]} */ extra = []) => [
  'npx',
  'jest',
  '-c',
  config,
  '--json',
  '--outputFile={report}',
  ...extra,
  ...(filter ? [filter] : []),
];

try {
  await check('lint', ['npm', 'run', '--silent', 'lint']);
  await check('typecheck', ['npm', 'run', '--silent', 'typecheck']);

  const needsServices = ['api-e2e', 'browser'].some(wanted);
  const needsBuild =
    needsServices || ['calc', 'mail-sink', 'api-unit', 'web', 'bench', 'faults'].some(wanted);
  if (needsBuild) await ensureBuilt();

  await suite('calc', vitest('libs/calc/vitest.config.ts'));
  await suite('mail-sink', vitest('mail-sink/vitest.config.ts'));
  await suite('api-unit', jest('apps/api/jest.config.cjs'), {
    ...process.env,
    NODE_OPTIONS: '--experimental-vm-modules',
  });
  await suite('web', vitest('apps/web/vitest.config.ts'));
  // A short run of every benchmark, proving each still runs (its figures mean nothing).
  await check('bench', ['node', 'scripts/bench.mjs', '--smoke', '--no-build']);

  // Fault tests start (and stop, restart, kill) PostgreSQL, mail sink and API processes of their own.
  await suite('faults', jest('apps/api/test/faults/jest-faults.config.cjs', ['--runInBand']), {
    ...process.env,
    NODE_OPTIONS: '--experimental-vm-modules',
  });

  if (needsServices && !interrupted) {
    banner('services');
    const pgHome = join(work, 'pg');
    const cluster = await startCluster({
      home: pgHome,
      port: await freePort(),
      key: pgHome,
      credentialsFile: join(work, 'pg-credentials.json'),
    });
    cleanups.push(async () => {
      await cluster.stop();
      rmSync(cluster.root, { recursive: true, force: true });
    });
    const [smtpPort, inboxPort] = [await freePort(), await freePort()];
    const sink = await startMailSink({ smtpPort, inboxPort, dir: join(work, 'mail'), quiet: true });
    cleanups.push(() => sink.stop());
    const common = {
      ...process.env,
      NODE_ENV: 'test',
      SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
      MAIL_SMTP_HOST: '127.0.0.1',
      MAIL_SMTP_PORT: String(smtpPort),
      MAIL_SINK_URL: `http://127.0.0.1:${inboxPort}`,
    };

    if (wanted('api-e2e')) {
      await ensureDatabase(cluster.urlFor('postgres'), 'skyhours_e2e_test');
      await suite('api-e2e', jest('apps/api/test/jest-e2e.config.cjs', ['--runInBand']), {
        ...common,
        DATABASE_URL: cluster.urlFor('skyhours_e2e_test'),
        NODE_OPTIONS: '--experimental-vm-modules',
      });
    }

    if (wanted('browser') && !interrupted) {
      await ensureChromium();
      await ensureDatabase(cluster.urlFor('postgres'), 'skyhours_browser_test');
      const port = await freePort();
      const env = {
        ...common,
        DATABASE_URL: cluster.urlFor('skyhours_browser_test'),
        HOST: '127.0.0.1',
        PORT: String(port),
        WEB_DIST,
        OUTBOX_POLL_MS: '200',
      };
      await migrate(env);
      await loadDemo(env, 'load');
      const api = await startApi(env, { quiet: true });
      cleanups.push(() => api.stop());
      await suite('browser', vitest('apps/web/e2e/vitest.e2e.config.ts'), {
        ...env,
        SKYHOURS_URL: `http://127.0.0.1:${port}`,
      });
    }
  }
} catch (err) {
  console.error(`\nnpm test could not finish: ${err instanceof Error ? err.message : String(err)}`);
  results.push({ name: 'harness', passed: 0, failed: 1, skipped: 0, note: 'see the error above' });
} finally {
  await cleanup();
}

const total = results.reduce(
  (sum, r) => ({
    passed: sum.passed + r.passed,
    failed: sum.failed + r.failed,
    skipped: sum.skipped + r.skipped,
  }),
  { passed: 0, failed: 0, skipped: 0 },
);
console.log('\nsuite        passed  failed  skipped');
for (const r of results) {
  console.log(
    `${r.name.padEnd(12)} ${String(r.passed).padStart(6)}  ${String(r.failed).padStart(6)}  ${String(r.skipped).padStart(7)}${r.note ? `  (${r.note})` : ''}`,
  );
}
console.log(
  `\n${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`,
);
process.exit(total.failed > 0 || total.passed === 0 ? 1 : 0);
