import { mkdir } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';

/** `<repo root>/test-results/screenshots/`, git-ignored. */
export const SCREENSHOT_DIR = fileURLToPath(
  new URL('../../../test-results/screenshots/', import.meta.url),
);

/** Saves the whole page as `<name>.png` and returns the file's path. Names are kebab-case. */
export async function screenshot(page: Page, name: string): Promise<string> {
  if (!/^[a-z0-9]+(-[a-z0-9]+)*$/.test(name))
    throw new Error(`Screenshot names are kebab-case: ${name}`);
  await mkdir(SCREENSHOT_DIR, { recursive: true });
  const path = `${SCREENSHOT_DIR}${name}.png`;
  // Fonts load with font-display: swap; wait so the picture shows Plex, not the fallback.
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path, fullPage: true });
  return path;
}
