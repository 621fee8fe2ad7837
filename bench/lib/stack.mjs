// @ts-check
/**
 * What the HTTP benchmarks share: a PostgreSQL cluster, mail sink and API process of their own
 * (scripts/lib helpers, free ports, a temporary folder removed afterwards), a TypeORM DataSource
 * on the built API's entities to load data in bulk, signed-in sessions and percentiles.
 */
import 'reflect-metadata';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ROOT } from '../../scripts/lib/paths.mjs';
import { ensureDatabase, startCluster } from '../../scripts/lib/postgres.mjs';
import { freePort } from '../../scripts/lib/proc.mjs';
import { migrate, startApi, startMailSink } from '../../scripts/lib/stack.mjs';

export const DIST = new URL('../../apps/api/dist/apps/api/src/', import.meta.url);
/** @param {string} path a module of the built API, relative to its src/ */
export const api = (path) => import(new URL(path, DIST).href);

export const PASSWORD = 'bench password that is long enough 42';

/**
 * @param {string} name
 * @param {Record<string, string>} [apiEnv]
 */
export async function startBenchStack(name, apiEnv = {}) {
  const work = mkdtempSync(join(tmpdir(), `skyhours-bench-${name}-`));
  chmodSync(work, 0o755);
  const pgHome = join(work, 'pg');
  const cluster = await startCluster({
    home: pgHome,
    port: await freePort(),
    key: pgHome,
    credentialsFile: join(work, 'pg-credentials.json'),
  });
  await ensureDatabase(cluster.urlFor('postgres'), 'skyhours_bench');
  const databaseUrl = cluster.urlFor('skyhours_bench');
  const [smtpPort, inboxPort, port] = [await freePort(), await freePort(), await freePort()];
  const sink = await startMailSink({ smtpPort, inboxPort, dir: join(work, 'mail'), quiet: true });
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: 'bench-session-secret-that-is-long-enough-0123456789',
    MAIL_SMTP_HOST: '127.0.0.1',
    MAIL_SMTP_PORT: String(smtpPort),
    HOST: '127.0.0.1',
    PORT: String(port),
    WEB_DIST: '',
    // Behind a proxy: each simulated person comes from an address of their own.
    TRUST_PROXY: 'true',
    ...apiEnv,
  };
  await migrate(env);
  const { DataSource } = await import('typeorm');
  const { dataSourceOptions } = await api('database/data-source.js');
  const dataSource = new DataSource({ ...dataSourceOptions(databaseUrl), extra: { max: 4 } });
  await dataSource.initialize();
  const apiService = await startApi(env, { quiet: true });
  return {
    base: `http://127.0.0.1:${port}`,
    databaseUrl,
    dataSource,
    apiPid: /** @type {number} */ (apiService.child.pid),
    async close() {
      await apiService.stop();
      await sink.stop();
      await dataSource.destroy();
      await cluster.stop();
      rmSync(cluster.root, { recursive: true, force: true });
      rmSync(work, { recursive: true, force: true });
    },
  };
}

/**
 * Signs in over HTTP; answers the Cookie header and the CSRF token.
 * @param {string} base @param {string} email @param {string} [ip]
 */
export async function signIn(base, email, ip) {
  const headers = /** @type {Record<string, string>} */ (ip ? { 'x-forwarded-for': ip } : {});
  const csrf = await fetch(`${base}/api/auth/csrf`, { headers });
  let cookie = (csrf.headers.getSetCookie()[0] ?? '').split(';')[0] ?? '';
  const { token } = /** @type {{ token: string }} */ (await csrf.json());
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { ...headers, cookie, 'content-type': 'application/json', 'x-csrf-token': token },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}`);
  cookie = (res.headers.getSetCookie()[0] ?? cookie).split(';')[0] ?? cookie;
  const { csrfToken } = /** @type {{ csrfToken: string }} */ (await res.json());
  return { cookie, csrfToken, headers: { ...headers, cookie } };
}

/** @param {number[]} values @param {number} p in [0, 100] */
export function percentile(values, p) {
  const sorted = [...values].sort((a, b) => a - b);
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? NaN;
}

/** @param {number[]} values */
export const median = (values) => percentile(values, 50);

/** Resident memory of a process in MB, now and at its peak (Linux /proc). @param {number} pid */
export function memoryMb(pid) {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = (/** @type {string} */ key) =>
    Number(new RegExp(`${key}:\\s+(\\d+)`).exec(status)?.[1]);
  return { rss: kb('VmRSS') / 1024, hwm: kb('VmHWM') / 1024 };
}

export { ROOT };
