import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { generatePlan, lstWindow, type PlannedRun } from '@skyhours/calc';
import type { DataSource, EntityManager } from 'typeorm';
import { capacityPerLstHour, windowShares } from '../allocation/lst-pressure.js';
import { AuditService } from '../audit/audit.service.js';
import { assertVisible, hasCallRole, isStaff } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { conflict } from '../common/errors/app-error.js';
import type { PlanSettingsDto } from './dto/plan-settings.dto.js';
import type { PlanSettings, StoredUnplaced } from './entities/plan-settings.entity.js';
import type {
  Plan,
  PlanCallSummary,
  PlanLstBin,
  PlanPeriod,
  PlanTier,
  PlanTierTotals,
} from './plan-contract.js';
import {
  grantedObservations,
  type GrantedObservation,
  isPublished,
  type PlanCall,
  requirePlanCall,
  runsOfCall,
  type RunRow,
} from './plan-data.js';
import { planPeriod } from './plan-period.js';
import { concurrentClash, pgCode } from './run-clash.js';

const TIERS: PlanTier[] = ['tier1', 'tier2', 'tier3'];
const DAY_MS = 86_400_000;
const SIDEREAL_PER_SOLAR = 1.00273790935;

/** The call's staff and its chair read the plan; nobody else learns it exists. */
export const canReadPlan = (user: SessionUser, call: Pick<PlanCall, 'code'>) =>
  isStaff(user) || hasCallRole(user, call.code, 'chair');

const DEFAULT_SETTINGS = { maintenanceStartHour: 8, maintenanceHours: 0, weatherReserve: 0.1 };

/** A run the generator keeps: locked, or already recorded (observed or lost). */
const isKept = (r: Pick<RunRow, 'locked' | 'status'>) => r.locked || r.status !== 'planned';

