import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { conflict, notFound, validationFailed } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import type { SplitRunDto, UpdateRunDto } from './dto/update-run.dto.js';
import type { PlanRun } from './plan-contract.js';
import { runById, type RunRow } from './plan-data.js';
import { completedEmail } from './plan-emails.js';
import { concurrentClash, findClash, pgCode } from './run-clash.js';

const HOUR_MS = 3_600_000;
/** The longest run a move may make: a target is above any limit at most a day (never-setting). */
const MAX_RUN_HOURS = 24;
const strip = ({ callId: _c, proposalId: _p, ...run }: RunRow): PlanRun => run;

/** Staff's changes to single runs: move, lock, record, split, delete; and what a record completes. */
@Injectable()
export class RunsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly clock: Clock,
    private readonly config: AppConfig,
  ) {}

  async update(user: SessionUser, id: string, dto: UpdateRunDto): Promise<PlanRun> {
    const moving = dto.startsAt !== undefined && dto.endsAt !== undefined;
    if (moving) {
      const start = Date.parse(dto.startsAt!);
      const end = Date.parse(dto.endsAt!);
      if (end <= start)
        throw validationFailed([{ path: 'endsAt', message: 'endsAt must be after startsAt' }]);
      if (end - start > MAX_RUN_HOURS * HOUR_MS)
        throw validationFailed([
          { path: 'endsAt', message: `A run lasts at most ${MAX_RUN_HOURS} hours` },
        ]);
    }
    try {
      return await this.dataSource.transaction(async (m) => {
        const run = await this.lockedRun(m, id, dto.version);
        const now = this.clock.now();
        const sets: string[] = [];
        const params: unknown[] = [];
        const set = (column: string, value: unknown) => {
          params.push(value);
          sets.push(`${column} = $${params.length}`);
        };
        const changes: Record<string, unknown> = {};
        if (moving) {
          if (run.status !== 'planned')
            throw conflict('RUN_RECORDED', 'A recorded run keeps its times; undo the record first');
          const startsAt = new Date(dto.startsAt!).toISOString();
          const endsAt = new Date(dto.endsAt!).toISOString();
          const clash = await findClash(m, startsAt, endsAt, run.id);
          if (clash) throw clash;
          set('starts_at', startsAt);
          set('ends_at', endsAt);
          changes.moved = { from: [run.startsAt, run.endsAt], to: [startsAt, endsAt] };
        }
        if (dto.locked !== undefined && dto.locked !== run.locked) {
          set('locked', dto.locked);
          changes.locked = dto.locked;
        }
        if (dto.status !== undefined) {
          const hours = moving
            ? (Date.parse(dto.endsAt!) - Date.parse(dto.startsAt!)) / HOUR_MS
            : run.hours;
          if (dto.status === 'observed' && dto.hoursObtained! > hours + 1e-9)
            throw validationFailed([
              {
                path: 'hoursObtained',
                message: `At most the run's length, ${Math.round(hours * 100) / 100} h`,
              },
            ]);
          set('status', dto.status);
          set('hours_obtained', dto.status === 'observed' ? dto.hoursObtained : null);
          set('quality_note', dto.status === 'observed' ? (dto.qualityNote ?? '') : '');
          set('lost_reason', dto.status === 'lost' ? dto.lostReason : null);
          set('recorded_by', dto.status === 'planned' ? null : user.id);
          set('recorded_at', dto.status === 'planned' ? null : now);
          changes.status = dto.status;
          if (dto.status === 'observed') changes.hoursObtained = dto.hoursObtained;
          if (dto.status === 'lost') changes.lostReason = dto.lostReason;
        }
        if (sets.length === 0) return strip(run);
        set('updated_at', now);
        params.push(run.id);
        await m.query(
          `UPDATE runs SET ${sets.join(', ')}, version = version + 1 WHERE id = $${params.length}`,
          params,
        );
        await this.audit.record(
          {
            actorId: user.id,
            action:
              dto.status !== undefined ? 'run.recorded' : moving ? 'run.moved' : 'run.updated',
            subjectType: 'run',
            subjectId: run.id,
            details: { reference: run.proposal.reference, ...changes },
          },
          m,
        );
        if (dto.status !== undefined) await this.progressProposal(m, run.proposalId, now);
        return strip((await runById(m, run.id))!);
      });
    } catch (error) {
      if (pgCode(error) === '23P01') throw concurrentClash();
      throw error;
    }
  }

  /** Two runs from one, cut at `at` (strictly inside; both keep the lock and stay planned). */
  async split(user: SessionUser, id: string, dto: SplitRunDto): Promise<PlanRun[]> {
    return this.dataSource.transaction(async (m) => {
      const run = await this.lockedRun(m, id, dto.version);
      if (run.status !== 'planned')
        throw conflict('RUN_RECORDED', 'A recorded run cannot be split; undo the record first');
      const at = Date.parse(dto.at);
      if (at <= Date.parse(run.startsAt) || at >= Date.parse(run.endsAt))
        throw validationFailed([
          { path: 'at', message: `Must lie strictly between ${run.startsAt} and ${run.endsAt}` },
        ]);
      const now = this.clock.now();
      const atIso = new Date(at).toISOString();
      await m.query(
        `UPDATE runs SET ends_at = $2, version = version + 1, updated_at = $3 WHERE id = $1`,
        [run.id, atIso, now],
      );
      const inserted: Array<{ id: string }> = await m.query(
        `INSERT INTO runs (call_id, observation_id, starts_at, ends_at, locked, created_at, updated_at)
         VALUES ($1, $2, $3, $4, $5, $6, $6) RETURNING id`,
        [run.callId, run.observation.id, atIso, run.endsAt, run.locked, now],
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'run.split',
          subjectType: 'run',
          subjectId: run.id,
          details: { reference: run.proposal.reference, at: atIso, newRunId: inserted[0]!.id },
        },
        m,
      );
      return [strip((await runById(m, run.id))!), strip((await runById(m, inserted[0]!.id))!)];
    });
  }

  /** Deletes a planned run; a recorded one is history and stays. */
  async remove(user: SessionUser, id: string): Promise<void> {
    await this.dataSource.transaction(async (m) => {
      const run = await runById(m, id, true);
      if (!run) throw notFound('Run');
      if (run.status !== 'planned')
        throw conflict('RUN_RECORDED', 'A recorded run cannot be deleted; undo the record first');
      await m.query(`DELETE FROM runs WHERE id = $1`, [run.id]);
      await this.audit.record(
        {
          actorId: user.id,
          action: 'run.deleted',
          subjectType: 'run',
          subjectId: run.id,
          details: {
            reference: run.proposal.reference,
            startsAt: run.startsAt,
            endsAt: run.endsAt,
          },
        },
        m,
      );
    });
  }

  private async lockedRun(m: EntityManager, id: string, version: number): Promise<RunRow> {
    const run = await runById(m, id, true);
    if (!run) throw notFound('Run');
    if (run.version !== version)
      throw conflict(
        'STALE_VERSION',
        `The run has changed since you loaded it (you had version ${version}, it is now at version ${run.version}); reload it and make your change again`,
      );
    return run;
  }

  /**
   * After a record: the proposal is in progress once something is observed, and completed (with
   * one e-mail to its team) once every granted observation has its hours observed. The UPDATE's
   * `completed_at IS NULL` makes the completion, and so the e-mail, happen once.
   */
  private async progressProposal(m: EntityManager, proposalId: string, now: Date): Promise<void> {
    const rows: Array<{ granted: number; observed: number; any_observed: boolean; short: number }> =
      await m.query(
        `SELECT coalesce(sum(og.hours), 0) AS granted, coalesce(sum(obs.h), 0) AS observed,
                bool_or(obs.h > 0) AS any_observed,
                count(*) FILTER (WHERE coalesce(obs.h, 0) < og.hours - 1e-6)::int AS short
           FROM observation_grants og
           JOIN proposal_grants pg ON pg.proposal_id = og.proposal_id
           LEFT JOIN LATERAL (SELECT sum(r.hours_obtained) AS h FROM runs r
                               WHERE r.observation_id = og.observation_id AND r.status = 'observed') obs ON true
          WHERE og.proposal_id = $1 AND og.hours > 0 AND pg.tier <> 'not_allocated'`,
        [proposalId],
      );
    const r = rows[0];
    if (!r || Number(r.granted) <= 0) return;
    if (r.short === 0) {
      // An UPDATE through TypeORM's postgres driver answers [rows, affected].
      const [done]: [Array<{ reference: string; title: string }>, number] = await m.query(
        `UPDATE proposals SET status = 'completed', completed_at = $2, version = version + 1, updated_at = $2
          WHERE id = $1 AND completed_at IS NULL RETURNING reference, title`,
        [proposalId, now],
      );
      const p = done[0];
      if (!p) return;
      const team: Array<{ email: string; name: string | null }> = await m.query(
        `SELECT m.email, u.name FROM proposal_members m JOIN users u ON u.id = m.user_id
          WHERE m.proposal_id = $1 ORDER BY m.role DESC, m.email`,
        [proposalId],
      );
      await this.mail.enqueue(
        team.map((to) =>
          completedEmail({
            base: this.config.publicUrl,
            to,
            reference: p.reference,
            title: p.title,
            observedHours: Number(r.observed),
            grantedHours: Number(r.granted),
          }),
        ),
        m,
      );
      await this.audit.record(
        {
          actorId: null,
          action: 'proposal.completed',
          subjectType: 'proposal',
          subjectId: proposalId,
          details: { reference: p.reference, recipients: team.length },
        },
        m,
      );
    } else if (r.any_observed) {
      await m.query(
        `UPDATE proposals SET status = 'in_progress', version = version + 1, updated_at = $2
          WHERE id = $1 AND status = 'allocated'`,
        [proposalId, now],
      );
    }
  }
}
