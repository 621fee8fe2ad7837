import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { hasCallRole, isStaff } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { type CallStatus, effectiveStatus } from '../calls/call-lifecycle.js';
import { Clock } from '../common/clock.js';
import { conflict, notFound } from '../common/errors/app-error.js';
import { ProposalAccess } from '../proposals/proposal-access.service.js';
import { proposalChecks } from '../proposals/proposal-checks.js';
import { type ProposalData, totalHoursAsked } from '../proposals/proposal-data.js';
import { ProposalLoader } from '../proposals/proposal-loader.js';
import type {
  AssessmentCallResponse,
  AssessmentResponse,
  CallAssessmentsResponse,
  VerdictResponse,
} from './dto/assessment.response.js';
import type { SaveAssessmentDto } from './dto/save-assessment.dto.js';
import { TechnicalAssessment, type Verdict } from './entities/technical-assessment.entity.js';
import { beamAtArcmin, findOverlaps, type Overlap, type ProposalBeams } from './overlaps.js';

/** Proposals that get an assessment: everything submitted, whatever happened to it next. */
const ASSESSED_SQL = `p.status NOT IN ('draft', 'withdrawn')`;
const REFERENCE = /^[A-Z][A-Z0-9-]{1,15}-[0-9]{4}$/;

interface CallRow {
  id: string;
  code: string;
  title: string;
  status: CallStatus;
  time_zone: string;
  deadline_at: Date;
  published_at: Date | null;
  dish_diameter_m: number;
}

interface VerdictRow {
  proposal_id: string;
  verdict: Verdict;
  note: string;
  assessed_by: string | null;
  assessor_name: string | null;
  updated_at: Date;
}

interface ProposalRow {
  id: string;
  status: string;
  call_code: string;
  published_at: Date | null;
}

/**
 * Staff's technical assessments. Reading a call's list costs a fixed number of statements (the
 * call, its proposal ids, ProposalLoader's six, the verdicts) whatever the number of proposals.
 */
@Injectable()
export class AssessmentsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly loader: ProposalLoader,
    private readonly access: ProposalAccess,
    private readonly audit: AuditService,
    private readonly clock: Clock,
  ) {}

  /** Calls whose deadline has passed, newest deadline first, with how many are assessed. */
  async calls(): Promise<AssessmentCallResponse[]> {
    const rows = (await this.dataSource.query(
      `SELECT c.code, c.title, c.status, c.time_zone, c.deadline_at,
              count(p.id)::int AS submitted, count(a.proposal_id)::int AS assessed
         FROM calls c
         LEFT JOIN proposals p ON p.call_id = c.id AND ${ASSESSED_SQL}
         LEFT JOIN technical_assessments a ON a.proposal_id = p.id
        WHERE c.deadline_at <= $1
        GROUP BY c.id
        ORDER BY c.deadline_at DESC, c.code`,
      [this.clock.now()],
    )) as (Omit<CallRow, 'id' | 'published_at' | 'dish_diameter_m'> & {
      submitted: number;
      assessed: number;
    })[];
    const now = this.clock.now();
    return rows.map((r) => ({
      code: r.code,
      title: r.title,
      status: effectiveStatus({ status: r.status, deadlineAt: r.deadline_at }, now),
      timeZone: r.time_zone,
      deadlineAt: r.deadline_at.toISOString(),
      submitted: r.submitted,
      assessed: r.assessed,
    }));
  }

  /** Every submitted proposal of the call with its verdict, checks and overlap warnings. */
  async forCall(code: string): Promise<CallAssessmentsResponse> {
    const call = await this.findCall(code);
    if (!call) throw notFound('Call');
    const items = await this.rows(call);
    const now = this.clock.now();
    return {
      code: call.code,
      title: call.title,
      status: effectiveStatus({ status: call.status, deadlineAt: call.deadline_at }, now),
      timeZone: call.time_zone,
      deadlineAt: call.deadline_at.toISOString(),
      assessable: call.deadline_at.getTime() <= now.getTime(),
      assessed: items.filter((i) => i.assessment).length,
      items,
    };
  }

  /**
   * One proposal's assessment: staff and the call's chair always; the team once the call's
   * outcome is published (without the other proposals' overlaps or the assessor). Anyone else,
   * and the team before publishing, gets 404 as for a proposal that does not exist.
   */
  async forProposal(user: SessionUser, reference: string): Promise<AssessmentResponse> {
    const proposal = await this.findProposal(reference);
    if (!proposal || proposal.status === 'draft' || proposal.status === 'withdrawn')
      throw notFound('Proposal');
    const insider = isStaff(user) || hasCallRole(user, proposal.call_code, 'chair');
    if (!insider) {
      if (!proposal.published_at) throw notFound('Proposal');
      await this.access.membership(user, reference); // 404 for anyone not on the team
    }
    const call = await this.findCall(proposal.call_code);
    if (!call) throw notFound('Proposal');
    const row = (await this.rows(call)).find((r) => r.reference === reference.trim().toUpperCase());
    if (!row) throw notFound('Proposal');
    if (insider) return row;
    return {
      ...row,
      overlaps: [],
      assessment: row.assessment && { ...row.assessment, assessedBy: null },
    };
  }

  /** Staff write or replace the verdict, once the call's deadline has passed; audited. */
  async save(
    user: SessionUser,
    reference: string,
    dto: SaveAssessmentDto,
  ): Promise<AssessmentResponse> {
    await this.dataSource.transaction(async (manager) => {
      const proposal = await this.findProposal(reference, manager, true);
      if (!proposal || proposal.status === 'draft' || proposal.status === 'withdrawn') {
        if (proposal) throw conflict('NOT_SUBMITTED', `${reference} has not been submitted`);
        throw notFound('Proposal');
      }
      const call = await this.findCall(proposal.call_code, manager);
      if (!call) throw notFound('Proposal');
      if (call.deadline_at.getTime() > this.clock.now().getTime())
        throw conflict(
          'DEADLINE_NOT_PASSED',
          `Call ${call.code} is still taking submissions; assess its proposals after the deadline`,
        );
      const before = await manager.findOneBy(TechnicalAssessment, { proposalId: proposal.id });
      const now = this.clock.now();
      const note = (dto.note ?? '').trim();
      await manager.upsert(
        TechnicalAssessment,
        {
          proposalId: proposal.id,
          verdict: dto.verdict,
          note,
          assessedById: user.id,
          createdAt: before?.createdAt ?? now,
          updatedAt: now,
        },
        ['proposalId'],
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: before ? 'assessment.updated' : 'assessment.created',
          subjectType: 'proposal',
          subjectId: proposal.id,
          details: {
            reference: reference.trim().toUpperCase(),
            verdict: dto.verdict,
            ...(before ? { previousVerdict: before.verdict } : {}),
            noteChanged: (before?.note ?? '') !== note,
          },
        },
        manager,
      );
    });
    return this.forProposal(user, reference);
  }

  private async findCall(
    code: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<CallRow | null> {
    const rows = (await manager.query(
      `SELECT c.id, c.code, c.title, c.status, c.time_zone, c.deadline_at, c.published_at,
              o.dish_diameter_m
         FROM calls c JOIN observatories o ON o.id = c.observatory_id
        WHERE c.code = $1`,
      [code.trim().toUpperCase()],
    )) as CallRow[];
    return rows[0] ?? null;
  }

  private async findProposal(
    reference: string,
    manager: EntityManager = this.dataSource.manager,
    lock = false,
  ): Promise<ProposalRow | null> {
    const ref = reference.trim().toUpperCase();
    if (!REFERENCE.test(ref)) return null;
    const rows = (await manager.query(
      `SELECT p.id, p.status, c.code AS call_code, c.published_at
         FROM proposals p JOIN calls c ON c.id = p.call_id
        WHERE p.reference = $1 ${lock ? 'FOR UPDATE OF p' : ''}`,
      [ref],
    )) as ProposalRow[];
    return rows[0] ?? null;
  }

  private async rows(call: CallRow): Promise<AssessmentResponse[]> {
    const ids = (
      (await this.dataSource.query(
        `SELECT p.id FROM proposals p WHERE p.call_id = $1 AND ${ASSESSED_SQL} ORDER BY p.number`,
        [call.id],
      )) as { id: string }[]
    ).map((r) => r.id);
    if (ids.length === 0) return [];
    const data = await this.loader.loadMany(ids);
    const verdicts = (await this.dataSource.query(
      `SELECT a.proposal_id, a.verdict, a.note, a.assessed_by, u.name AS assessor_name, a.updated_at
         FROM technical_assessments a LEFT JOIN users u ON u.id = a.assessed_by
        WHERE a.proposal_id = ANY($1)`,
      [ids],
    )) as VerdictRow[];
    const verdictOf = new Map(verdicts.map((v) => [v.proposal_id, v]));
    const overlaps = findOverlaps(data.map((d) => beams(d, call.dish_diameter_m)));
    const now = this.clock.now();
    return data.map((d) => toResponse(d, verdictOf.get(d.proposal.id), overlaps, call, now));
  }
}