@Injectable()
export class PlanService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly clock: Clock,
  ) {}

  /** Published (and archived) calls with the state of their plans; chairs see their own calls. */
  async listCalls(user: SessionUser): Promise<PlanCallSummary[]> {
    const chairOf = user.emailVerified
      ? user.callRoles.filter((g) => g.role === 'chair').map((g) => g.callCode)
      : [];
    const rows: Array<Record<string, unknown>> = await this.dataSource.query(
      `SELECT c.code, c.title, c.status, c.published_at, pl.generated_at,
              (SELECT count(*) FROM runs r WHERE r.call_id = c.id)::int AS runs,
              (SELECT count(*) FROM runs r WHERE r.call_id = c.id AND r.status = 'observed')::int AS observed_runs,
              (SELECT coalesce(sum(og.hours), 0) FROM observation_grants og
                 JOIN proposal_grants pg ON pg.proposal_id = og.proposal_id
                 JOIN proposals p ON p.id = og.proposal_id
                WHERE p.call_id = c.id AND pg.tier <> 'not_allocated') AS granted_hours,
              (SELECT coalesce(sum(extract(epoch FROM r.ends_at - r.starts_at)) / 3600, 0)
                 FROM runs r WHERE r.call_id = c.id AND r.status <> 'lost') AS planned_hours
         FROM calls c LEFT JOIN plans pl ON pl.call_id = c.id
        WHERE (c.published_at IS NOT NULL OR c.status IN ('published', 'archived'))
          AND ($1 OR c.code = ANY($2))
        ORDER BY c.published_at DESC NULLS LAST, c.code`,
      [isStaff(user), chairOf],
    );
    return rows.map((r) => ({
      code: r.code as string,
      title: r.title as string,
      status: r.status as string,
      publishedAt: r.published_at ? (r.published_at as Date).toISOString() : null,
      generatedAt: r.generated_at ? (r.generated_at as Date).toISOString() : null,
      runs: r.runs as number,
      observedRuns: r.observed_runs as number,
      grantedHours: Number(r.granted_hours),
      plannedHours: Number(r.planned_hours),
    }));
  }

  async readableCall(user: SessionUser, code: string): Promise<PlanCall> {
    const call = assertVisible(
      await requirePlanCall(this.dataSource, code),
      (c) => canReadPlan(user, c),
      'Call',
    );
    return call;
  }

  async get(user: SessionUser, code: string): Promise<Plan> {
    return this.build(await this.readableCall(user, code));
  }

  async build(call: PlanCall): Promise<Plan> {
    const db = this.dataSource;
    const settings = await this.settingsOf(db.manager, call.id);
    const granted = await grantedObservations(db, call);
    const runs = await runsOfCall(db, call.id);
    const periods = this.periods(call, granted);
    const byObservation = new Map(granted.map((g) => [g.observationId, g]));
    const unplaced = (settings.unplaced ?? []).flatMap((u) => {
      const g = byObservation.get(u.observationId);
      return g
        ? [
            {
              observationId: u.observationId,
              reference: g.reference,
              targetName: g.targetName,
              tier: g.tier,
              hoursUnplaced: u.hoursUnplaced,
              reason: u.reason,
            },
          ]
        : [];
    });
    return {
      call: {
        code: call.code,
        title: call.title,
        status: call.status,
        publishedAt: call.publishedAt?.toISOString() ?? null,
      },
      site: {
        name: call.site.name,
        timeZone: call.site.timeZone,
        eastLongitudeDeg: call.site.eastLongitudeDeg,
        latitudeDeg: call.site.latitudeDeg,
      },
      settings: {
        maintenanceStartHour: settings.maintenanceStartHour,
        maintenanceHours: settings.maintenanceHours,
        weatherReserve: settings.weatherReserve,
        generatedAt: settings.generatedAt?.toISOString() ?? null,
      },
      periods,
      runs,
      unplaced,
      totals: this.totals(granted, runs),
      lstPressure: this.lstPressure(call, granted, runs, periods),
    };
  }

  async updateSettings(user: SessionUser, code: string, dto: PlanSettingsDto): Promise<Plan> {
    const call = await requirePlanCall(this.dataSource, code);
    this.assertPublished(call);
    await this.dataSource.transaction(async (m) => {
      await m.query(
        `INSERT INTO plans (call_id, maintenance_start_hour, maintenance_hours, weather_reserve, updated_at)
         VALUES ($1, $2, $3, $4, $5)
         ON CONFLICT (call_id) DO UPDATE SET maintenance_start_hour = $2, maintenance_hours = $3,
           weather_reserve = $4, updated_at = $5`,
        [
          call.id,
          dto.maintenanceStartHour,
          dto.maintenanceHours,
          dto.weatherReserve,
          this.clock.now(),
        ],
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'plan.settings_changed',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, ...dto },
        },
        m,
      );
    });
    return this.build(call);
  }

  /**
   * Replaces the call's planned, unlocked runs with the generator's: locked and recorded runs stay
   * (and count for their observations), and every other run in the database, of any call, is
   * kept free (the array observes one thing at a time).
   */
  async generate(user: SessionUser, code: string): Promise<Plan> {
    const call = await requirePlanCall(this.dataSource, code);
    this.assertPublished(call);
    const now = this.clock.now();
    try {
      await this.dataSource.transaction(async (m) => {
        await m.query(
          `INSERT INTO plans (call_id, updated_at) VALUES ($1, $2) ON CONFLICT (call_id) DO NOTHING`,
          [call.id, now],
        );
        // One generation of a call at a time: the plan row is the lock.
        const settings = await this.settingsOf(m, call.id, true);
        const granted = await grantedObservations(m, call);
        const periods = this.periods(call, granted);
        const own = await runsOfCall(m, call.id);
        const kept = own.filter(isKept);
        const replaced = own.filter((r) => !isKept(r));
        const bounds = periods.length
          ? {
              from: `${periods.map((p) => p.start).sort()[0]}T00:00:00Z`,
              to: new Date(
                Date.parse(
                  `${periods
                    .map((p) => p.end)
                    .sort()
                    .at(-1)}T00:00:00Z`,
                ) + DAY_MS,
              ).toISOString(),
            }
          : null;
        const others: Array<{ observation_id: string; starts_at: Date; ends_at: Date }> = bounds
          ? await m.query(
              `SELECT observation_id, starts_at, ends_at FROM runs
                WHERE call_id <> $1 AND tstzrange(starts_at, ends_at) && tstzrange($2, $3)`,
              [call.id, bounds.from, bounds.to],
            )
          : [];
        const busy = [
          ...kept.map((r) => ({
            observationId: r.observation.id,
            start: r.startsAt,
            end: r.endsAt,
          })),
          ...others.map((r) => ({
            observationId: r.observation_id,
            start: r.starts_at.toISOString(),
            end: r.ends_at.toISOString(),
          })),
        ];
        const covered = new Map<string, number>();
        for (const r of kept) {
          const h =
            r.status === 'observed' ? (r.hoursObtained ?? 0) : r.status === 'lost' ? 0 : r.hours;
          covered.set(r.observation.id, (covered.get(r.observation.id) ?? 0) + h);
        }
        const planned: PlannedRun[] = [];
        const unplaced: StoredUnplaced[] = [];
        for (const period of periods) {
          const result = generatePlan({
            periodStart: period.start,
            periodEnd: period.end,
            site: {
              eastLongitudeDeg: call.site.eastLongitudeDeg,
              latitudeDeg: call.site.latitudeDeg,
              timeZone: call.site.timeZone,
              elevationLimitDeg: call.site.elevationLimitDeg,
            },
            observations: granted
              .filter((g) => g.configurationId === period.configurationId)
              .map((g) => ({
                id: g.observationId,
                raDeg: g.raDeg,
                decDeg: g.decDeg,
                hours: Math.max(0, g.hours - (covered.get(g.observationId) ?? 0)),
                tier: g.tier,
                rank: g.rank,
              })),
            keptRuns: [...busy, ...planned],
            maintenanceStartHour: settings.maintenanceStartHour,
            maintenanceHours: settings.maintenanceHours,
            weatherReserve: settings.weatherReserve,
          });
          planned.push(...result.runs);
          unplaced.push(...result.unplaced);
        }
        if (replaced.length)
          await m.query(`DELETE FROM runs WHERE id = ANY($1::uuid[])`, [replaced.map((r) => r.id)]);
        if (planned.length)
          await m.query(
            `INSERT INTO runs (call_id, observation_id, starts_at, ends_at, created_at, updated_at)
             SELECT $1, o, s, e, $5, $5
               FROM unnest($2::uuid[], $3::timestamptz[], $4::timestamptz[]) AS x(o, s, e)`,
            [
              call.id,
              planned.map((r) => r.observationId),
              planned.map((r) => r.start),
              planned.map((r) => r.end),
              now,
            ],
          );
        await m.query(
          `UPDATE plans SET unplaced = $2::jsonb, generated_at = $3, generated_by = $4, updated_at = $3
            WHERE call_id = $1`,
          [call.id, JSON.stringify(unplaced), now, user.id],
        );
        await this.audit.record(
          {
            actorId: user.id,
            action: 'plan.generated',
            subjectType: 'call',
            subjectId: call.id,
            details: {
              code: call.code,
              runs: planned.length,
              kept: kept.length,
              replaced: replaced.length,
              unplaced: unplaced.length,
            },
          },
          m,
        );
      });
    } catch (error) {
      // Another writer took a slot between our read and our insert.
      if (pgCode(error) === '23P01') throw concurrentClash();
      throw error;
    }
    return this.build(call);
  }

  assertPublished(call: PlanCall): void {
    if (!isPublished(call))
      throw conflict(
        'CALL_NOT_PUBLISHED',
        `Call ${call.code} is not published yet: its grants are planned once the outcomes are out`,
      );
  }

  private async settingsOf(
    m: EntityManager,
    callId: string,
    lock = false,
  ): Promise<
    Pick<
      PlanSettings,
      'maintenanceStartHour' | 'maintenanceHours' | 'weatherReserve' | 'unplaced' | 'generatedAt'
    >
  > {
    const rows: Array<Record<string, unknown>> = await m.query(
      `SELECT maintenance_start_hour, maintenance_hours, weather_reserve, unplaced, generated_at
         FROM plans WHERE call_id = $1${lock ? ' FOR UPDATE' : ''}`,
      [callId],
    );
    const r = rows[0];
    if (!r) return { ...DEFAULT_SETTINGS, unplaced: [], generatedAt: null };
    return {
      maintenanceStartHour: r.maintenance_start_hour as number,
      maintenanceHours: r.maintenance_hours as number,
      weatherReserve: r.weather_reserve as number,
      unplaced: r.unplaced as StoredUnplaced[],
      generatedAt: (r.generated_at as Date | null) ?? null,
    };
  }

  private periods(call: PlanCall, granted: GrantedObservation[]): PlanPeriod[] {
    const seen = new Map<string, PlanPeriod>();
    for (const g of granted) {
      if (seen.has(g.configurationId)) continue;
      const period = planPeriod({ inUseFrom: g.inUseFrom, inUseTo: g.inUseTo }, call.reviewDueAt);
      if (period)
        seen.set(g.configurationId, {
          configurationId: g.configurationId,
          configurationName: g.configurationName,
          ...period,
        });
    }
    return [...seen.values()].sort((a, b) => a.start.localeCompare(b.start));
  }

  private totals(granted: GrantedObservation[], runs: RunRow[]): PlanTierTotals[] {
    const tierOf = new Map(granted.map((g) => [g.observationId, g.tier]));
    return TIERS.map((tier) => {
      const mine = runs.filter((r) => tierOf.get(r.observation.id) === tier);
      return {
        tier,
        granted: round(granted.filter((g) => g.tier === tier).reduce((s, g) => s + g.hours, 0)),
        planned: round(mine.filter((r) => r.status !== 'lost').reduce((s, r) => s + r.hours, 0)),
        observed: round(
          mine
            .filter((r) => r.status === 'observed')
            .reduce((s, r) => s + (r.hoursObtained ?? 0), 0),
        ),
      };
    });
  }

  /**
   * Per LST hour: the granted hours spread over each target's window above the limit (as the
   * chair's standing does), the hours the runs put there, and what the plan's days can hold.
   */
  private lstPressure(
    call: PlanCall,
    granted: GrantedObservation[],
    runs: RunRow[],
    periods: PlanPeriod[],
  ): PlanLstBin[] {
    const days = periods.reduce(
      (s, p) => s + (Date.parse(p.end) - Date.parse(p.start)) / DAY_MS + 1,
      0,
    );
    const bins: PlanLstBin[] = Array.from({ length: 24 }, (_, lstHour) => ({
      lstHour,
      granted: 0,
      planned: 0,
      capacity: round(capacityPerLstHour(days)),
    }));
    for (const g of granted) {
      const shares = windowShares(
        lstWindow({
          latitudeDeg: call.site.latitudeDeg,
          elevationLimitDeg: call.site.elevationLimitDeg,
          raDeg: g.raDeg,
          decDeg: g.decDeg,
        }),
      );
      shares.forEach((share, h) => (bins[h]!.granted += g.hours * share));
    }
    for (const r of runs) {
      if (r.status === 'lost') continue;
      // A solar hour of a run covers 1.0027 sidereal hours, walked from its LST at the start.
      let lst = r.lstStartHours;
      let left = r.hours * SIDEREAL_PER_SOLAR;
      while (left > 1e-9) {
        const h = Math.floor(lst) % 24;
        const step = Math.min(left, Math.floor(lst) + 1 - lst);
        bins[h]!.planned += step / SIDEREAL_PER_SOLAR;
        left -= step;
        lst = (lst + step) % 24;
      }
    }
    return bins.map((b) => ({ ...b, granted: round(b.granted), planned: round(b.planned) }));
  }
}

const round = (x: number) => Math.round(x * 1000) / 1000;
