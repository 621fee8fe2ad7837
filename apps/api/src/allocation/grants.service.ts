import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { type FieldIssue, notFound, validationFailed } from '../common/errors/app-error.js';
import { assertChairOf, assertInDeliberation } from './allocation-access.js';
import type { GrantDto } from './dto/grant.dto.js';
import type { GrantResponse, Standing } from './standing-contract.js';
import {
  type AllocationCall,
  canSeeStanding,
  IN_STANDING_SQL,
  StandingService,
} from './standing.service.js';

const REFERENCE = /^[A-Z][A-Z0-9-]{1,15}-[0-9]{4}$/;
/** Hours are compared to a thousandth of a second: 4 h asked may be granted as 4.0000001. */
const EPSILON = 1e-6;

interface Target {
  call: AllocationCall;
  proposalId: string;
  reference: string;
}

interface Decision {
  tier: string;
  hours: Record<string, number>;
}

/**
 * The chair's decision on one proposal: a tier and hours per observation (none granted: no row,
 * the proposal is undecided). Every change is audited with what it replaced.
 */
@Injectable()
export class GrantsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly standing: StandingService,
    private readonly audit: AuditService,
    private readonly clock: Clock,
  ) {}

  async set(user: SessionUser, reference: string, dto: GrantDto): Promise<GrantResponse> {
    return this.dataSource.transaction(async (manager) => {
      const target = await this.target(user, reference, manager);
      const asked = (await manager.query(
        `SELECT id, hours_asked FROM proposal_observations WHERE proposal_id = $1 ORDER BY position`,
        [target.proposalId],
      )) as { id: string; hours_asked: number }[];
      const hours = resolveHours(dto, asked);
      const before = await this.decision(target.proposalId, manager);
      await manager.query(
        `INSERT INTO proposal_grants (proposal_id, tier, note, decided_by, updated_at)
              VALUES ($1, $2, $3, $4, $5)
         ON CONFLICT (proposal_id) DO UPDATE
                 SET tier = EXCLUDED.tier, note = EXCLUDED.note,
                     decided_by = EXCLUDED.decided_by, updated_at = EXCLUDED.updated_at`,
        [target.proposalId, dto.tier, dto.note ?? '', user.id, this.clock.now()],
      );
      await manager.query(`DELETE FROM observation_grants WHERE proposal_id = $1`, [
        target.proposalId,
      ]);
      const ids = Object.keys(hours);
      if (ids.length)
        await manager.query(
          `INSERT INTO observation_grants (observation_id, proposal_id, hours)
           SELECT o, $1, h FROM unnest($2::uuid[], $3::float8[]) AS x(o, h)`,
          [target.proposalId, ids, ids.map((id) => hours[id])],
        );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'allocation.grant_set',
          subjectType: 'proposal',
          subjectId: target.proposalId,
          details: {
            reference: target.reference,
            callCode: target.call.code,
            before,
            after: { tier: dto.tier, hours },
            ...(dto.note ? { note: dto.note } : {}),
          },
        },
        manager,
      );
      return this.answer(target, manager);
    });
  }

  /** Back to undecided: the cheap undo of a grant. */
  async clear(user: SessionUser, reference: string): Promise<GrantResponse> {
    return this.dataSource.transaction(async (manager) => {
      const target = await this.target(user, reference, manager);
      const before = await this.decision(target.proposalId, manager);
      if (before) {
        // observation_grants go with it (ON DELETE CASCADE).
        await manager.query(`DELETE FROM proposal_grants WHERE proposal_id = $1`, [
          target.proposalId,
        ]);
        await this.audit.record(
          {
            actorId: user.id,
            action: 'allocation.grant_cleared',
            subjectType: 'proposal',
            subjectId: target.proposalId,
            details: { reference: target.reference, callCode: target.call.code, before },
          },
          manager,
        );
      }
      return this.answer(target, manager);
    });
  }

  /**
   * The proposal and its call, the call's row locked (a publish waits for the grant, and the
   * other way round): 404 for a proposal not in a standing the user may see, 403 for staff who
   * are not its chair, 409 outside deliberation.
   */
  private async target(
    user: SessionUser,
    reference: string,
    manager: EntityManager,
  ): Promise<Target> {
    const ref = reference.trim().toUpperCase();
    if (!REFERENCE.test(ref)) throw notFound('Proposal');
    const rows = (await manager.query(
      `SELECT p.id, p.reference, c.code FROM proposals p JOIN calls c ON c.id = p.call_id
        WHERE p.reference = $1 AND ${IN_STANDING_SQL}`,
      [ref],
    )) as { id: string; reference: string; code: string }[];
    const row = rows[0];
    if (!row) throw notFound('Proposal');
    const call = await this.standing.findCall(row.code, manager, true);
    if (!call || !canSeeStanding(user, call.code)) throw notFound('Proposal');
    assertChairOf(user, call);
    assertInDeliberation(call, 'the grants');
    return { call, proposalId: row.id, reference: row.reference };
  }

  private async decision(proposalId: string, manager: EntityManager): Promise<Decision | null> {
    const rows = (await manager.query(
      `SELECT g.tier, og.observation_id, og.hours
         FROM proposal_grants g LEFT JOIN observation_grants og ON og.proposal_id = g.proposal_id
        WHERE g.proposal_id = $1`,
      [proposalId],
    )) as { tier: string; observation_id: string | null; hours: number | null }[];
    if (rows.length === 0) return null;
    const hours: Record<string, number> = {};
    for (const r of rows) if (r.observation_id !== null) hours[r.observation_id] = r.hours ?? 0;
    return { tier: rows[0]!.tier, hours };
  }

  private async answer(target: Target, manager: EntityManager): Promise<GrantResponse> {
    const standing: Standing = await this.standing.build(target.call, manager);
    const row = standing.rows.find((r) => r.reference === target.reference);
    if (!row) throw notFound('Proposal');
    return {
      row,
      totals: standing.totals,
      pressure: standing.pressure,
      undecided: standing.undecided,
    };
  }
}

