/**
 * The demo's story holds together: loaded into a database of its own (the shared test database
 * keeps its calls and runs), AU26 has every review in with the disagreements and the pressure the
 * chair needs, WN26 gives the referee and staff work, SP26's plan is a real, non-overlapping one.
 */
import { normaliseScores } from '@skyhours/calc';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../src/database/data-source.js';
import { loadDemo } from '../src/demo/load-demo.js';

const NOW = new Date('2026-12-03T18:00:00Z');
const DAY = 86_400_000;
const NAME = `demo_story_test_${process.pid}`;

let admin: DataSource;
let db: DataSource;

beforeAll(async () => {
  const url = new URL(process.env.DATABASE_URL!);
  admin = new DataSource({ type: 'postgres', url: url.toString() });
  await admin.initialize();
  await admin.query(`DROP DATABASE IF EXISTS ${NAME}`);
  await admin.query(`CREATE DATABASE ${NAME}`);
  url.pathname = `/${NAME}`;
  db = new DataSource(dataSourceOptions(url.toString()));
  await db.initialize();
  await db.runMigrations();
  await loadDemo(db, { password: 'demo-story-test', now: NOW });
}, 240_000);

afterAll(async () => {
  await db?.destroy();
  await admin?.query(`DROP DATABASE IF EXISTS ${NAME}`);
  await admin?.destroy();
});

async function callOf(code: string) {
  const [call]: {
    id: string;
    status: string;
    referees_per_proposal: number;
    score_min: number;
    score_max: number;
    score_higher_is_better: boolean;
    review_due_at: Date;
    published_at: Date | null;
  }[] = await db.query(`SELECT * FROM calls WHERE code = $1`, [code]);
  return call!;
}

async function reviewsOf(callId: string) {
  return (await db.query(
    `SELECT a.proposal_id, a.referee_id, a.status, a.score, a.expertise, a.comment_to_pi,
            a.comment_to_committee, u.email
       FROM review_assignments a JOIN proposals p ON p.id = a.proposal_id
       JOIN users u ON u.id = a.referee_id
      WHERE p.call_id = $1`,
    [callId],
  )) as {
    proposal_id: string;
    referee_id: string;
    status: string;
    score: number | null;
    expertise: number | null;
    comment_to_pi: string;
    comment_to_committee: string;
    email: string;
  }[];
}

