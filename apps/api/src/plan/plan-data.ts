import type { DataSource, EntityManager } from 'typeorm';
import { julianDayFromInstant, localSiderealTimeHours } from '@skyhours/calc';
import { notFound } from '../common/errors/app-error.js';
import type { LostReason, RunStatus } from './entities/run.entity.js';
import type { PlanRun, PlanTier } from './plan-contract.js';

type Db = DataSource | EntityManager;

/** A call with its site, as every plan use case needs it. */
export interface PlanCall {
  id: string;
  code: string;
  title: string;
  status: string;
  publishedAt: Date | null;
  reviewDueAt: Date;
  scoreHigherIsBetter: boolean;
  site: {
    name: string;
    timeZone: string;
    eastLongitudeDeg: number;
    latitudeDeg: number;
    elevationLimitDeg: number;
  };
}

/** A call is planned once its outcomes are published (and read on after it is archived). */
export const isPublished = (call: Pick<PlanCall, 'status' | 'publishedAt'>) =>
  call.publishedAt !== null || call.status === 'published' || call.status === 'archived';

export async function loadPlanCall(db: Db, code: string): Promise<PlanCall | null> {
  const rows: Array<Record<string, unknown>> = await db.query(
    `SELECT c.id, c.code, c.title, c.status, c.published_at, c.review_due_at, c.score_higher_is_better,
            o.name AS site_name, o.time_zone, o.site_longitude_deg, o.site_latitude_deg, o.elevation_limit_deg
       FROM calls c JOIN observatories o ON o.id = c.observatory_id
      WHERE c.code = upper($1)`,
    [code],
  );
  const r = rows[0];
  if (!r) return null;
  return {
    id: r.id as string,
    code: r.code as string,
    title: r.title as string,
    status: r.status as string,
    publishedAt: (r.published_at as Date | null) ?? null,
    reviewDueAt: r.review_due_at as Date,
    scoreHigherIsBetter: r.score_higher_is_better as boolean,
    site: {
      name: r.site_name as string,
      timeZone: r.time_zone as string,
      eastLongitudeDeg: r.site_longitude_deg as number,
      latitudeDeg: r.site_latitude_deg as number,
      elevationLimitDeg: r.elevation_limit_deg as number,
    },
  };
}

export async function requirePlanCall(db: Db, code: string): Promise<PlanCall> {
  const call = await loadPlanCall(db, code);
  if (!call) throw notFound('Call');
  return call;
}

/** One granted observation of a call, in the order the generator takes them. */
export interface GrantedObservation {
  observationId: string;
  proposalId: string;
  reference: string;
  title: string;
  position: number;
  hours: number;
  tier: PlanTier;
  rank: number;
  configurationId: string;
  configurationName: string;
  inUseFrom: string;
  inUseTo: string | null;
  targetName: string;
  raDeg: number;
  decDeg: number;
}

/**
 * Granted observations (tiers 1–3, hours > 0). The rank inside a tier is the proposal's mean
 * submitted score (best first, by the call's score direction), then its number: the chair's
 * standing normalises scores further, but its order inside a tier is the chair's to set by tier.
 */
export async function grantedObservations(db: Db, call: PlanCall): Promise<GrantedObservation[]> {
  const rows: Array<Record<string, unknown>> = await db.query(
    `SELECT og.observation_id, og.hours, pg.tier, p.id AS proposal_id, p.reference, p.title, p.number,
            o.position, o.configuration_id, cfg.name AS configuration_name,
            cfg.in_use_from::text AS in_use_from, cfg.in_use_to::text AS in_use_to,
            t.name AS target_name, t.ra_deg, t.dec_deg,
            (SELECT avg(ra.score) FROM review_assignments ra
              WHERE ra.proposal_id = p.id AND ra.status = 'submitted') AS mean_score
       FROM observation_grants og
       JOIN proposal_grants pg ON pg.proposal_id = og.proposal_id
       JOIN proposals p ON p.id = og.proposal_id
       JOIN proposal_observations o ON o.id = og.observation_id
       JOIN proposal_targets t ON t.id = o.target_id
       JOIN configurations cfg ON cfg.id = o.configuration_id
      WHERE p.call_id = $1 AND pg.tier IN ('tier1', 'tier2', 'tier3') AND og.hours > 0`,
    [call.id],
  );
  const sign = call.scoreHigherIsBetter ? -1 : 1;
  const key = (r: Record<string, unknown>) =>
    r.mean_score === null ? Infinity : sign * Number(r.mean_score);
  rows.sort(
    (a, b) =>
      String(a.tier).localeCompare(String(b.tier)) ||
      key(a) - key(b) ||
      (a.number as number) - (b.number as number) ||
      (a.position as number) - (b.position as number),
  );
  return rows.map((r, i) => ({
    observationId: r.observation_id as string,
    proposalId: r.proposal_id as string,
    reference: r.reference as string,
    title: r.title as string,
    position: r.position as number,
    hours: r.hours as number,
    tier: r.tier as PlanTier,
    rank: i + 1,
    configurationId: r.configuration_id as string,
    configurationName: r.configuration_name as string,
    inUseFrom: r.in_use_from as string,
    inUseTo: (r.in_use_to as string | null) ?? null,
    targetName: r.target_name as string,
    raDeg: r.ra_deg as number,
    decDeg: r.dec_deg as number,
  }));
}