/**
 * The hours per observation a grant stores, or a 400 naming each bad field: every id one of the
 * proposal's observations and given once; hours from 0 up to what was asked (the committee may
 * cut a request, never grow it: the science case and the technical check were for the hours
 * asked); none for a proposal not allocated; some for one in a tier. An observation left out gets
 * the hours it asked (none when not allocated).
 */
export function resolveHours(
  dto: Pick<GrantDto, 'tier' | 'observations'>,
  asked: readonly { id: string; hours_asked: number }[],
): Record<string, number> {
  const askedOf = new Map(asked.map((o) => [o.id, o.hours_asked]));
  const allocated = dto.tier !== 'not_allocated';
  const hours: Record<string, number> = {};
  if (allocated) for (const o of asked) hours[o.id] = o.hours_asked;
  const issues: FieldIssue[] = [];
  const seen = new Set<string>();
  (dto.observations ?? []).forEach((o, i) => {
    const max = askedOf.get(o.id);
    if (max === undefined) {
      issues.push({
        path: `observations.${i}.id`,
        message: `${o.id} is not an observation of this proposal`,
      });
      return;
    }
    if (seen.has(o.id)) {
      issues.push({ path: `observations.${i}.id`, message: `${o.id} is given twice` });
      return;
    }
    seen.add(o.id);
    if (!allocated && o.hours > 0)
      issues.push({
        path: `observations.${i}.hours`,
        message: 'A proposal that is not allocated gets 0 hours',
      });
    else if (o.hours > max + EPSILON)
      issues.push({
        path: `observations.${i}.hours`,
        message: `hours must be at most the ${max} h asked`,
      });
    else if (allocated) hours[o.id] = Math.min(o.hours, max);
  });
  if (issues.length === 0 && allocated && !Object.values(hours).some((h) => h > 0))
    issues.push({
      path: 'observations',
      message: `A proposal in ${dto.tier.replace('tier', 'Tier ')} needs hours for at least one observation`,
    });
  if (issues.length) throw validationFailed(issues);
  // Observations with 0 h granted need no row: the standing reads a missing row as 0.
  for (const id of Object.keys(hours)) if (hours[id] === 0) delete hours[id];
  return hours;
}
