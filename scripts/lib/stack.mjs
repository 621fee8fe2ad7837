// @ts-check
/** The pieces `npm start`, `npm run dev` and `npm test` bring up: database, mail sink, API. */
import { join } from 'node:path';
import { API_DEMO, API_MAIN, API_MIGRATE, MAIL_SINK_CLI, ROOT } from './paths.mjs';
import { ensureDatabase, startCluster } from './postgres.mjs';
import { run, startService, waitForHttp } from './proc.mjs';

/**
 * The database: DATABASE_URL when set (nothing is started), else a local cluster in `home`.
 * @param {{ home: string, port: number, dbName: string }} options
 * @returns {Promise<{ url: string, stop(): Promise<void>, cluster?: Awaited<ReturnType<typeof startCluster>> }>}
 */
export async function startDatabase({ home, port, dbName }) {
  if (process.env.DATABASE_URL)
    return { url: process.env.DATABASE_URL, stop: async () => undefined };
  const cluster = await startCluster({
    home,
    port,
    key: home,
    credentialsFile: join(home, 'credentials.json'),
  });
  await ensureDatabase(cluster.urlFor('postgres'), dbName);
  return {
    url: cluster.urlFor(dbName),
    cluster,
    stop: () => (cluster.startedHere ? cluster.stop() : Promise.resolve()),
  };
}

/**
 * @param {{ smtpPort: number, inboxPort: number, dir: string, quiet?: boolean }} options
 */
export async function startMailSink({ smtpPort, inboxPort, dir, quiet = false }) {
  const service = startService('mail sink', process.execPath, [MAIL_SINK_CLI], {
    cwd: ROOT,
    env: {
      ...process.env,
      MAIL_SMTP_PORT: String(smtpPort),
      MAIL_INBOX_PORT: String(inboxPort),
      MAIL_SINK_DIR: dir,
    },
    stdio: ['ignore', quiet ? 'ignore' : 'inherit', 'inherit'],
  });
  await waitForHttp(`http://127.0.0.1:${inboxPort}/api/messages`, {
    okOnly: true,
    service,
    timeoutMs: 20000,
  });
  return service;
}

/** @param {NodeJS.ProcessEnv} env */
export const migrate = (env) => run(process.execPath, [API_MIGRATE], { cwd: ROOT, env });

/**
 * Loads the demo; with `ifNew`, only into a database that has never had it.
 * @param {NodeJS.ProcessEnv} env
 * @param {'load' | 'load-if-new' | 'reset'} mode
 */
export const loadDemo = (env, mode) => run(process.execPath, [API_DEMO, mode], { cwd: ROOT, env });

/**
 * Starts the API (which also serves the built web app) and waits for it to answer.
 * @param {NodeJS.ProcessEnv} env
 * @param {{ quiet?: boolean }} [options]
 */
export async function startApi(env, { quiet = false } = {}) {
  const service = startService('api', process.execPath, ['--enable-source-maps', API_MAIN], {
    cwd: ROOT,
    env,
    stdio: ['ignore', quiet ? 'ignore' : 'inherit', 'inherit'],
  });
  await waitForHttp(`http://${env.HOST ?? '127.0.0.1'}:${env.PORT}/api/health`, {
    service,
    timeoutMs: 60000,
  });
  return service;
}