describe('AU26, in deliberation', () => {
  it('has every proposal reviewed by the call’s number of referees, all submitted, on its scale', async () => {
    const call = await callOf('AU26');
    expect(call.status).toBe('deliberation');
    const [{ n }] = await db.query(`SELECT count(*)::int AS n FROM proposals WHERE call_id = $1`, [
      call.id,
    ]);
    expect(n).toBe(40);
    const reviews = await reviewsOf(call.id);
    expect(reviews).toHaveLength(40 * call.referees_per_proposal);
    for (const r of reviews) {
      expect(r.status).toBe('submitted');
      expect(r.score).toBeGreaterThanOrEqual(call.score_min);
      expect(r.score).toBeLessThanOrEqual(call.score_max);
      expect([1, 2, 3]).toContain(r.expertise);
      expect(r.comment_to_pi.length).toBeGreaterThan(20);
      expect(r.comment_to_committee.length).toBeGreaterThan(10);
    }
    const perProposal = new Map<string, number>();
    for (const r of reviews)
      perProposal.set(r.proposal_id, (perProposal.get(r.proposal_id) ?? 0) + 1);
    expect(new Set(perProposal.values())).toEqual(new Set([call.referees_per_proposal]));
    // Varied comments, not one sentence pasted everywhere.
    expect(new Set(reviews.map((r) => r.comment_to_pi)).size).toBeGreaterThan(40);
    // Ten invented referees plus the demo referee share the work.
    const load = new Map<string, number>();
    for (const r of reviews) load.set(r.email, (load.get(r.email) ?? 0) + 1);
    expect(load.size).toBe(11);
    expect(load.get('referee@skyhours.test')).toBeGreaterThan(0);
  });

  it('has 3 or 4 disagreements by the standing’s own rule (scores.ts), and a harsh and a lenient referee', async () => {
    const call = await callOf('AU26');
    const reviews = await reviewsOf(call.id);
    const standing = normaliseScores(
      reviews.map((r) => ({ proposalId: r.proposal_id, refereeId: r.referee_id, score: r.score! })),
      { min: call.score_min, max: call.score_max, higherIsBetter: call.score_higher_is_better },
    );
    const disagreements = standing.filter((s) => s.disagreement).length;
    expect(disagreements).toBeGreaterThanOrEqual(3);
    expect(disagreements).toBeLessThanOrEqual(4);
    // Harshness: a referee's scores against the other referees' mean on the same proposals.
    const offsets = [...refereeOffsets(reviews).values()].sort((a, b) => a - b);
    expect(offsets[0]).toBeLessThan(-1);
    expect(offsets.at(-1)).toBeGreaterThan(1);
    // The rest are near the others.
    expect(Math.abs(offsets[Math.floor(offsets.length / 2)]!)).toBeLessThan(0.6);
  });

  it('never gives a proposal to a referee on its team or from one of its team’s institutes', async () => {
    const clashes = await db.query(
      `SELECT a.id FROM review_assignments a
         JOIN users r ON r.id = a.referee_id
         JOIN proposal_members m ON m.proposal_id = a.proposal_id
         LEFT JOIN users u ON u.id = m.user_id
        WHERE m.user_id = a.referee_id OR u.affiliation = r.affiliation`,
    );
    expect(clashes).toEqual([]);
  });

  it('asks about three times the extended configuration’s offered hours, with every proposal assessed and none decided', async () => {
    const call = await callOf('AU26');
    const [{ asked, offered }] = await db.query(
      `SELECT (SELECT sum(o.hours_asked) FROM proposal_observations o
                 JOIN proposals p ON p.id = o.proposal_id
                WHERE p.call_id = $1 AND o.configuration_id = cf.id) AS asked,
              cc.hours_offered AS offered
         FROM call_capacities cc JOIN configurations cf ON cf.id = cc.configuration_id
        WHERE cc.call_id = $1 AND cf.name = 'extended'`,
      [call.id],
    );
    const pressure = asked / offered;
    expect(pressure).toBeGreaterThanOrEqual(2.5);
    expect(pressure).toBeLessThanOrEqual(3.5);
    const verdicts: { verdict: string; n: number }[] = await db.query(
      `SELECT t.verdict, count(*)::int AS n FROM technical_assessments t
         JOIN proposals p ON p.id = t.proposal_id WHERE p.call_id = $1 GROUP BY t.verdict`,
      [call.id],
    );
    const by = Object.fromEntries(verdicts.map((v) => [v.verdict, v.n]));
    expect(by.not_feasible).toBe(2);
    expect(by.feasible_with_changes).toBeGreaterThanOrEqual(3);
    expect((by.feasible ?? 0) + (by.feasible_with_changes ?? 0) + (by.not_feasible ?? 0)).toBe(40);
    const [{ grants }] = await db.query(
      `SELECT count(*)::int AS grants FROM proposal_grants g JOIN proposals p ON p.id = g.proposal_id
        WHERE p.call_id = $1`,
      [call.id],
    );
    expect(grants).toBe(0);
  });
});

describe('WN26, in review', () => {
  it('gives the demo referee 3 assignments, 1 submitted and 2 due in 5 days, and staff 3 assessments to make', async () => {
    const call = await callOf('WN26');
    expect(call.status).toBe('in_review');
    const dueInDays = (call.review_due_at.getTime() - NOW.getTime()) / DAY;
    expect(dueInDays).toBeGreaterThan(4);
    expect(dueInDays).toBeLessThan(6);
    const mine = (await reviewsOf(call.id)).filter((r) => r.email === 'referee@skyhours.test');
    expect(mine.map((r) => r.status).sort()).toEqual(['accepted', 'accepted', 'submitted']);
    const [{ waiting }] = await db.query(
      `SELECT count(*)::int AS waiting FROM proposals p
        WHERE p.call_id = $1 AND p.submitted_version IS NOT NULL
          AND NOT EXISTS (SELECT 1 FROM technical_assessments t WHERE t.proposal_id = p.id)`,
      [call.id],
    );
    expect(waiting).toBe(3);
  });
});

