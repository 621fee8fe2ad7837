import { randomBytes, randomInt } from 'node:crypto';
import { GrantedCallRole } from '../../src/calls/entities/call-role.entity.js';
import { Configuration } from '../../src/observatory/entities/configuration.entity.js';
import { tokenHash } from '../../src/plan/progress.service.js';
import type { User } from '../../src/users/entities/user.entity.js';
import type { TestApp } from './app.js';
import { makeObservatory } from './calls-factories.js';
import { type CallInReview, makeCallInReview } from './review-factories.js';

const DAY = 86_400_000;
const toDate = (ms: number) => new Date(ms).toISOString().slice(0, 10);
/** Generated plans of these tests live in 2061–2064; runs written directly in 2066–2069. */
const GENERATED_FROM = Date.UTC(2061, 0, 1);
const GENERATED_DAYS = 4 * 365;
const DIRECT_FROM = Date.UTC(2066, 0, 1);
const DIRECT_DAYS = 4 * 365;

export type GrantTier = 'tier1' | 'tier2' | 'tier3' | 'not_allocated';

export interface PlanCallOptions {
  /** Proposals (each one observation); default 2. */
  proposals?: number;
  /** Hours granted to proposal i's observation; default 3 each. */
  hours?: number[];
  /** Tier of proposal i; default tier1 for all. */
  tiers?: GrantTier[];
  /** Days the first configuration is in use; default 3. */
  days?: number;
  /** false: the call stays in deliberation (grants made, not published); default true. */
  published?: boolean;
}

export interface PlanCall extends CallInReview {
  /** The inclusive UTC dates the first configuration is in use. */
  period: { start: string; end: string };
}

/**
 * A call with grants, as the chair's publication leaves it: makeCallInReview's proposals with one
 * observation each in the first configuration, whose dates are a random stretch of `days` in
 * 2061–2064 (the reviews fall due before it); a grant row per proposal with its tier and the
 * observation's hours; the call published (status and published_at) and the proposals allocated.
 */
export async function makePlanCall(t: TestApp, opts: PlanCallOptions = {}): Promise<PlanCall> {
  const days = opts.days ?? 3;
  const array = await makeObservatory(t.dataSource);
  const startMs = GENERATED_FROM + randomInt(0, GENERATED_DAYS - days) * DAY;
  const period = { start: toDate(startMs), end: toDate(startMs + (days - 1) * DAY) };
  await t.dataSource.manager.update(
    Configuration,
    { id: array.configurations[0]!.id },
    { inUseFrom: period.start, inUseTo: period.end },
  );
  array.configurations[0]!.inUseFrom = period.start;
  array.configurations[0]!.inUseTo = period.end;
  const n = opts.proposals ?? 2;
  const c = await makeCallInReview(t, {
    array,
    status: 'deliberation',
    proposals: n,
    compilePdf: false,
    hoursAsked: opts.hours ?? 3,
  });
  const m = t.dataSource.manager;
  const published = opts.published ?? true;
  for (const [i, p] of c.proposals.entries()) {
    const tier = opts.tiers?.[i] ?? 'tier1';
    await m.query(
      `INSERT INTO proposal_grants (proposal_id, tier, updated_at) VALUES ($1, $2, now())`,
      [p.proposal.id, tier],
    );
    await m.query(
      `INSERT INTO observation_grants (observation_id, proposal_id, hours) VALUES ($1, $2, $3)`,
      [p.observation.id, p.proposal.id, tier === 'not_allocated' ? 0 : (opts.hours?.[i] ?? 3)],
    );
    if (published)
      await m.query(`UPDATE proposals SET status = $2 WHERE id = $1`, [
        p.proposal.id,
        tier === 'not_allocated' ? 'not_allocated' : 'allocated',
      ]);
  }
  if (published) {
    await m.query(`UPDATE calls SET status = 'published', published_at = now() WHERE id = $1`, [
      c.call.id,
    ]);
    c.call.status = 'published';
  }
  return { ...c, period };
}

/**
 * One run written straight to the database at a random free stretch of 2066–2069 (hours long,
 * on the 5-minute grid), retried when another run already holds the time.
 */
export async function insertRun(
  t: TestApp,
  c: Pick<PlanCall, 'call' | 'proposals'>,
  opts: {
    proposal?: number;
    hours?: number;
    status?: 'planned' | 'observed';
    locked?: boolean;
  } = {},
): Promise<{ id: string; startsAt: Date; endsAt: Date }> {
  const p = c.proposals[opts.proposal ?? 0]!;
  const hours = opts.hours ?? 2;
  for (let attempt = 0; attempt < 20; attempt++) {
    const startsAt = new Date(DIRECT_FROM + randomInt(0, DIRECT_DAYS * 288) * 300_000);
    const endsAt = new Date(startsAt.getTime() + hours * 3_600_000);
    try {
      const rows: Array<{ id: string }> = await t.dataSource.query(
        `INSERT INTO runs (call_id, observation_id, starts_at, ends_at, status, hours_obtained, locked)
         VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
        [
          c.call.id,
          p.observation.id,
          startsAt,
          endsAt,
          opts.status ?? 'planned',
          opts.status === 'observed' ? hours : null,
          opts.locked ?? false,
        ],
      );
      return { id: rows[0]!.id, startsAt, endsAt };
    } catch (error) {
      if ((error as { driverError?: { code?: string } }).driverError?.code !== '23P01') throw error;
    }
  }
  throw new Error('insertRun: no free time found');
}

/** Makes the user chair of the call (per-call roles are read again on each request). */
export async function makeChairOf(t: TestApp, user: User, callId: string): Promise<void> {
  await t.dataSource.manager.insert(GrantedCallRole, {
    userId: user.id,
    callId,
    role: 'chair',
    grantedAt: new Date(),
  });
}

/** Adds the user to the proposal's team as a joined Co-I. */
export async function joinTeam(t: TestApp, proposalId: string, user: User): Promise<void> {
  await t.dataSource.query(
    `INSERT INTO proposal_members (proposal_id, user_id, email, role, can_edit, invited_at, joined_at)
     VALUES ($1, $2, $3, 'coi', false, now(), now())`,
    [proposalId, user.id, user.email],
  );
}

/** A calendar feed row for the user; answers the token its link carries. */
export async function makeFeed(t: TestApp, user: User): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await t.dataSource.query(
    `INSERT INTO calendar_feeds (user_id, token_sha256) VALUES ($1, $2)
     ON CONFLICT (user_id) DO UPDATE SET token_sha256 = $2`,
    [user.id, tokenHash(token)],
  );
  return token;
}
