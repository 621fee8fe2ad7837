// @ts-check
import { join } from 'node:path';
import { checkNode, ensureBuilt, ensureDependencies, loadDotEnv } from './preflight.mjs';

/**
 * Runs `task` against Skyhours' database — DATABASE_URL when set, else the local cluster that
 * `npm start` uses (started for the task and stopped after, or left running when it already ran)
 * — with the API built, as `npm run migrate` and `npm run demo:reset` need.
 * @param {(env: NodeJS.ProcessEnv) => Promise<void>} task
 */
export async function withDatabase(task) {
  checkNode();
  await ensureDependencies();
  loadDotEnv();
  const { DATA } = await import('./paths.mjs');
  const { startDatabase } = await import('./stack.mjs');
  await ensureBuilt();
  const db = await startDatabase({
    home: join(DATA, 'pg'),
    port: Number(process.env.SKYHOURS_PG_PORT ?? 54329),
    dbName: 'skyhours',
  });
  try {
    await task({ ...process.env, DATABASE_URL: db.url });
  } finally {
    await db.stop();
  }
}
