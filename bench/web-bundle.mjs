// @ts-check
/**
 * Initial JavaScript of the web app, gzipped (goal: at most 300 KB).
 *
 *   npm run build -w @skyhours/web && node bench/web-bundle.mjs
 *
 * "Initial" is what the browser fetches before the first screen can run: the entry script of
 * the built `index.html` and every module it preloads (`<link rel="modulepreload">`), which Vite
 * writes for the entry's static imports. Routes are split and loaded lazily, so each screen's own
 * chunk comes after; the largest of those is printed too. Sizes are gzip level 9 (what a server
 * compressing on the fly sends is about this or a little more).
 */
import { readdir, readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';

const GOAL_KB = 300;
const DIST = new URL('../apps/web/dist/', import.meta.url).pathname;

const html = await readFile(join(DIST, 'index.html'), 'utf8').catch(() => {
  throw new Error('apps/web/dist/index.html is missing: npm run build -w @skyhours/web first');
});
const initial = [
  ...html.matchAll(/<script[^>]*type="module"[^>]*src="([^"]+)"/g),
  ...html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g),
].map((m) => /** @type {string} */ (m[1]));

const gzKb = async (/** @type {string} */ file) =>
  gzipSync(await readFile(join(DIST, file)), { level: 9 }).length / 1024;

let total = 0;
console.log('Initial JavaScript (entry + preloads), gzipped:');
for (const src of initial) {
  const kb = await gzKb(src.replace(/^\//, ''));
  total += kb;
  console.log(`  ${src.padEnd(48)} ${kb.toFixed(1).padStart(7)} KB`);
}
const lazy = (await readdir(join(DIST, 'assets')))
  .filter((f) => f.endsWith('.js') && !initial.includes(`/assets/${f}`))
  .map((f) => `assets/${f}`);
const lazySizes = await Promise.all(lazy.map(async (f) => ({ f, kb: await gzKb(f) })));
lazySizes.sort((a, b) => b.kb - a.kb);
console.log(
  `  ${lazy.length} lazily loaded chunks; the largest: ${lazySizes
    .slice(0, 3)
    .map((c) => `${c.f.replace('assets/', '')} ${c.kb.toFixed(1)} KB`)
    .join(', ')}`,
);
const ok = total <= GOAL_KB;
console.log(
  `initial JavaScript: ${total.toFixed(1)} KB gzipped (goal ≤ ${GOAL_KB} KB) ${ok ? 'ok' : 'MISSED'}`,
);
if (!ok && process.env.BENCH_SMOKE !== '1') process.exitCode = 1;
