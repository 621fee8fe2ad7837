import { PDFDocument, StandardFonts } from 'pdf-lib';
import type { BrowserContext, Page } from 'playwright-core';
import { afterEach, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { screenshot } from './screenshot';

const PROPOSER = 'proposer@skyhours.test';
const PASSWORD = process.env.DEMO_PASSWORD ?? 'skyhours-demo';
/** The demo's open call. */
const CALL = 'SP27';

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

function sinkUrl(): string {
  const url = process.env.MAIL_SINK_URL;
  if (!url) throw new Error('Set MAIL_SINK_URL to the mail sink (npm test does)');
  return url.replace(/\/+$/, '');
}

interface SinkMessage {
  id: string;
  subject: string;
  attachments: { filename: string; contentType: string; size: number }[];
}

/** The newest message to `address` whose subject matches, once the outbox has delivered it. */
async function mailTo(address: string, subject: RegExp): Promise<SinkMessage> {
  const deadline = Date.now() + 30_000;
  for (;;) {
    const list = (await (
      await fetch(`${sinkUrl()}/api/messages?to=${encodeURIComponent(address)}`)
    ).json()) as { id: string; subject: string }[];
    const found = list.find((message) => subject.test(message.subject));
    if (found)
      return (await (await fetch(`${sinkUrl()}/api/messages/${found.id}`)).json()) as SinkMessage;
    if (Date.now() > deadline)
      throw new Error(`no message "${String(subject)}" arrived for ${address}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** A two-page science case with real text (the server reads it for the team's names). */
async function sciencePdf(): Promise<Buffer> {
  const pdf = await PDFDocument.create();
  const font = await pdf.embedFont(StandardFonts.Helvetica);
  const lines = [
    'Science case: cold gas in the Thistle dwarf galaxy',
    'We map neutral hydrogen across the disc to measure its rotation and the dark halo.',
    'The observations reach 20 microjansky per beam in the intermediate configuration.',
  ];
  for (let page = 0; page < 2; page += 1) {
    const sheet = pdf.addPage([595, 842]);
    lines.forEach((line, i) => sheet.drawText(line, { x: 56, y: 760 - i * 22, size: 12, font }));
    // Filler so the upload takes long enough to be seen under the throttled network.
    for (let row = 0; row < 40; row += 1) {
      sheet.drawText(
        `Section ${page + 1}.${row + 1}: notes on the velocity field and its errors.`,
        {
          x: 56,
          y: 680 - row * 15,
          size: 9,
          font,
        },
      );
    }
  }
  const bytes = await pdf.save({ useObjectStreams: false });
  // Padding in a comment after the end marker keeps the PDF valid and makes it ~400 KB.
  return Buffer.concat([Buffer.from(bytes), Buffer.from(`\n%${'x'.repeat(400_000)}\n`)]);
}

async function expectNoSeriousAxeViolations(page: Page, where: string) {
  // A dialog fading in has the colours of half its way: measure once the motion is over.
  await page.waitForFunction(() =>
    document.getAnimations().every((animation) => animation.playState !== 'running'),
  );
  const violations = await seriousAxeViolations(page);
  expect(violations, `axe on ${where}`).toEqual([]);
}

async function signInThroughForm(page: Page, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await page.getByRole('textbox', { name: 'E-mail' }).fill(PROPOSER);
  await page.getByLabel('Password').fill(PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in through the API, for tests whose subject is not the sign-in. */
async function signInThroughApi(context: BrowserContext): Promise<string> {
  const csrf = async () =>
    ((await (await context.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const res = await context.request.post('/api/auth/login', {
    headers: { 'X-CSRF-Token': await csrf() },
    data: { email: PROPOSER, password: PASSWORD },
  });
  expect(res.status()).toBe(200);
  // Signing in starts a new session, with a token of its own.
  return csrf();
}

const section = (page: Page, name: string) =>
  page.getByRole('navigation', { name: 'Proposal sections' }).getByRole('link', { name });

describe('writing and submitting a proposal', () => {
  it('goes from the open call to a submitted proposal with its receipt in the inbox', async () => {
    const { page, context, errors } = await open({ viewport: { width: 1280, height: 900 } });

    // From the open call's page, signing in on the way.
    await signInThroughForm(page, `/calls/${CALL}`);
    await page.getByRole('heading', { level: 1, name: 'Spring 2027 call for proposals' }).waitFor();
    await page.getByRole('link', { name: 'Write a proposal' }).click();
    await page.getByRole('heading', { level: 1, name: 'Start a proposal' }).waitFor();
    expect(await page.getByRole('combobox', { name: 'Call' }).inputValue()).toBe(CALL);
    await page.getByRole('textbox', { name: 'Title' }).fill('Cold gas in the Thistle dwarf galaxy');
    await page.getByRole('combobox', { name: 'Science category' }).selectOption('Nearby galaxies');
    await expectNoSeriousAxeViolations(page, 'Start a proposal');
    await page.getByRole('button', { name: 'Create the draft' }).click();

    await page.waitForURL(/\/proposals\/SP27-\d{4}$/);
    const reference = new URL(page.url()).pathname.split('/').at(-1) ?? '';
    await page.getByRole('heading', { level: 2, name: 'Overview' }).waitFor();

    // Overview: the abstract saves itself.
    await page
      .getByRole('textbox', { name: 'Abstract' })
      .fill('We map neutral hydrogen in a nearby dwarf galaxy to weigh its dark halo.');
    await page.getByText(/^Saved · \d\d:\d\d$/).waitFor();
    expect(await page.getByText('14 of 300 words').count()).toBe(1);
    await expectNoSeriousAxeViolations(page, 'Overview');
    await screenshot(page, 'proposals-overview-light-wide');

    // Team: the PI alone, for now.
    await section(page, 'Team').click();
    await page.getByRole('heading', { level: 2, name: 'Team' }).waitFor();
    await page.getByRole('table', { name: 'Team' }).getByText(PROPOSER).waitFor();
    await expectNoSeriousAxeViolations(page, 'Team');
    await screenshot(page, 'proposals-team-light-wide');

    // Observations: a target from CSV, previewed before it is saved.
    await section(page, 'Observations').click();
    await page.waitForURL(new RegExp(`/proposals/${reference}/observations$`));
    await page.getByRole('button', { name: 'Import from CSV' }).click();
    await page
      .getByRole('textbox', { name: 'CSV text' })
      .fill(
        'name,ra,dec,extent_arcsec,flux_mjy,rest_ghz,velocity_km_s,convention,redshift\n' +
          'Thistle Dwarf,10:00:24.0,+22:30:00,30,4,,,,\n',
      );
    await page.getByRole('button', { name: 'Preview the rows' }).click();
    await page.getByText('1 row ready').waitFor();
    await page.getByRole('table', { name: 'Rows to import' }).getByText('Thistle Dwarf').waitFor();
    await expectNoSeriousAxeViolations(page, 'CSV preview');
    await screenshot(page, 'proposals-csv-preview-light-wide');
    await page.getByRole('button', { name: 'Import 1 target' }).click();
    await page.getByRole('table', { name: 'Targets' }).getByText('10:00:24.00').waitFor();

    // An observation, with the calculator's numbers live as the hours change.
    await page.getByRole('button', { name: 'Add an observation' }).click();
    const form = page.getByRole('form', { name: 'Add an observation' });
    await form
      .getByRole('combobox', { name: 'Receiver band' })
      .selectOption({ label: 'L band (1–2 GHz)' });
    const configuration = form.getByRole('combobox', { name: 'Configuration' });
    const intermediate = await configuration
      .locator('option', { hasText: /^intermediate/ })
      .getAttribute('value');
    await configuration.selectOption(intermediate ?? '');
    await form.getByRole('textbox', { name: 'Sky frequency (GHz)' }).fill('1.4');
    await form.getByRole('textbox', { name: 'Bandwidth (MHz)' }).fill('500');
    await form.getByRole('textbox', { name: 'Rms goal (µJy)' }).fill('20');
    const hours = form.getByRole('textbox', { name: 'Hours asked' });
    await hours.fill('8');
    const rms = form.locator('[data-quantity="rms"]');
    await rms.filter({ hasText: /µJy \(goal 20 µJy\)$/ }).waitFor();
    const rmsAt8 = await rms.textContent();
    await hours.fill('16');
    await expect.poll(() => rms.textContent()).not.toBe(rmsAt8);
    const rmsAt16 = await rms.textContent();
    // Twice the time: the noise falls by √2 (radiometer equation).
    const value = (text: string | null) => Number((text ?? '').split(' ')[0]);
    expect(value(rmsAt16) / value(rmsAt8)).toBeCloseTo(1 / Math.SQRT2, 2);
    await expectNoSeriousAxeViolations(page, 'observation form');
    await screenshot(page, 'proposals-observation-form-light-wide');
    await form.getByRole('button', { name: 'Add the observation' }).click();
    const observations = page.getByRole('table', { name: 'Observations' });
    await observations.getByText('Thistle Dwarf').waitFor();
    expect(await observations.getByText(rmsAt16?.split(' (')[0] ?? '').count()).toBe(1);
    await expectNoSeriousAxeViolations(page, 'Observations');
    await screenshot(page, 'proposals-observations-light-wide');

    // Documents: the science case, with the upload's progress on a slow line.
    await section(page, 'Documents').click();
    await page.getByRole('heading', { level: 2, name: 'Documents' }).waitFor();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 20,
      downloadThroughput: -1,
      uploadThroughput: 150 * 1024,
    });
    await page.getByLabel('Upload the science case (PDF)').setInputFiles({
      name: 'thistle-science-case.pdf',
      mimeType: 'application/pdf',
      buffer: await sciencePdf(),
    });
    await page
      .getByRole('progressbar', { name: /^Uploading thistle-science-case\.pdf: \d+ %$/ })
      .waitFor();
    await page
      .getByText(/^\d+ %$/)
      .first()
      .waitFor();
    await screenshot(page, 'proposals-upload-progress-light-wide');
    await page
      .getByRole('link', { name: 'Download the science case' })
      .waitFor({ timeout: 30_000 });
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: -1,
    });
    expect(await page.getByText('2 of at most 4').count()).toBe(1);
    await expectNoSeriousAxeViolations(page, 'Documents');
    await screenshot(page, 'proposals-documents-light-wide');

    // Checks: nothing blocks the submission any more.
    await section(page, 'Checks').click();
    await page.getByRole('region', { name: 'Blockers (0)' }).waitFor();
    await expectNoSeriousAxeViolations(page, 'Checks');
    await screenshot(page, 'proposals-checks-light-wide');

    // Submit, confirming first.
    await section(page, 'Submit').click();
    const submit = page.getByRole('button', { name: 'Submit the proposal' });
    await page.getByText('No blockers: ready to submit').waitFor();
    await expectNoSeriousAxeViolations(page, 'Submit');
    await screenshot(page, 'proposals-submit-light-wide');
    await submit.click();
    const dialog = page.getByRole('alertdialog', { name: 'Submit the proposal?' });
    await expectNoSeriousAxeViolations(page, 'the submit confirmation');
    await dialog.getByRole('button', { name: 'Submit', exact: true }).click();
    await page.getByText(/version 1 on/).waitFor();
    await page.getByRole('link', { name: /The compiled PDF/ }).waitFor();
    await page.getByRole('table', { name: 'Submitted versions' }).getByText('Version 1').waitFor();
    await page.getByText(/This proposal is submitted, so it is shown as it was sent/).waitFor();
    await expectNoSeriousAxeViolations(page, 'the submitted proposal');
    await screenshot(page, 'proposals-submitted-light-wide');

    // The compiled PDF is served to the team.
    const pdf = await context.request.get(`/api/proposals/${reference}/pdf`);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');

    // The receipt, with the compiled PDF attached, reaches the PI.
    const receipt = await mailTo(PROPOSER, new RegExp(`^Submitted: ${reference} version 1`));
    const attachment = receipt.attachments.find((a) => a.contentType === 'application/pdf');
    expect(attachment).toBeDefined();
    const index = receipt.attachments.indexOf(attachment!);
    const bytes = Buffer.from(
      await (
        await fetch(`${sinkUrl()}/api/messages/${receipt.id}/attachments/${index}`)
      ).arrayBuffer(),
    );
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');

    // My proposals lists it as submitted.
    await page.getByRole('link', { name: 'Proposals', exact: true }).first().click();
    const row = page
      .getByRole('table', { name: 'Your proposals' })
      .getByRole('row', { name: new RegExp(reference) });
    await row.getByText('Submitted').waitFor();
    await expectNoSeriousAxeViolations(page, 'My proposals');
    await screenshot(page, 'proposals-list-light-wide');

    expect(errors).toEqual([]);
  });

  it('works on a narrow screen in dark mode', async () => {
    const { page, context, errors } = await open({
      viewport: { width: 390, height: 844 },
      colorScheme: 'dark',
    });
    const token = await signInThroughApi(context);
    const created = await context.request.post(`/api/calls/${CALL}/proposals`, {
      headers: { 'X-CSRF-Token': token },
      data: { title: 'Magnetic fields in the Bramble filament', kind: 'standard' },
    });
    expect(created.status()).toBe(201);
    const { reference } = (await created.json()) as { reference: string };

    await page.goto(`/proposals/${reference}`);
    await page.getByRole('heading', { level: 2, name: 'Overview' }).waitFor();
    await expectNoSeriousAxeViolations(page, 'Overview, narrow and dark');
    await screenshot(page, 'proposals-overview-dark-narrow');

    await section(page, 'Observations').click();
    await page.getByRole('heading', { level: 2, name: 'Observations' }).waitFor();
    await page.getByRole('button', { name: 'Add a target' }).click();
    await page.getByRole('textbox', { name: 'Right ascension (ICRS)' }).fill('05:35:17.3');
    await page.getByText(/^Read as 05:35:17\.30/).waitFor();
    await page.getByRole('textbox', { name: 'Declination (ICRS)' }).fill('-95:00:00');
    await page
      .getByText(/Declination/)
      .filter({ hasText: /90/ })
      .first()
      .waitFor();
    await expectNoSeriousAxeViolations(page, 'target form, narrow and dark');
    await screenshot(page, 'proposals-target-form-dark-narrow');

    await section(page, 'Checks').click();
    await page.getByRole('region', { name: /^Blockers \(\d+\)$/ }).waitFor();
    await expectNoSeriousAxeViolations(page, 'Checks, narrow and dark');
    await screenshot(page, 'proposals-checks-dark-narrow');

    await section(page, 'Submit').click();
    await page.getByText(/must be cleared first/).waitFor();
    expect(await page.getByRole('button', { name: 'Submit the proposal' }).isDisabled()).toBe(true);
    await expectNoSeriousAxeViolations(page, 'Submit, narrow and dark');
    await screenshot(page, 'proposals-submit-dark-narrow');

    await page.goto('/proposals');
    await page.getByRole('table', { name: 'Your proposals' }).getByText(reference).waitFor();
    await expectNoSeriousAxeViolations(page, 'My proposals, narrow and dark');
    await screenshot(page, 'proposals-list-dark-narrow');
    expect(errors).toEqual([]);
  });
});
