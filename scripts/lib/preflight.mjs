// @ts-check
/** What `npm start` and `npm test` check before anything else, with Node's built-ins only. */
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT } from './paths.mjs';
import { run } from './proc.mjs';

export function checkNode() {
  const [major, minor] = process.versions.node.split('.').map(Number);
  if ((major ?? 0) < 20 || (major === 20 && (minor ?? 0) < 19)) {
    throw new Error(`Skyhours needs Node.js 20.19 or newer; this is ${process.versions.node}`);
  }
}

/** Installs the dependencies when node_modules is missing or older than the lock file. */
export async function ensureDependencies() {
  const marker = join(ROOT, 'node_modules', '.package-lock.json');
  const lock = join(ROOT, 'package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  console.log('Installing dependencies (npm ci)…');
  await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: ROOT });
}

/** Reads `.env` (KEY=value lines) into process.env without overriding what is already set. */
export function loadDotEnv() {
  const file = join(ROOT, '.env');
  if (!existsSync(file)) return;
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    const match = /^\s*([A-Z0-9_]+)\s*=\s*(.*?)\s*$/.exec(line);
    if (!match || line.trimStart().startsWith('#')) continue;
    const [, key, raw] = match;
    if (key && process.env[key] === undefined)
      process.env[key] = (raw ?? '').replace(/^(['"])(.*)\1$/, '$2');
  }
}

/** @param {string} dir @returns {number} the newest modification time of the files below dir */
function newest(dir) {
  if (!existsSync(dir)) return 0;
  const stat = statSync(dir);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let latest = stat.mtimeMs;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    if (entry.name === 'node_modules' || entry.name === 'dist') continue;
    const path = join(dir, entry.name);
    latest = Math.max(latest, entry.isDirectory() ? newest(path) : statSync(path).mtimeMs);
  }
  return latest;
}

/**
 * The workspaces in build order, each with the inputs that make its build stale.
 * The API's build includes the migrations and uses the calculator; the web app uses it and the fonts.
 */
const BUILDS = [
  { workspace: '@skyhours/calc', dir: 'libs/calc', inputs: ['libs/calc'] },
  { workspace: '@skyhours/mail-sink', dir: 'mail-sink', inputs: ['mail-sink'] },
  {
    workspace: '@skyhours/api',
    dir: 'apps/api',
    inputs: ['apps/api', 'migrations', 'libs/calc/src', 'package.json'],
  },
  {
    workspace: '@skyhours/web',
    dir: 'apps/web',
    inputs: ['apps/web', 'libs/calc/src', 'fonts', 'package.json'],
  },
];

/**
 * Builds each workspace whose build is missing or older than its sources.
 * @param {{ force?: boolean }} [options]
 */
export async function ensureBuilt({ force = false } = {}) {
  for (const build of BUILDS) {
    const stamp = join(ROOT, build.dir, 'dist', '.built');
    const builtAt = existsSync(stamp) ? statSync(stamp).mtimeMs : 0;
    const changedAt = Math.max(...build.inputs.map((p) => newest(join(ROOT, p))));
    if (!force && builtAt >= changedAt) continue;
    console.log(`Building ${build.workspace}…`);
    await run('npm', ['run', 'build', '-w', build.workspace], { cwd: ROOT });
    writeFileSync(stamp, new Date().toISOString());
  }
}
