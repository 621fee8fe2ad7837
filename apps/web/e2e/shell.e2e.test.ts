import { afterEach, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { screenshot } from './screenshot';

let browser: BrowserSession | undefined;

afterEach(async () => {
  await browser?.close();
  browser = undefined;
});

const HEALTH_STATES = /All systems working|Degraded: some parts are down/;

describe('the app shell', () => {
  it('opens the Desk with the product name, the system status and no serious accessibility faults', async () => {
    browser = await launchBrowser({ viewport: { width: 1280, height: 800 }, colorScheme: 'light' });
    const { page } = browser;

    const response = await page.goto('/');
    expect(response?.ok()).toBe(true);

    await page.getByRole('heading', { level: 1, name: 'Desk' }).waitFor();
    expect(await page.getByRole('banner').getByRole('link', { name: 'Skyhours' }).count()).toBe(1);
    expect(await page.title()).toBe('Desk · Skyhours');

    const status = page.getByRole('region', { name: 'System status' });
    await status.getByText(HEALTH_STATES).waitFor();
    expect(await status.getByText('Database').count()).toBe(1);
    expect(await status.getByText('Mail').count()).toBe(1);

    expect(await seriousAxeViolations(page)).toEqual([]);
    expect(browser.errors).toEqual([]);
    await screenshot(page, 'shell-desk-light-wide');
  });

  it('works on a narrow screen in dark mode, with the navigation in a drawer', async () => {
    browser = await launchBrowser({ viewport: { width: 390, height: 844 }, colorScheme: 'dark' });
    const { page } = browser;

    await page.goto('/');
    await page.getByRole('region', { name: 'System status' }).getByText(HEALTH_STATES).waitFor();
    expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(
      true,
    );
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'shell-desk-dark-narrow');

    await page.getByRole('button', { name: 'Open navigation' }).click();
    const drawer = page.getByRole('dialog');
    await drawer.getByRole('link', { name: 'Calculator' }).waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'shell-nav-drawer-dark-narrow');

    await page.keyboard.press('Escape');
    await drawer.waitFor({ state: 'hidden' });
    expect(browser.errors).toEqual([]);
  });

  it('lets a keyboard user skip to the content and switch the colour mode', async () => {
    browser = await launchBrowser();
    const { page } = browser;

    await page.goto('/');
    await page.getByRole('heading', { level: 1, name: 'Desk' }).waitFor();
    await page.keyboard.press('Tab');
    const skip = page.getByRole('link', { name: 'Skip to content' });
    expect(await skip.evaluate((link) => link === document.activeElement)).toBe(true);
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.tagName)).toBe('MAIN');

    await page.getByRole('button', { name: 'Switch to dark mode' }).click();
    expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(
      true,
    );
    await page.reload();
    await page.getByRole('button', { name: 'Switch to light mode' }).waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'shell-desk-dark-wide');
  });

  it('shows the not-found page for an unknown address', async () => {
    browser = await launchBrowser();
    const { page } = browser;

    await page.goto('/no/such/screen');
    await page.getByRole('heading', { level: 1, name: 'Page not found' }).waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'shell-not-found-light-wide');
  });
});
