import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';

const run = promisify(execFile);
const DEMO_CLI = fileURLToPath(
  new URL('../../api/dist/apps/api/src/demo/demo-cli.js', import.meta.url),
);

/**
 * Empties the browser suite's database and loads the demo again, as `npm run demo:reset` does.
 * The browser test files share one server and its demo, one file at a time: a file that changes
 * the demo's story (publishes a call, generates a plan…) calls this in its `afterAll`, so the
 * files after it see the demo as loaded. Sessions are emptied too: sign in again afterwards.
 */
export async function resetDemo(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set (npm test sets it)');
  await run(process.execPath, [DEMO_CLI, 'reset'], { env: process.env, timeout: 120_000 });
}
