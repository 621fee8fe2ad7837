import type { Page } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { screenshot } from './screenshot';

let browser: BrowserSession | undefined;

afterEach(async () => {
  await browser?.close();
  browser = undefined;
});

const C = 299_792_458; // m/s, exact (SI)
/** The wavelength in cm as the results table writes it (four significant digits). */
const cm = (ghz: number) => ((C / (ghz * 1e9)) * 100).toPrecision(4);

const cell = (page: Page, quantity: string) => page.locator(`[data-quantity="${quantity}"]`);

/** What identifies each plot's drawing: its caption and the path of its main line. */
async function plots(page: Page) {
  const figures = page.getByRole('group');
  const fringe = figures.filter({ hasText: 'Response across the sky' });
  const elevation = figures.filter({ hasText: 'Elevation through the sidereal day' });
  await fringe.locator('path.recharts-curve').first().waitFor();
  await elevation.locator('path.recharts-curve').first().waitFor();
  return {
    fringeCaption: await fringe.locator('figcaption').textContent(),
    fringePath: await fringe.locator('path.recharts-curve').last().getAttribute('d'),
    elevationCaption: await elevation.locator('figcaption').textContent(),
    elevationPath: await elevation.locator('path.recharts-curve').last().getAttribute('d'),
  };
}

async function openCalculator(page: Page, path = '/calculator') {
  const response = await page.goto(path);
  expect(response?.ok()).toBe(true);
  await page.getByRole('heading', { level: 1, name: 'Calculator' }).waitFor();
  // The demo's stored configurations arrive from the API, then the numbers appear.
  await cell(page, 'Wavelength').waitFor();
}

describe('the Calculator', () => {
  it('recomputes as the user types, and a copied link reproduces the state', async () => {
    browser = await launchBrowser({ viewport: { width: 1280, height: 900 } });
    const { page, context } = browser;
    await context.grantPermissions(['clipboard-read', 'clipboard-write']);

    await openCalculator(page);
    expect(await page.title()).toBe('Calculator · Skyhours');
    // The demo observatory's configurations are offered.
    const configurations = page.getByRole('combobox', { name: 'Configuration' });
    expect(await configurations.locator('option').allTextContents()).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^compact/),
        expect.stringMatching(/^extended/),
      ]),
    );
    expect(await cell(page, 'Wavelength').textContent()).toBe(cm(1.4));
    const before = await plots(page);

    await page.getByRole('textbox', { name: 'Sky frequency' }).fill('1.67');
    await expect.poll(() => cell(page, 'Wavelength').textContent()).toBe(cm(1.67));
    // The elevation does not depend on the frequency; a new declination moves it.
    await page.getByRole('textbox', { name: 'Declination (ICRS)' }).fill('-05:30:00');
    await expect.poll(() => cell(page, 'Highest elevation').textContent()).toBe('37.2');

    // The plots may redraw a moment after the numbers (they take the deferred value).
    await expect
      .poll(async () => (await plots(page)).elevationCaption)
      .not.toBe(before.elevationCaption);
    const after = await plots(page);
    expect(after.fringeCaption).not.toBe(before.fringeCaption);
    expect(after.fringePath).not.toBe(before.fringePath);
    expect(after.elevationCaption).not.toBe(before.elevationCaption);
    expect(after.elevationPath).not.toBe(before.elevationPath);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calculator-light-wide');

    await page.getByRole('button', { name: 'Copy link' }).click();
    await page.getByRole('button', { name: 'Link copied' }).waitFor();
    const link = await page.evaluate(() => navigator.clipboard.readText());
    expect(new URL(link).pathname).toBe('/calculator');
    expect(new URL(link).searchParams.get('frequency')).toBe('1.67');
    expect(new URL(link).searchParams.get('dec')).toBe('-05:30:00');
    // The address bar follows the form too, a moment after typing stops.
    await expect.poll(() => page.url()).toBe(link);

    const other = await context.newPage();
    await openCalculator(other, link);
    expect(await other.getByRole('textbox', { name: 'Sky frequency' }).inputValue()).toBe('1.67');
    expect(await other.getByRole('textbox', { name: 'Declination (ICRS)' }).inputValue()).toBe(
      '-05:30:00',
    );
    expect(await cell(other, 'Wavelength').textContent()).toBe(cm(1.67));
    expect(await plots(other)).toEqual(after);
    expect(browser.errors).toEqual([]);
  });

  it('shows a line target, a custom setup and its checks in dark mode on a narrow screen', async () => {
    browser = await launchBrowser({ viewport: { width: 390, height: 844 }, colorScheme: 'dark' });
    const { page } = browser;

    await openCalculator(
      page,
      '/calculator?frequencyMode=line&restFrequency=1420.405751768&restUnit=MHz&shift=velocity' +
        '&velocity=4500&convention=optical&extent=40&extentUnit=arcmin&dec=-41&time=30&timeUnit=min',
    );
    // ν = ν0 / (1 + v/c) in the optical convention; seven significant digits, no trailing zeros.
    const sky = String(Number((1.420405751768 / (1 + 4_500_000 / C)).toPrecision(7)));
    expect(await cell(page, 'Sky frequency').textContent()).toBe(sky);
    const checks = page.getByRole('region', { name: 'Checks' });
    await checks.getByText('Note').first().waitFor();
    expect(await checks.getByText(/mosaic of \d+ pointings/).count()).toBe(1);
    expect(await checks.getByText('Warning').count()).toBeGreaterThan(0);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calculator-dark-narrow');

    await page.getByText('Custom values', { exact: true }).click();
    // The custom fields start from the stored setup that was chosen.
    expect(await page.getByRole('textbox', { name: 'Antennas' }).inputValue()).toBe('18');
    await page.getByRole('textbox', { name: 'Longest baseline (m)' }).fill('');
    await page.getByRole('textbox', { name: 'Longest baseline (m)' }).blur();
    await page.getByText('One field needs a change').waitFor();
    // The problem list leads to the field, by keyboard too.
    const toField = page.getByRole('button', { name: 'Longest baseline (m)' });
    await toField.focus();
    await page.keyboard.press('Enter');
    expect(
      await page
        .getByRole('textbox', { name: 'Longest baseline (m)' })
        .evaluate((input) => input === document.activeElement),
    ).toBe(true);
    expect(await page.locator('body').textContent()).not.toMatch(/NaN/);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calculator-dark-narrow-invalid');
    expect(browser.errors).toEqual([]);
  });

  it('is usable in dark mode on a wide screen', async () => {
    browser = await launchBrowser({ viewport: { width: 1440, height: 900 }, colorScheme: 'dark' });
    await openCalculator(browser.page, '/calculator?extent=90&resolutionGoal=2&rmsGoal=5');
    await plots(browser.page);
    expect(await seriousAxeViolations(browser.page)).toEqual([]);
    await screenshot(browser.page, 'calculator-dark-wide');
    expect(browser.errors).toEqual([]);
  });
});
