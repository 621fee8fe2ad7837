import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { type DataSource, type EntityManager, In } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import {
  AppError,
  type FieldIssue,
  notFound,
  validationFailed,
} from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import {
  auditChanges,
  type CallValues,
  changedFields,
  describeChanges,
  lockedFields,
  valuesOf,
} from './call-changes.js';
import {
  assertTransition,
  CALL_STATUSES,
  type CallStatus,
  effectiveStatus,
  statusLabel,
} from './call-lifecycle.js';
import { CallSubscribers } from './call-subscribers.js';
import type { CreateCallDto } from './dto/create-call.dto.js';
import type { ListCallsQuery } from './dto/list-calls.query.js';
import type { UpdateCallDto } from './dto/update-call.dto.js';
import { CallCapacity } from './entities/call-capacity.entity.js';
import { Call } from './entities/call.entity.js';

// The functions later features need (submission rules) live beside the lifecycle; they are
// exported here too so a feature only has to know the calls service.
export {
  assertOpenForSubmission,
  effectiveStatus,
  isAcceptingSubmissions,
} from './call-lifecycle.js';

const CALL_RELATIONS = { observatory: true, capacities: { configuration: true } } as const;

const canSeePlanned = (user: SessionUser | undefined) => user?.roles.includes('staff') ?? false;

/** The effective status in SQL, the same rule as effectiveStatus() (`$1` is now). */
const EFFECTIVE_STATUS_SQL = `CASE WHEN status = 'open' AND deadline_at <= $1 THEN 'closed' ELSE status END`;

