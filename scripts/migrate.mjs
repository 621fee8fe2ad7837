// @ts-check
/** `npm run migrate`: applies pending migrations to Skyhours' database (see lib/database-task.mjs). */
import { withDatabase } from './lib/database-task.mjs';

const { migrate } = await import('./lib/stack.mjs');
await withDatabase((env) => migrate(env));
