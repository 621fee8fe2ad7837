import { createHash, randomBytes } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { isStaff } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { notFound } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import type { Progress } from './plan-contract.js';
import { runsOfMember, type RunRow } from './plan-data.js';

const round = (x: number) => Math.round(x * 1000) / 1000;
export const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');

/** What a team sees of its time: progress per observation, and its private calendar feed. */
@Injectable()
export class ProgressService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly clock: Clock,
    private readonly config: AppConfig,
  ) {}

  /** The team's (and staff's) view; before publication only that there is nothing yet. */
  async progress(user: SessionUser, reference: string): Promise<Progress> {
    const rows: Array<Record<string, unknown>> = await this.dataSource.query(
      `SELECT p.id, p.reference, p.status, p.completed_at, c.status AS call_status, c.published_at,
              pg.tier, o.time_zone,
              EXISTS (SELECT 1 FROM proposal_members m WHERE m.proposal_id = p.id AND m.user_id = $2) AS member
         FROM proposals p JOIN calls c ON c.id = p.call_id JOIN observatories o ON o.id = c.observatory_id
         LEFT JOIN proposal_grants pg ON pg.proposal_id = p.id
        WHERE p.reference = upper($1)`,
      [reference, user.id],
    );
    const p = rows[0];
    if (!p || !(p.member || isStaff(user))) throw notFound('Proposal');
    const published =
      p.published_at !== null || p.call_status === 'published' || p.call_status === 'archived';
    const base: Progress = {
      reference: p.reference as string,
      published,
      status: p.status as string,
      completedAt: p.completed_at ? (p.completed_at as Date).toISOString() : null,
      tier: published ? ((p.tier as Progress['tier']) ?? null) : null,
      siteTimeZone: p.time_zone as string,
      observations: [],
      runs: [],
      totals: { grantedHours: 0, observedHours: 0, remainingHours: 0 },
    };
    if (!published) return base;
    const obs: Array<Record<string, unknown>> = await this.dataSource.query(
      `SELECT o.id, o.position, t.name AS target_name, cfg.name AS configuration_name,
              coalesce(og.hours, 0) AS granted
         FROM proposal_observations o
         JOIN proposal_targets t ON t.id = o.target_id
         JOIN configurations cfg ON cfg.id = o.configuration_id
         JOIN observation_grants og ON og.observation_id = o.id
        WHERE o.proposal_id = $1 AND og.hours > 0
        ORDER BY o.position`,
      [p.id],
    );
    const runs: Array<Record<string, unknown>> = await this.dataSource.query(
      `SELECT r.id, r.observation_id, r.starts_at, r.ends_at, r.status, r.hours_obtained
         FROM runs r JOIN proposal_observations o ON o.id = r.observation_id
        WHERE o.proposal_id = $1 ORDER BY r.starts_at`,
      [p.id],
    );
    base.runs = runs.map((r) => ({
      id: r.id as string,
      observationId: r.observation_id as string,
      startsAt: (r.starts_at as Date).toISOString(),
      endsAt: (r.ends_at as Date).toISOString(),
      status: r.status as Progress['runs'][number]['status'],
      hoursObtained: (r.hours_obtained as number | null) ?? null,
    }));
    base.observations = obs.map((o) => {
      const mine = base.runs.filter((r) => r.observationId === o.id);
      const observed = mine
        .filter((r) => r.status === 'observed')
        .reduce((s, r) => s + (r.hoursObtained ?? 0), 0);
      const planned = mine
        .filter((r) => r.status === 'planned')
        .reduce((s, r) => s + (Date.parse(r.endsAt) - Date.parse(r.startsAt)) / 3_600_000, 0);
      const granted = Number(o.granted);
      return {
        id: o.id as string,
        position: o.position as number,
        targetName: o.target_name as string,
        configurationName: o.configuration_name as string,
        grantedHours: round(granted),
        plannedHours: round(planned),
        observedHours: round(observed),
        remainingHours: round(Math.max(0, granted - observed)),
      };
    });
    const sum = (k: 'grantedHours' | 'observedHours' | 'remainingHours') =>
      round(base.observations.reduce((s, o) => s + o[k], 0));
    base.totals = {
      grantedHours: sum('grantedHours'),
      observedHours: sum('observedHours'),
      remainingHours: sum('remainingHours'),
    };
    return base;
  }

  /** A new private link (any earlier one stops working); the token is shown this once only. */
  async rotateFeed(user: SessionUser): Promise<{ url: string; createdAt: string }> {
    const token = randomBytes(32).toString('base64url');
    const now = this.clock.now();
    await this.dataSource.transaction(async (m) => {
      await m.query(
        `INSERT INTO calendar_feeds (user_id, token_sha256, created_at) VALUES ($1, $2, $3)
         ON CONFLICT (user_id) DO UPDATE SET token_sha256 = $2, created_at = $3`,
        [user.id, tokenHash(token), now],
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'calendar_feed.rotated',
          subjectType: 'user',
          subjectId: user.id,
        },
        m,
      );
    });
    return {
      url: `${this.config.publicUrl}/api/calendar/${token}.ics`,
      createdAt: now.toISOString(),
    };
  }

  /** The runs of the feed's owner; an unknown token is a 404 like any missing page. */
  async feedRuns(token: string): Promise<{ runs: RunRow[]; siteZones: Map<string, string> }> {
    if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw notFound('Calendar');
    const rows: Array<{ user_id: string }> = await this.dataSource.query(
      `SELECT user_id FROM calendar_feeds WHERE token_sha256 = $1`,
      [tokenHash(token)],
    );
    if (!rows[0]) throw notFound('Calendar');
    const runs = await runsOfMember(this.dataSource, rows[0].user_id);
    const zones: Array<{ id: string; time_zone: string }> = runs.length
      ? await this.dataSource.query(
          `SELECT c.id, o.time_zone FROM calls c JOIN observatories o ON o.id = c.observatory_id
            WHERE c.id = ANY($1::uuid[])`,
          [[...new Set(runs.map((r) => r.callId))]],
        )
      : [];
    return { runs, siteZones: new Map(zones.map((z) => [z.id, z.time_zone])) };
  }
}
