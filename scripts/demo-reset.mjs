// @ts-check
/**
 * `npm run demo:reset`: empties every table of Skyhours' database and loads the demo again, with
 * its dates relative to now (migrating first). Everything else in that database is lost.
 */
import { withDatabase } from './lib/database-task.mjs';

const { loadDemo, migrate } = await import('./lib/stack.mjs');
await withDatabase(async (env) => {
  await migrate(env);
  await loadDemo(env, 'reset');
});
