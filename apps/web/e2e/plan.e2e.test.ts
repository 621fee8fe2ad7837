import pg from 'pg';
import type { BrowserContext } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { resetDemo } from './demo';
import { screenshot } from './screenshot';

let browsers: BrowserSession[] = [];
const PROPOSER = 'proposer@skyhours.test';

async function open(): Promise<BrowserSession> {
  const browser = await launchBrowser({ viewport: { width: 1400, height: 1000 } });
  browsers.push(browser);
  return browser;
}

async function signIn(context: BrowserContext, email: string): Promise<void> {
  const csrf = await context.request.get('/api/auth/csrf');
  const { token } = (await csrf.json()) as { token: string };
  const res = await context.request.post('/api/auth/login', {
    headers: { 'X-CSRF-Token': token },
    data: { email, password: process.env.DEMO_PASSWORD ?? 'skyhours-demo' },
  });
  expect(res.status()).toBe(200);
}

/**
 * The chair's publication of AU26 is another screen's to test: here it is written to the
 * database as publishing leaves it (three proposals granted 1 h on their first observation, Tier
 * 1, the call published), one of them the proposal the demo proposer is on.
 */
async function publishSomeGrants(): Promise<string> {
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    const mine = await client.query<{ id: string; reference: string }>(
      `SELECT p.id, p.reference FROM proposals p JOIN calls c ON c.id = p.call_id
         JOIN proposal_members m ON m.proposal_id = p.id
        WHERE c.code = 'AU26' AND m.email = $1 LIMIT 1`,
      [PROPOSER],
    );
    const others = await client.query<{ id: string }>(
      `SELECT p.id FROM proposals p JOIN calls c ON c.id = p.call_id
        WHERE c.code = 'AU26' AND p.id <> $1 ORDER BY p.number LIMIT 2`,
      [mine.rows[0]!.id],
    );
    for (const id of [mine.rows[0]!.id, ...others.rows.map((r) => r.id)]) {
      await client.query(
        `INSERT INTO proposal_grants (proposal_id, tier, updated_at) VALUES ($1, 'tier1', now())`,
        [id],
      );
      await client.query(
        `INSERT INTO observation_grants (observation_id, proposal_id, hours)
         SELECT o.id, o.proposal_id, 1 FROM proposal_observations o
          WHERE o.proposal_id = $1 ORDER BY o.position LIMIT 1`,
        [id],
      );
      await client.query(`UPDATE proposals SET status = 'allocated' WHERE id = $1`, [id]);
    }
    await client.query(
      `UPDATE calls SET status = 'published', published_at = now() WHERE code = 'AU26'`,
    );
    return mine.rows[0]!.reference;
  } finally {
    await client.end();
  }
}

describe('the observing plan', () => {
  let reference: string;

  beforeAll(async () => {
    reference = await publishSomeGrants();
  });
  afterEach(async () => {
    await Promise.all(browsers.map((b) => b.close()));
    browsers = [];
  });
  afterAll(() => resetDemo());

  it('staff generate the plan of a published call and record a run; the team sees its progress', async () => {
    const staff = await open();
    await signIn(staff.context, 'staff@skyhours.test');
    const { page } = staff;
    await page.goto('/operations/plans');
    await page.getByRole('link', { name: 'AU26' }).click();
    await page.getByRole('heading', { name: 'Plan AU26', level: 1 }).waitFor();
    await page.getByRole('button', { name: 'Generate plan' }).click();
    const record = page.getByRole('button', {
      name: new RegExp(`^Record the run of ${reference}`),
    });
    await record.first().waitFor();
    expect(await page.getByRole('img', { name: new RegExp(reference) }).count()).toBeGreaterThan(0);
    await record.first().click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Outcome').selectOption('observed');
    await dialog.getByLabel('Quality note').fill('Clean data throughout');
    await dialog.getByRole('button', { name: 'Save record' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page
      .getByText(/Observed, 1 h/)
      .first()
      .waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'plan-au26');
    expect(staff.errors).toEqual([]);

    const team = await open();
    await signIn(team.context, PROPOSER);
    await team.page.goto(`/proposals/${reference}`);
    const progress = team.page.getByRole('region', { name: 'Observing progress' });
    await progress.waitFor();
    await progress.getByText('Completed: everything granted has been observed').waitFor();
    await expect(
      progress.getByText(/granted 1 h · observed 1 h · remaining 0 h/).count(),
    ).resolves.toBe(1);
    expect(await seriousAxeViolations(team.page)).toEqual([]);
    await screenshot(team.page, 'plan-progress');
  });
});
