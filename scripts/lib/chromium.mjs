// @ts-check
import { existsSync } from 'node:fs';
import { run } from './proc.mjs';

export const CHROMIUM = '/usr/bin/chromium';

/** The browser tests drive Debian's Chromium; install it with apt-get when missing. */
export async function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  if (process.getuid?.() !== 0) {
    throw new Error('Chromium is missing: install it with `sudo apt-get install -y chromium`');
  }
  console.log('Installing Chromium from Debian packages…');
  await run('apt-get', ['update', '-qq']);
  await run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'chromium'], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}
