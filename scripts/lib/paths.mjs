// @ts-check
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';

/** The repository's root folder. */
export const ROOT = fileURLToPath(new URL('../..', import.meta.url)).replace(/\/$/, '');
export const DATA = join(ROOT, '.data');

export const API_DIST = join(ROOT, 'apps/api/dist/apps/api/src');
export const API_MAIN = join(API_DIST, 'main.js');
export const API_MIGRATE = join(API_DIST, 'database/migrate.js');
export const API_DEMO = join(API_DIST, 'demo/demo-cli.js');
export const WEB_DIST = join(ROOT, 'apps/web/dist');
export const MAIL_SINK_CLI = join(ROOT, 'mail-sink/dist/cli.js');
