// @ts-check
/**
 * `npm run dev`: the same local database and mail sink as `npm start`, the API recompiled and
 * restarted on every change, and Vite's dev server (with hot reload) proxying /api to it.
 */
import { join } from 'node:path';
import { checkNode, ensureBuilt, ensureDependencies, loadDotEnv } from './lib/preflight.mjs';

checkNode();
await ensureDependencies();
loadDotEnv();

const { API_MAIN, DATA, ROOT } = await import('./lib/paths.mjs');
const { localSecrets } = await import('./lib/secrets.mjs');
const { startService } = await import('./lib/proc.mjs');
const { loadDemo, migrate, startDatabase, startMailSink } = await import('./lib/stack.mjs');

const apiPort = Number(process.env.PORT ?? 3000);
const smtpPort = Number(process.env.MAIL_SMTP_PORT ?? 2525);
const inboxPort = Number(process.env.MAIL_INBOX_PORT ?? 3100);

/** @type {(() => Promise<void>)[]} */
const stops = [];
let stopping = false;
async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  for (const stop of stops.reverse()) await stop().catch(() => undefined);
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  await ensureBuilt();
  const db = await startDatabase({
    home: join(DATA, 'pg'),
    port: Number(process.env.SKYHOURS_PG_PORT ?? 54329),
    dbName: 'skyhours',
  });
  stops.push(db.stop);
  const env = {
    ...process.env,
    NODE_ENV: 'development',
    PORT: String(apiPort),
    DATABASE_URL: db.url,
    SESSION_SECRET:
      process.env.SESSION_SECRET ?? localSecrets(join(DATA, 'secrets.json')).sessionSecret,
    MAIL_SMTP_PORT: String(smtpPort),
    WEB_DIST: '',
  };
  await migrate(env);
  const sink = await startMailSink({ smtpPort, inboxPort, dir: join(DATA, 'mail') });
  stops.push(() => sink.stop());
  await loadDemo(env, 'load-if-new');

  // The calculator library and the API recompile on change; node --watch restarts the API.
  for (const dir of ['libs/calc', 'apps/api']) {
    const args = ['tsc', '-p', 'tsconfig.build.json', '--watch', '--preserveWatchOutput'];
    const service = startService(`${dir} build`, 'npx', args, { cwd: join(ROOT, dir), env });
    stops.push(() => service.stop());
  }
  const api = startService('api', process.execPath, ['--watch', '--enable-source-maps', API_MAIN], {
    cwd: ROOT,
    env,
  });
  stops.push(() => api.stop());
  const web = startService('web', 'npx', ['vite', '--host', '127.0.0.1'], {
    cwd: join(ROOT, 'apps/web'),
    env: { ...env, API_PORT: String(apiPort) },
    detached: true,
  });
  // Vite leaves a child behind when only npx is signalled: stop the whole process group.
  stops.push(async () => {
    try {
      process.kill(-(/** @type {number} */ (web.child.pid)), 'SIGTERM');
    } catch {
      // already gone
    }
  });
  console.log(
    `\n  Vite dev server: http://127.0.0.1:5173 (API on :${apiPort}, inbox http://127.0.0.1:${inboxPort})\n`,
  );
} catch (err) {
  console.error(`npm run dev failed: ${err instanceof Error ? err.message : String(err)}`);
  await shutdown(1);
}