export const lstAt = (instant: Date, eastLongitudeDeg: number) =>
  localSiderealTimeHours({ julianDay: julianDayFromInstant(instant), eastLongitudeDeg });

const RUN_SELECT = `
  SELECT r.id, r.call_id, r.starts_at, r.ends_at, r.status, r.locked, r.hours_obtained, r.quality_note,
         r.lost_reason, r.recorded_at, r.version, r.observation_id, o.position,
         cfg.name AS configuration_name, t.name AS target_name, t.ra_deg, t.dec_deg,
         p.id AS proposal_id, p.reference, p.title, pg.tier,
         so.site_longitude_deg
    FROM runs r
    JOIN proposal_observations o ON o.id = r.observation_id
    JOIN proposals p ON p.id = o.proposal_id
    JOIN proposal_targets t ON t.id = o.target_id
    JOIN configurations cfg ON cfg.id = o.configuration_id
    JOIN observatories so ON so.id = cfg.observatory_id
    LEFT JOIN proposal_grants pg ON pg.proposal_id = p.id`;

export interface RunRow extends PlanRun {
  callId: string;
  proposalId: string;
}

function toRun(r: Record<string, unknown>): RunRow {
  const start = r.starts_at as Date;
  const end = r.ends_at as Date;
  const lon = r.site_longitude_deg as number;
  const tier = r.tier as string | null;
  return {
    id: r.id as string,
    callId: r.call_id as string,
    proposalId: r.proposal_id as string,
    startsAt: start.toISOString(),
    endsAt: end.toISOString(),
    hours: (end.getTime() - start.getTime()) / 3_600_000,
    lstStartHours: lstAt(start, lon),
    lstEndHours: lstAt(end, lon),
    status: r.status as RunStatus,
    locked: r.locked as boolean,
    hoursObtained: (r.hours_obtained as number | null) ?? null,
    qualityNote: r.quality_note as string,
    lostReason: (r.lost_reason as LostReason | null) ?? null,
    recordedAt: r.recorded_at ? (r.recorded_at as Date).toISOString() : null,
    version: r.version as number,
    observation: {
      id: r.observation_id as string,
      position: r.position as number,
      configurationName: r.configuration_name as string,
    },
    target: {
      name: r.target_name as string,
      raDeg: r.ra_deg as number,
      decDeg: r.dec_deg as number,
    },
    proposal: { reference: r.reference as string, title: r.title as string },
    tier: tier === 'tier1' || tier === 'tier2' || tier === 'tier3' ? tier : null,
  };
}

export async function runsOfCall(db: Db, callId: string): Promise<RunRow[]> {
  const rows: Array<Record<string, unknown>> = await db.query(
    `${RUN_SELECT} WHERE r.call_id = $1 ORDER BY r.starts_at`,
    [callId],
  );
  return rows.map(toRun);
}

export async function runById(db: Db, id: string, lock = false): Promise<RunRow | null> {
  const rows: Array<Record<string, unknown>> = await db.query(
    `${RUN_SELECT} WHERE r.id = $1${lock ? ' FOR UPDATE OF r' : ''}`,
    [id],
  );
  return rows[0] ? toRun(rows[0]) : null;
}

/** Runs of the published calls' proposals on which the user is a joined team member. */
export async function runsOfMember(db: Db, userId: string): Promise<RunRow[]> {
  const rows: Array<Record<string, unknown>> = await db.query(
    `${RUN_SELECT}
      JOIN calls c ON c.id = r.call_id
     WHERE (c.published_at IS NOT NULL OR c.status IN ('published', 'archived'))
       AND EXISTS (SELECT 1 FROM proposal_members m WHERE m.proposal_id = p.id AND m.user_id = $1)
     ORDER BY r.starts_at`,
    [userId],
  );
  return rows.map(toRun);
}
