// @ts-check
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';

/**
 * Secrets of a local installation (the session secret), made once and kept in .data/.
 * @param {string} file
 * @returns {{ sessionSecret: string }}
 */
export function localSecrets(file) {
  if (existsSync(file)) return JSON.parse(readFileSync(file, 'utf8'));
  const secrets = { sessionSecret: randomBytes(32).toString('base64url') };
  mkdirSync(dirname(file), { recursive: true });
  writeFileSync(file, JSON.stringify(secrets), { mode: 0o600 });
  return secrets;
}
