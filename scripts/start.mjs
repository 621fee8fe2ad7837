// @ts-check
/**
 * `npm start`: installs what is missing, starts the local PostgreSQL and mail sink, migrates,
 * loads the demo on the first start, builds what is stale and serves Skyhours on one origin.
 * Ctrl-C stops everything it started.
 */
import { join } from 'node:path';
import { checkNode, ensureBuilt, ensureDependencies, loadDotEnv } from './lib/preflight.mjs';

checkNode();
await ensureDependencies();
loadDotEnv();

const { DATA, WEB_DIST } = await import('./lib/paths.mjs');
const { localSecrets } = await import('./lib/secrets.mjs');
const { loadDemo, migrate, startApi, startDatabase, startMailSink } =
  await import('./lib/stack.mjs');
const { DEMO_ACCOUNTS } = await import('./lib/demo-accounts.mjs');

const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const smtpPort = Number(process.env.MAIL_SMTP_PORT ?? 2525);
const inboxPort = Number(process.env.MAIL_INBOX_PORT ?? 3100);
const pgPort = Number(process.env.SKYHOURS_PG_PORT ?? 54329);

/** @type {(() => Promise<void>)[]} */
const stops = [];
let stopping = false;
async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping Skyhours…');
  for (const stop of stops.reverse()) await stop().catch((err) => console.error(String(err)));
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  await ensureBuilt();
  const db = await startDatabase({ home: join(DATA, 'pg'), port: pgPort, dbName: 'skyhours' });
  stops.push(db.stop);
  const env = {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    HOST: host,
    PORT: String(port),
    DATABASE_URL: db.url,
    SESSION_SECRET:
      process.env.SESSION_SECRET ?? localSecrets(join(DATA, 'secrets.json')).sessionSecret,
    MAIL_SMTP_HOST: process.env.MAIL_SMTP_HOST ?? '127.0.0.1',
    MAIL_SMTP_PORT: String(smtpPort),
    WEB_DIST: process.env.WEB_DIST ?? WEB_DIST,
  };
  await migrate(env);

  const externalMail = process.env.MAIL_SMTP_HOST && process.env.MAIL_SMTP_HOST !== '127.0.0.1';
  if (!externalMail) {
    const sink = await startMailSink({ smtpPort, inboxPort, dir: join(DATA, 'mail') });
    stops.push(() => sink.stop());
  }
  await loadDemo(env, 'load-if-new');

  const api = await startApi(env);
  stops.push(() => api.stop());
  void api.done.then(() => {
    if (!stopping) void shutdown(1);
  });

  const password = process.env.DEMO_PASSWORD ?? 'skyhours-demo';
  console.log(`
  Skyhours is running at   http://${host}:${port}
  API description (OpenAPI) http://${host}:${port}/api/docs
  ${externalMail ? `Mail goes to              ${process.env.MAIL_SMTP_HOST}` : `Mail sink inbox           http://127.0.0.1:${inboxPort}`}

  Demo sign-ins (password: ${password})
${DEMO_ACCOUNTS.map((/** @type {{email: string, role: string}} */ a) => `    ${a.email.padEnd(26)} ${a.role}`).join('\n')}

  Press Ctrl-C to stop.
`);
} catch (err) {
  console.error(`\nnpm start failed: ${err instanceof Error ? err.message : String(err)}`);
  await shutdown(1);
}