@Injectable()
export class CallsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clock: Clock,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly subscribers: CallSubscribers,
  ) {}

  /**
   * One page of calls, filtered by effective status. Open calls come first, soonest deadline first;
   * then the rest along the lifecycle, latest first. Planned calls only for staff.
   */
  async list(
    user: SessionUser | undefined,
    query: ListCallsQuery,
  ): Promise<{ items: Call[]; total: number }> {
    const now = this.clock.now();
    const statuses = (query.status ?? [...CALL_STATUSES]).filter(
      (s) => s !== 'planned' || canSeePlanned(user),
    );
    const filter = `FROM (SELECT id, code, deadline_at, ${EFFECTIVE_STATUS_SQL} AS effective FROM calls) c
      WHERE c.effective = ANY($2::text[])`;
    const [{ total }] = (await this.dataSource.query(`SELECT count(*)::int AS total ${filter}`, [
      now,
      statuses,
    ])) as [{ total: number }];
    const rows = (await this.dataSource.query(
      `SELECT c.id ${filter}
        ORDER BY array_position($3::text[], c.effective),
                 CASE WHEN c.effective IN ('open', 'planned') THEN c.deadline_at END ASC,
                 c.deadline_at DESC, c.code
        LIMIT $4 OFFSET $5`,
      [now, statuses, CALL_STATUSES, query.pageSize, (query.page - 1) * query.pageSize],
    )) as { id: string }[];
    const ids = rows.map((r) => r.id);
    const calls = ids.length
      ? await this.dataSource
          .getRepository(Call)
          .find({ where: { id: In(ids) }, relations: CALL_RELATIONS })
      : [];
    const byId = new Map(calls.map((c) => [c.id, c]));
    return { items: ids.map((id) => byId.get(id) as Call), total };
  }

  /** The call as the user may see it: 404 for an unknown code, and for a planned call unless staff. */
  async getVisible(user: SessionUser | undefined, code: string): Promise<Call> {
    const call = await this.findByCode(code);
    if (effectiveStatus(call, this.clock.now()) === 'planned' && !canSeePlanned(user))
      throw notFound('Call');
    return call;
  }

  /**
   * The call with its observatory and capacities, without any rights check (for other features'
   * services, which check rights of their own). Pass `lock` inside a transaction to hold the row.
   */
  async findByCode(
    code: string,
    manager: EntityManager = this.dataSource.manager,
    lock = false,
  ): Promise<Call> {
    const normalised = code.trim().toUpperCase();
    if (lock) {
      // FOR UPDATE cannot apply to the outer-joined relations, so lock the row on its own first.
      const locked = await manager.findOne(Call, {
        where: { code: normalised },
        lock: { mode: 'pessimistic_write' },
      });
      if (!locked) throw notFound('Call');
    }
    const call = await manager.findOne(Call, {
      where: { code: normalised },
      relations: CALL_RELATIONS,
    });
    if (!call) throw notFound('Call');
    return call;
  }

  async create(dto: CreateCallDto, actor: SessionUser): Promise<Call> {
    return this.dataSource.transaction(async (manager) => {
      const now = this.clock.now();
      const observatory = await manager.findOneBy(Observatory, { id: dto.observatoryId });
      if (!observatory)
        throw validationFailed([
          { path: 'observatoryId', message: 'observatoryId names no observatory' },
        ]);
      if (await manager.existsBy(Call, { code: dto.code }))
        throw validationFailed([{ path: 'code', message: `code ${dto.code} is already used` }]);
      const values: CallValues = {
        title: dto.title,
        description: dto.description ?? '',
        timeZone: dto.timeZone,
        opensAt: new Date(dto.opensAt),
        deadlineAt: new Date(dto.deadlineAt),
        reviewDueAt: new Date(dto.reviewDueAt),
        capacity: dto.capacity,
        scienceCasePageLimit: dto.scienceCasePageLimit,
        scienceCaseMaxMb: dto.scienceCaseMaxMb,
        proposalKinds: dto.proposalKinds,
        maxHoursPerProposal: dto.maxHoursPerProposal,
        scoreMin: dto.scoreMin ?? 1,
        scoreMax: dto.scoreMax ?? 10,
        scoreHigherIsBetter: dto.scoreHigherIsBetter ?? true,
        refereesPerProposal: dto.refereesPerProposal ?? 3,
        anonymousReview: dto.anonymousReview ?? false,
      };
      await this.assertConsistent(manager, observatory.id, values, { deadlineMustBeFuture: now });
      const { capacity, ...columns } = values;
      const saved = await manager.save(
        Call,
        manager.create(Call, {
          ...columns,
          proposalKinds: columns.proposalKinds as Call['proposalKinds'],
          code: dto.code,
          observatoryId: observatory.id,
          status: 'planned',
          statusChangedAt: now,
        }),
      );
      await this.saveCapacity(manager, saved.id, capacity);
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'call.created',
          subjectType: 'call',
          subjectId: saved.id,
          details: { code: saved.code },
        },
        manager,
      );
      return this.findByCode(saved.code, manager);
    });
  }

  /**
   * Changes a call. Fields freeze along the lifecycle (see call-changes.ts); only fields whose value
   * really changes count, so a form may send everything back. A change while the call is open is
   * audited and e-mailed to the PIs with a draft in it.
   */
  async update(code: string, dto: UpdateCallDto, actor: SessionUser): Promise<Call> {
    return this.dataSource.transaction(async (manager) => {
      const now = this.clock.now();
      const call = await this.findByCode(code, manager, true);
      const status = effectiveStatus(call, now);
      if (status === 'archived')
        throw new AppError(
          HttpStatus.CONFLICT,
          'CALL_ARCHIVED',
          `Call ${call.code} is archived and can no longer change`,
        );
      const before = valuesOf(call);
      const after: CallValues = {
        ...before,
        ...stripUndefined({
          title: dto.title,
          description: dto.description,
          timeZone: dto.timeZone,
          opensAt: dto.opensAt === undefined ? undefined : new Date(dto.opensAt),
          deadlineAt: dto.deadlineAt === undefined ? undefined : new Date(dto.deadlineAt),
          reviewDueAt: dto.reviewDueAt === undefined ? undefined : new Date(dto.reviewDueAt),
          capacity: dto.capacity?.map((c) => ({
            configurationId: c.configurationId,
            hours: c.hours,
          })),
          scienceCasePageLimit: dto.scienceCasePageLimit,
          scienceCaseMaxMb: dto.scienceCaseMaxMb,
          proposalKinds: dto.proposalKinds,
          maxHoursPerProposal: dto.maxHoursPerProposal,
          scoreMin: dto.scoreMin,
          scoreMax: dto.scoreMax,
          scoreHigherIsBetter: dto.scoreHigherIsBetter,
          refereesPerProposal: dto.refereesPerProposal,
          anonymousReview: dto.anonymousReview,
        }),
      };
      const fields = changedFields(before, after);
      if (fields.length === 0) return call;

      const locked = lockedFields(fields, status);
      // Once submissions have started, the opening is history.
      if (
        status === 'open' &&
        fields.includes('opensAt') &&
        call.opensAt <= now &&
        !locked.includes('opensAt')
      )
        locked.push('opensAt');
      if (locked.length)
        throw new AppError(
          HttpStatus.CONFLICT,
          'CALL_FIELD_LOCKED',
          `Call ${call.code} is ${statusLabel(status)}; these can no longer change: ${locked.join(', ')}`,
          locked.map((path) => ({
            path,
            message: `${path} can no longer change in a call that is ${statusLabel(status)}`,
          })),
        );
      await this.assertConsistent(manager, call.observatoryId, after, {
        deadlineMustBeFuture: fields.includes('deadlineAt') ? now : undefined,
        needsCapacity: status !== 'planned',
      });

      const { capacity, ...columns } = after;
      await manager.update(
        Call,
        { id: call.id },
        { ...columns, proposalKinds: columns.proposalKinds as Call['proposalKinds'] },
      );
      if (fields.includes('capacity')) {
        await manager.delete(CallCapacity, { callId: call.id });
        await this.saveCapacity(manager, call.id, capacity);
      }
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'call.updated',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, status, changes: auditChanges(fields, before, after) },
        },
        manager,
      );
      if (status === 'open') await this.notifySubscribers(manager, call, fields, before, after);
      return this.findByCode(call.code, manager);
    });
  }

  /** Moves the call one step along its lifecycle; a refused move is a 409 with the reason. */
  async transition(code: string, to: CallStatus, actor: SessionUser): Promise<Call> {
    return this.dataSource.transaction(async (manager) => {
      const now = this.clock.now();
      const call = await this.findByCode(code, manager, true);
      const from = effectiveStatus(call, now);
      assertTransition(call, to, { configurationsOnOffer: call.capacities?.length ?? 0 }, now);
      await manager.update(Call, { id: call.id }, { status: to, statusChangedAt: now });
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'call.status_changed',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, from, to },
        },
        manager,
      );
      return this.findByCode(call.code, manager);
    });
  }

  /**
   * Stores `closed` on every open call whose deadline has passed by the server's clock; the
   * deadline job calls this. Requests never wait for it: they read the effective status.
   * Returns the codes it closed.
   */
  async closeDueCalls(): Promise<string[]> {
    const now = this.clock.now();
    return this.dataSource.transaction(async (manager) => {
      const closed = (await manager.query(
        `WITH due AS (
           UPDATE calls SET status = 'closed', status_changed_at = deadline_at, updated_at = now()
            WHERE status = 'open' AND deadline_at <= $1
           RETURNING id, code, deadline_at
         ) SELECT id, code, deadline_at FROM due ORDER BY code`,
        [now],
      )) as { id: string; code: string; deadline_at: Date }[];
      for (const row of closed)
        await this.audit.record(
          {
            actorId: null,
            action: 'call.status_changed',
            subjectType: 'call',
            subjectId: row.id,
            details: {
              code: row.code,
              from: 'open',
              to: 'closed',
              reason: 'deadline passed',
              deadlineAt: row.deadline_at.toISOString(),
            },
          },
          manager,
        );
      return closed.map((r) => r.code);
    });
  }

  /** Rules across fields: dates in order, a future deadline, capacity in this observatory. */
  private async assertConsistent(
    manager: EntityManager,
    observatoryId: string,
    v: CallValues,
    rules: { deadlineMustBeFuture?: Date; needsCapacity?: boolean },
  ): Promise<void> {
    const issues: FieldIssue[] = [];
    if (rules.deadlineMustBeFuture && v.deadlineAt <= rules.deadlineMustBeFuture)
      issues.push({ path: 'deadlineAt', message: 'deadlineAt must be in the future' });
    if (v.deadlineAt <= v.opensAt)
      issues.push({ path: 'deadlineAt', message: 'deadlineAt must be after opensAt' });
    if (v.reviewDueAt <= v.deadlineAt)
      issues.push({ path: 'reviewDueAt', message: 'reviewDueAt must be after deadlineAt' });
    if (v.scoreMax <= v.scoreMin)
      issues.push({ path: 'scoreMax', message: `scoreMax must be above scoreMin (${v.scoreMin})` });
    if (rules.needsCapacity && v.capacity.length === 0)
      issues.push({
        path: 'capacity',
        message: 'an open call needs at least one configuration on offer',
      });
    const ids = v.capacity.map((c) => c.configurationId);
    const known = ids.length
      ? new Set(
          (await manager.findBy(Configuration, { id: In(ids), observatoryId })).map((c) => c.id),
        )
      : new Set<string>();
    v.capacity.forEach((c, i) => {
      if (!known.has(c.configurationId))
        issues.push({
          path: `capacity.${i}.configurationId`,
          message: 'configurationId is not a configuration of this observatory',
        });
      else if (ids.indexOf(c.configurationId) !== i)
        issues.push({
          path: `capacity.${i}.configurationId`,
          message: 'configurationId appears twice',
        });
    });
    if (issues.length) throw validationFailed(issues);
  }

  private async saveCapacity(
    manager: EntityManager,
    callId: string,
    capacity: CallValues['capacity'],
  ): Promise<void> {
    if (capacity.length === 0) return;
    await manager.insert(
      CallCapacity,
      capacity.map((c) => ({ callId, configurationId: c.configurationId, hoursOffered: c.hours })),
    );
  }

  private async notifySubscribers(
    manager: EntityManager,
    call: Call,
    fields: ReturnType<typeof changedFields>,
    before: CallValues,
    after: CallValues,
  ): Promise<void> {
    const addresses = [...new Set(await this.subscribers.addressesFor(call, manager))];
    if (addresses.length === 0) return;
    const names = new Map(
      (await manager.findBy(Configuration, { observatoryId: call.observatoryId })).map((c) => [
        c.id,
        c.name,
      ]),
    );
    const lines = describeChanges(fields, before, after, names);
    await this.mail.enqueue(
      addresses.map((to) => ({
        to,
        kind: 'call-changed',
        subject: `Call ${call.code} has changed`,
        content: {
          greeting: 'Hello,',
          paragraphs: [
            `The observatory changed call ${call.code} (${after.title}), in which you have a draft proposal:`,
            ...lines,
          ],
          action: { label: 'Read the call', url: `${this.config.publicUrl}/calls/${call.code}` },
        },
      })),
      manager,
    );
  }
}

function stripUndefined<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