/** Each target with the widest primary beam of its observations; targets without one are left out. */
function beams(d: ProposalData, dishDiameterM: number): ProposalBeams {
  const widest = new Map<string, number>();
  for (const o of d.observations) {
    const frequencyGHz =
      o.result?.skyFrequencyGHz ??
      o.frequencyGHz ??
      (o.band ? (o.band.minGHz + o.band.maxGHz) / 2 : null);
    if (!frequencyGHz || frequencyGHz <= 0) continue;
    const beam = beamAtArcmin(frequencyGHz, dishDiameterM);
    widest.set(o.targetId, Math.max(widest.get(o.targetId) ?? 0, beam));
  }
  return {
    id: d.proposal.id,
    reference: d.proposal.reference,
    title: d.proposal.title,
    targets: d.targets.flatMap((t) => {
      const beam = widest.get(t.id);
      return beam === undefined
        ? []
        : [{ id: t.id, name: t.name, raDeg: t.raDeg, decDeg: t.decDeg, primaryBeamArcmin: beam }];
    }),
  };
}

function toResponse(
  d: ProposalData,
  v: VerdictRow | undefined,
  overlaps: Map<string, Overlap[]>,
  call: CallRow,
  now: Date,
): AssessmentResponse {
  const pi = d.members.find((m) => m.role === 'pi');
  const assessment: VerdictResponse | null = v
    ? {
        verdict: v.verdict,
        note: v.note,
        assessedBy: v.assessed_by ? { id: v.assessed_by, name: v.assessor_name ?? '' } : null,
        updatedAt: v.updated_at.toISOString(),
      }
    : null;
  return {
    reference: d.proposal.reference,
    callCode: call.code,
    title: d.proposal.title,
    category: d.proposal.scienceCategory ?? null,
    kind: d.proposal.kind,
    status: d.proposal.status,
    piName: pi?.name ?? pi?.email ?? '',
    hoursAsked: totalHoursAsked(d.observations),
    assessment,
    checks: proposalChecks(d, now),
    overlaps: overlaps.get(d.proposal.id) ?? [],
  };
}
