import pg from 'pg';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { seriousAxeViolations } from './axe';
import { launchBrowser, type BrowserSession } from './browser';
import { resetDemo } from './demo';
import { screenshot } from './screenshot';

const REFEREE = 'referee@skyhours.test';
const PASSWORD = process.env.DEMO_PASSWORD ?? 'skyhours-demo';
/** The demo's call past its deadline that referee@ referees. */
const CALL = 'AU26';

let browsers: BrowserSession[] = [];
let assignmentId = '';
let reference = '';

/**
 * The story this file needs: AU26 back in review with its due date a week ahead and one fresh
 * assignment of referee@ on a submitted proposal they are not in conflict with. Written straight
 * to the database; the demo is loaded again afterwards.
 */
async function putRefereeOnAProposal(): Promise<void> {
  if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set (npm test sets it)');
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    await db.query(
      `UPDATE calls SET status = 'in_review', review_due_at = now() + interval '7 days' WHERE code = $1`,
      [CALL],
    );
    const { rows } = await db.query<{ id: string; reference: string; referee: string }>(
      `SELECT p.id, p.reference, u.id AS referee
         FROM proposals p JOIN calls c ON c.id = p.call_id
         JOIN users u ON u.email = $2
        WHERE c.code = $1 AND p.status IN ('submitted', 'under_review')
          AND p.submitted_version IS NOT NULL
          AND NOT EXISTS (SELECT 1 FROM review_assignments a
                           WHERE a.proposal_id = p.id AND a.referee_id = u.id)
          AND NOT EXISTS (SELECT 1 FROM proposal_members m LEFT JOIN users mu ON mu.id = m.user_id
                           WHERE m.proposal_id = p.id
                             AND (m.user_id = u.id OR lower(btrim(mu.affiliation)) = lower(btrim(u.affiliation))))
        ORDER BY p.reference LIMIT 1`,
      [CALL, REFEREE],
    );
    const row = rows[0];
    if (!row) throw new Error(`the demo has no proposal of ${CALL} for ${REFEREE} to review`);
    const inserted = await db.query<{ id: string }>(
      `INSERT INTO review_assignments (proposal_id, referee_id, status, assigned_at, updated_at)
       VALUES ($1, $2, 'invited', now(), now()) RETURNING id`,
      [row.id, row.referee],
    );
    assignmentId = inserted.rows[0]!.id;
    reference = row.reference;
  } finally {
    await db.end();
  }
}

beforeAll(putRefereeOnAProposal, 60_000);
afterAll(resetDemo, 180_000);
afterEach(async () => {
  await Promise.all(browsers.map((b) => b.close()));
  browsers = [];
});

describe('Reviewing', () => {
  it('a referee opens an assignment, saves a draft and submits the review', async () => {
    const browser = await launchBrowser();
    browsers.push(browser);
    const { page } = browser;
    await page.goto(`/sign-in?next=${encodeURIComponent('/reviewing')}`);
    await page.getByRole('textbox', { name: 'E-mail' }).fill(REFEREE);
    await page.getByLabel('Password').fill(PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();

    await page.getByRole('heading', { name: 'Reviewing', level: 1 }).waitFor();
    const link = page.getByRole('link', { name: reference, exact: true });
    await link.waitFor();
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'reviewing-assignments');
    await link.click();

    await page.waitForURL(`**/reviewing/${assignmentId}`);
    const score = page.getByRole('textbox', { name: /Score/ });
    await score.fill('4');
    await page
      .getByRole('textbox', { name: /Comment to the PI/ })
      .fill('A well-argued case; the requested sensitivity is reached in the hours asked.');
    await page.getByRole('button', { name: 'Save draft' }).click();
    await page.getByText('Draft saved').first().waitFor();

    await page.getByLabel(/Your expertise/).selectOption('2');
    await page.getByRole('button', { name: 'Submit review' }).click();
    await page.getByRole('button', { name: 'Save changes' }).waitFor();
    expect(await page.getByText('Submitted', { exact: true }).count()).toBeGreaterThan(0);
    expect(await seriousAxeViolations(page)).toEqual([]);
    await screenshot(page, 'reviewing-submitted');

    // The server kept it: a fresh load shows the submitted score.
    await page.reload();
    await expect(page.getByRole('textbox', { name: /Score/ }).inputValue()).resolves.toBe('4');
    expect(browser.errors).toEqual([]);
  }, 120_000);
});
