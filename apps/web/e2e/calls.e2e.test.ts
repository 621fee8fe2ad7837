import type { BrowserContext } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { screenshot } from './screenshot';

let browsers: BrowserSession[] = [];

afterEach(async () => {
  await Promise.all(browsers.map((b) => b.close()));
  browsers = [];
});

async function open(options?: Parameters<typeof launchBrowser>[0]): Promise<BrowserSession> {
  const browser = await launchBrowser(options);
  browsers.push(browser);
  return browser;
}

/** Signs the browser in through the API (the sign-in screen is another feature's to test). */
async function signIn(context: BrowserContext, email: string): Promise<void> {
  const csrf = await context.request.get('/api/auth/csrf');
  const { token } = (await csrf.json()) as { token: string };
  const res = await context.request.post('/api/auth/login', {
    headers: { 'X-CSRF-Token': token },
    data: { email, password: process.env.DEMO_PASSWORD ?? 'skyhours-demo' },
  });
  expect(res.status()).toBe(200);
}

/** The wall-clock date `days` from now in `zone`, as YYYY-MM-DD. */
function dateIn(zone: string, days: number): string {
  return new Intl.DateTimeFormat('en-CA', {
    timeZone: zone,
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
  }).format(new Date(Date.now() + days * 86_400_000));
}

describe('calls', () => {
  it('shows a visitor the open demo call with its countdown, and its page with the capacity', async () => {
    const { page, errors } = await open();
    await page.goto('/calls');
    const card = page.getByRole('article', { name: 'Spring 2027 call for proposals' });
    await card.waitFor();
    expect(await card.getByText(/UTC$/).count()).toBeGreaterThan(0);
    expect(await card.getByText(/^in \d+ days?/).count()).toBe(1);
    // Planned calls stay hidden from visitors.
    expect(await page.getByText('Autumn 2027 call for proposals').count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calls-public-list');

    await card.getByRole('link', { name: 'Spring 2027 call for proposals' }).click();
    await page.getByRole('heading', { level: 1, name: 'Spring 2027 call for proposals' }).waitFor();
    const capacity = page.getByRole('table', { name: 'Hours on offer per configuration' });
    expect(await capacity.getByRole('row').allTextContents()).toEqual([
      'ConfigurationShortest baselineLongest baselineHours on offer',
      'compact30 m600 m350 h',
      'intermediate60 m1.8 km300 h',
      'extended120 m3.2 km420 h',
      'Total1,070 h',
    ]);
    expect(await page.getByRole('heading', { name: 'Lifecycle' }).count()).toBe(0);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calls-public-page');
    expect(errors).toEqual([]);
  });

  it('lets staff create a call, open it, and the public list then shows it with its countdown', async () => {
    const staff = await open();
    await signIn(staff.context, 'staff@skyhours.test');
    const { page } = staff;
    const code = `BT${Date.now().toString(36).slice(-5).toUpperCase()}`;
    const title = `Browser test call ${code}`;
    const zone = 'America/Los_Angeles';

    await page.goto('/operations/calls/new');
    await page.getByRole('heading', { level: 1, name: 'New call' }).waitFor();
    await page.getByLabel(/^Code/).fill(code);
    await page.getByLabel(/^Title/).fill(title);
    await page.getByLabel(/^Description/).fill('Made by the browser test.');
    await page.getByLabel(/^Opens/).fill(`${dateIn(zone, -1)}T09:00`);
    await page.getByLabel(/^Deadline/).fill(`${dateIn(zone, 20)}T17:00`);
    await page.getByLabel(/^Reviews due/).fill(`${dateIn(zone, 50)}T17:00`);
    await page.getByLabel('compact').fill('120');
    await page.getByLabel('extended').fill('80');
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'calls-new-form');
    await page.getByRole('button', { name: 'Create call' }).click();

    await page.getByRole('heading', { level: 1, name: title }).waitFor();
    expect(await page.getByText('Planned', { exact: true }).count()).toBeGreaterThan(0);
    // Not public yet.
    const visitor = await open({ viewport: { width: 390, height: 844 } });
    await visitor.page.goto('/calls');
    await visitor.page.getByRole('heading', { name: 'Open and upcoming' }).waitFor();
    await visitor.page.getByRole('article').first().waitFor();
    expect(await visitor.page.getByRole('article', { name: title }).count()).toBe(0);

    await page.getByRole('button', { name: 'Open the call' }).click();
    const dialog = page.getByRole('alertdialog', { name: `Open ${code}?` });
    await dialog.waitFor();
    // Focus starts on Cancel: a stray Enter does not open the call.
    await expect
      .poll(() =>
        dialog
          .getByRole('button', { name: 'Cancel' })
          .evaluate((b) => b === document.activeElement),
      )
      .toBe(true);
    await screenshot(page, 'calls-open-confirmation');
    await dialog.getByRole('button', { name: 'Open the call' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page.getByText('The call closes by itself at its deadline').waitFor();
    await screenshot(page, 'calls-staff-page-open');

    await visitor.page.reload();
    const card = visitor.page.getByRole('article', { name: title });
    await card.waitFor();
    expect(await card.getByText(/^in (19|20) days/).count()).toBe(1);
    expect(await card.getByText(/UTC$/).count()).toBeGreaterThan(0);
    expect(await card.getByText('200 h').count()).toBe(1);
    expect(await seriousAxeViolations(visitor.page)).toEqual([]);
    await card.scrollIntoViewIfNeeded();
    await screenshot(visitor.page, 'calls-public-list-narrow');
    expect(staff.errors).toEqual([]);
    expect(visitor.errors).toEqual([]);
  });

  it('shows staff the array setup with a table per configuration and band', async () => {
    const { page, context, errors } = await open();
    await signIn(context, 'staff@skyhours.test');
    await page.goto('/operations/array');
    const configurations = page.getByRole('table', { name: 'Configurations' });
    await configurations.waitFor();
    expect(await configurations.getByRole('row').count()).toBe(4);
    expect(await page.getByRole('table', { name: 'Receiver bands' }).getByRole('row').count()).toBe(
      5,
    );
    expect(await page.getByLabel(/^Antennas/).inputValue()).toBe('18');
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'operations-array-setup');

    await page.getByRole('button', { name: 'Add a configuration' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a configuration' });
    await dialog.getByRole('button', { name: 'Save' }).click();
    await dialog.getByText('Give the configuration a name').waitFor();
    await screenshot(page, 'operations-configuration-dialog');
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    expect(errors).toEqual([]);
  });
});
