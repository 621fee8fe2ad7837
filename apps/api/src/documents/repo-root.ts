import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

/**
 * The repository's root folder: the nearest folder upwards holding the `skyhours` package.json.
 * Walking up (rather than a fixed `../..`) finds it from the source tree, under jest, and from the
 * compiled layout `apps/api/dist/apps/api/src/…` alike.
 */
function findRepoRoot(from: string): string {
  for (let dir = from; ; dir = dirname(dir)) {
    const manifest = join(dir, 'package.json');
    if (existsSync(manifest)) {
      const pkg = JSON.parse(readFileSync(manifest, 'utf8')) as { name?: string };
      if (pkg.name === 'skyhours') return dir;
    }
    if (dirname(dir) === dir) throw new Error(`No skyhours package.json above ${from}`);
  }
}

export const REPO_ROOT = findRepoRoot(dirname(fileURLToPath(import.meta.url)));
