// @ts-check
/**
 * `npm run restore <file>`: replaces the contents of Skyhours' database (DATABASE_URL when set, else
 * the local cluster) with a backup made by `npm run backup`. Stop the app first.
 */
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { checkNode, ensureDependencies, loadDotEnv } from './lib/preflight.mjs';

checkNode();
await ensureDependencies();
loadDotEnv();
const { DATA } = await import('./lib/paths.mjs');
const { ensurePostgres } = await import('./lib/postgres.mjs');
const { run } = await import('./lib/proc.mjs');
const { startDatabase } = await import('./lib/stack.mjs');

const arg = process.argv[2];
if (!arg || !existsSync(resolve(arg))) {
  console.error('Usage: npm run restore -- <backup file>');
  process.exit(2);
}
const bin = await ensurePostgres();
const db = await startDatabase({
  home: join(DATA, 'pg'),
  port: Number(process.env.SKYHOURS_PG_PORT ?? 54329),
  dbName: 'skyhours',
});
try {
  await run(join(bin, 'pg_restore'), [
    '--clean',
    '--if-exists',
    '--no-owner',
    '--single-transaction',
    '--exit-on-error',
    '--dbname',
    db.url,
    resolve(arg),
  ]);
  console.log(`Restored ${resolve(arg)}`);
} finally {
  await db.stop();
}
