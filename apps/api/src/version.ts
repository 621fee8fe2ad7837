import { readFileSync } from 'node:fs';

/** The product's version, from the root package.json (found upwards from this file). */
function readVersion(): string {
  for (const up of ['../../../package.json', '../../../../../../package.json']) {
    try {
      const pkg = JSON.parse(readFileSync(new URL(up, import.meta.url), 'utf8')) as {
        name?: string;
        version?: string;
      };
      if (pkg.name === 'skyhours' && pkg.version) return pkg.version;
    } catch {
      // not at this depth (source vs. compiled layout)
    }
  }
  return '0.0.0';
}

export const VERSION = readVersion();