describe('SP26, archived', () => {
  it('is published with a tier for every proposal and the outcome statuses', async () => {
    const call = await callOf('SP26');
    expect(call.status).toBe('archived');
    expect(call.published_at).toBeInstanceOf(Date);
    const rows: { status: string; tier: string | null }[] = await db.query(
      `SELECT p.status, g.tier FROM proposals p LEFT JOIN proposal_grants g ON g.proposal_id = p.id
        WHERE p.call_id = $1`,
      [call.id],
    );
    expect(rows.length).toBeGreaterThanOrEqual(10);
    for (const r of rows) {
      expect(r.tier).not.toBeNull();
      expect(r.status === 'not_allocated').toBe(r.tier === 'not_allocated');
    }
    expect(rows.filter((r) => r.status === 'completed')).toHaveLength(1);
    expect(rows.some((r) => r.status === 'allocated' || r.status === 'in_progress')).toBe(true);
  });

  it('has runs in the past weeks of the intermediate configuration that never overlap', async () => {
    const call = await callOf('SP26');
    const runs: { starts_at: Date; ends_at: Date; status: string }[] = await db.query(
      `SELECT starts_at, ends_at, status FROM runs WHERE call_id = $1 ORDER BY starts_at`,
      [call.id],
    );
    expect(runs.length).toBeGreaterThan(10);
    const [{ from }] = await db.query(
      `SELECT in_use_from::text AS from FROM configurations WHERE name = 'intermediate'`,
    );
    for (let i = 0; i < runs.length; i++) {
      const run = runs[i]!;
      expect(run.ends_at.getTime()).toBeGreaterThan(run.starts_at.getTime());
      expect(run.ends_at.getTime()).toBeLessThanOrEqual(NOW.getTime());
      expect(run.starts_at.getTime()).toBeGreaterThanOrEqual(Date.parse(`${from}T00:00:00Z`));
      if (i > 0)
        expect(run.starts_at.getTime()).toBeGreaterThanOrEqual(runs[i - 1]!.ends_at.getTime());
    }
    const statuses = new Set(runs.map((r) => r.status));
    expect(statuses).toEqual(new Set(['observed', 'lost', 'planned']));
  });

  it('shows the demo proposer’s allocated proposal part observed and the completed one fully', async () => {
    const rows: { status: string; granted: number; obtained: number | null }[] = await db.query(
      `SELECT p.status,
              (SELECT sum(hours) FROM observation_grants g WHERE g.proposal_id = p.id) AS granted,
              (SELECT sum(r.hours_obtained) FROM runs r
                 JOIN proposal_observations o ON o.id = r.observation_id
                WHERE o.proposal_id = p.id) AS obtained
         FROM proposals p JOIN calls c ON c.id = p.call_id
         JOIN proposal_members m ON m.proposal_id = p.id AND m.role = 'pi'
         JOIN users u ON u.id = m.user_id
        WHERE c.code = 'SP26' AND (u.email = 'proposer@skyhours.test' OR p.status = 'completed')`,
    );
    const mine = rows.find((r) => r.status !== 'completed')!;
    expect(mine.status).toBe('in_progress');
    expect(mine.obtained).toBeGreaterThan(0);
    expect(mine.obtained!).toBeLessThan(mine.granted);
    const completed = rows.find((r) => r.status === 'completed')!;
    expect(completed.obtained!).toBeCloseTo(completed.granted, 1);
  });
});

/** Per referee: the mean of (their score − the other referees' mean score on that proposal). */
function refereeOffsets(
  reviews: { proposal_id: string; email: string; score: number | null }[],
): Map<string, number> {
  const byProposal = new Map<string, { email: string; score: number }[]>();
  for (const r of reviews)
    byProposal.set(r.proposal_id, [
      ...(byProposal.get(r.proposal_id) ?? []),
      { email: r.email, score: r.score! },
    ]);
  const sums = new Map<string, [number, number]>();
  for (const group of byProposal.values())
    for (const r of group) {
      const others = group.filter((o) => o !== r);
      const offset = r.score - others.reduce((a, o) => a + o.score, 0) / others.length;
      const [s, n] = sums.get(r.email) ?? [0, 0];
      sums.set(r.email, [s + offset, n + 1]);
    }
  return new Map([...sums].map(([k, [s, n]]) => [k, s / n]));
}
