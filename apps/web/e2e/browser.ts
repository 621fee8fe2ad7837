import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** The Skyhours under test, e.g. `http://127.0.0.1:3000`, without a trailing slash. */
export function baseUrl(): string {
  const url = process.env.SKYHOURS_URL;
  if (!url) throw new Error('Set SKYHOURS_URL to the running Skyhours, e.g. http://127.0.0.1:3000');
  return url.replace(/\/+$/, '');
}

// Debian's Chromium, as STACK.md gotcha 10 says: no sandbox (root in a container), no GPU,
// nothing that talks to the network on its own.
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface BrowserOptions {
  viewport?: { width: number; height: number };
  colorScheme?: 'light' | 'dark';
}

export interface BrowserSession {
  context: BrowserContext;
  page: Page;
  /** Uncaught exceptions and console errors seen so far (not HTTP statuses): a healthy page leaves it empty. */
  errors: string[];
  close: () => Promise<void>;
}

/**
 * A fresh Chromium with its own empty profile (no cookies, no stored colour mode), its first
 * page opened on nothing yet. Relative `page.goto('/')` goes to SKYHOURS_URL. Close it in
 * `afterAll`/`afterEach`: it also deletes the profile.
 */
export async function launchBrowser({
  viewport = { width: 1280, height: 800 },
  colorScheme = 'light',
}: BrowserOptions = {}): Promise<BrowserSession> {
  const profile = await mkdtemp(join(tmpdir(), 'skyhours-chromium-'));
  let context: BrowserContext;
  try {
    // launch() refuses --user-data-dir; a persistent context on a fresh folder is the way.
    context = await chromium.launchPersistentContext(profile, {
      executablePath: '/usr/bin/chromium',
      args: CHROMIUM_ARGS,
      baseURL: baseUrl(),
      viewport,
      colorScheme,
      locale: 'en-GB',
      timezoneId: 'Europe/Berlin',
    });
  } catch (error) {
    await rm(profile, { recursive: true, force: true });
    throw error;
  }

  // Well inside the test's own timeout, so a stuck step fails with the locator it waited for.
  context.setDefaultTimeout(15_000);
  const page = context.pages()[0] ?? (await context.newPage());
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    // Chromium logs every 4xx/5xx answer; the app expects some (401 from /api/auth/me when
    // signed out, 503 from a degraded /api/health) and shows them itself.
    if (message.type() !== 'error' || message.text().startsWith('Failed to load resource')) return;
    errors.push(`console: ${message.text()}`);
  });

  return {
    context,
    page,
    errors,
    close: async () => {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}
