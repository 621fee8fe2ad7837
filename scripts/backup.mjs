// @ts-check
/**
 * `npm run backup [file]`: a pg_dump (custom format) of Skyhours' database — DATABASE_URL when set,
 * else the local cluster — to `file` or `.data/backups/skyhours-<UTC time>.dump`.
 * Everything lives in PostgreSQL (documents and compiled PDFs included), so this is the whole state.
 */
import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { checkNode, ensureDependencies, loadDotEnv } from './lib/preflight.mjs';

checkNode();
await ensureDependencies();
loadDotEnv();
const { DATA } = await import('./lib/paths.mjs');
const { ensurePostgres } = await import('./lib/postgres.mjs');
const { run } = await import('./lib/proc.mjs');
const { startDatabase } = await import('./lib/stack.mjs');

const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const file = resolve(process.argv[2] ?? join(DATA, 'backups', `skyhours-${stamp}.dump`));
mkdirSync(dirname(file), { recursive: true });

const bin = await ensurePostgres();
const db = await startDatabase({
  home: join(DATA, 'pg'),
  port: Number(process.env.SKYHOURS_PG_PORT ?? 54329),
  dbName: 'skyhours',
});
try {
  await run(join(bin, 'pg_dump'), [
    '--format=custom',
    '--no-owner',
    '--file',
    file,
    '--dbname',
    db.url,
  ]);
  console.log(`Backup written to ${file}`);
} finally {
  await db.stop();
}
