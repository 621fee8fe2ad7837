import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { assignReferees, type AssignPair } from '@skyhours/calc';
import { isUUID } from 'class-validator';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { assertAllowed, hasCallRole, isStaff } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { CallsService, effectiveStatus } from '../calls/calls.service.js';
import type { Call } from '../calls/entities/call.entity.js';
import { Clock } from '../common/clock.js';
import { AppError, conflict, notFound, validationFailed } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import type { CreateAssignmentDto } from './dto/create-assignment.dto.js';
import type {
  AssignmentItem,
  AutoAssignResponse,
  CallRefereesResponse,
  ConflictKind,
  ProposalAssignments,
  ReviewStatus,
} from './review-contract.js';
import { assignmentEmail } from './review-emails.js';
import { POOL_CONFLICTS_SQL } from './review-queries.js';
import { COUNTING_STATUSES, isAssigning } from './review-rules.js';

interface PoolRow {
  id: string;
  name: string;
  email: string;
  affiliation: string;
  science_categories: string[];
}
interface ProposalRow {
  id: string;
  reference: string;
  title: string;
  science_category: string;
  pi_name: string | null;
}
interface AssignmentRow {
  id: string;
  proposal_id: string;
  referee_id: string;
  referee_name: string;
  status: ReviewStatus;
  assigned_by: string | null;
  assigned_at: Date;
  decline_reason: string | null;
}
interface ConflictRow {
  referee_id: string;
  proposal_id: string;
  reference: string;
  kind: ConflictKind;
  reason: string;
}

interface PoolState {
  call: Call;
  referees: PoolRow[];
  proposals: ProposalRow[];
  assignments: AssignmentRow[];
  conflicts: ConflictRow[];
}

/**
 * The chair's side of reviewing: a call's referee pool with loads and conflicts, the automatic
 * pass and the hand edits. The chair of the call manages it; staff may look. Every read is a
 * fixed number of statements whatever the call's size.
 */
@Injectable()
export class RefereePoolService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly calls: CallsService,
    private readonly clock: Clock,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
  ) {}

  async view(user: SessionUser, code: string): Promise<CallRefereesResponse> {
    const call = await this.visibleCall(user, code);
    return this.answer(user, await this.state(call, this.dataSource.manager));
  }

  /** Fills every proposal up to refereesPerProposal; keeps what exists. */
  async autoAssign(user: SessionUser, code: string): Promise<AutoAssignResponse> {
    return this.dataSource.transaction(async (manager) => {
      const call = await this.editableCall(user, code, manager);
      const s = await this.state(call, manager);
      const byRef = new Map(s.proposals.map((p) => [p.reference, p]));
      const refOf = new Map(s.proposals.map((p) => [p.id, p.reference]));
      const pair = (proposalId: string, refereeId: string): AssignPair => ({
        proposalId: refOf.get(proposalId) ?? proposalId,
        refereeId,
      });
      const result = assignReferees({
        // The calculator names proposals by what it is given: references read well in messages.
        proposals: s.proposals.map((p) => ({
          id: p.reference,
          scienceCategory: p.science_category,
        })),
        referees: s.referees.map((r) => ({ id: r.id, scienceCategories: r.science_categories })),
        refereesPerProposal: call.refereesPerProposal,
        excluded: [
          ...s.conflicts.map((c) => pair(c.proposal_id, c.referee_id)),
          ...s.assignments
            .filter((a) => !COUNTING_STATUSES.includes(a.status))
            .map((a) => pair(a.proposal_id, a.referee_id)),
        ],
        existing: s.assignments
          .filter((a) => COUNTING_STATUSES.includes(a.status))
          .map((a) => pair(a.proposal_id, a.referee_id)),
      });
      if (!result.ok)
        throw new AppError(
          HttpStatus.CONFLICT,
          'REFEREE_POOL_TOO_SMALL',
          `The referee pool of call ${call.code} cannot give every proposal ${call.refereesPerProposal} referees: ${result.shortfalls.map((f) => f.message).join('; ')}. Add referees to the call, or assign by hand.`,
          result.shortfalls.map((f) => ({ path: `proposals.${f.proposalId}`, message: f.message })),
        );
      const made = result.assignments.map((a) => ({
        proposalId: byRef.get(a.proposalId)!.id,
        refereeId: a.refereeId,
      }));
      await this.insert(manager, call, user, made, s);
      await this.audit.record(
        {
          actorId: user.id,
          action: 'review.auto_assigned',
          subjectType: 'call',
          subjectId: call.id,
          details: {
            code: call.code,
            created: made.length,
            assignments: result.assignments,
          },
        },
        manager,
      );
      return {
        created: made.length,
        referees: this.answer(user, await this.state(call, manager)),
      };
    });
  }

  async add(
    user: SessionUser,
    code: string,
    dto: CreateAssignmentDto,
  ): Promise<CallRefereesResponse> {
    return this.dataSource.transaction(async (manager) => {
      const call = await this.editableCall(user, code, manager);
      const s = await this.state(call, manager);
      const proposal = s.proposals.find((p) => p.id === dto.proposalId);
      const referee = s.referees.find((r) => r.id === dto.refereeId);
      const issues = [
        ...(proposal
          ? []
          : [{ path: 'proposalId', message: `Not a submitted proposal of call ${call.code}` }]),
        ...(referee ? [] : [{ path: 'refereeId', message: `Not a referee of call ${call.code}` }]),
      ];
      if (!proposal || !referee) throw validationFailed(issues);
      const there = s.assignments.find(
        (a) => a.proposal_id === proposal.id && a.referee_id === referee.id,
      );
      if (there)
        throw conflict(
          'ALREADY_ASSIGNED',
          there.status === 'declined'
            ? `${referee.name} declined ${proposal.reference}${there.decline_reason ? ` (“${there.decline_reason}”)` : ''}; they cannot be put on it again`
            : `${referee.name} is already on ${proposal.reference} (${there.status})`,
        );
      const inConflict = s.conflicts.find(
        (c) => c.proposal_id === proposal.id && c.referee_id === referee.id,
      );
      if (inConflict)
        throw conflict(
          'REFEREE_CONFLICTED',
          `${referee.name} is in conflict with ${proposal.reference}: ${inConflict.reason}`,
        );
      await this.insert(
        manager,
        call,
        user,
        [{ proposalId: proposal.id, refereeId: referee.id }],
        s,
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'review.assigned',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, reference: proposal.reference, refereeId: referee.id },
        },
        manager,
      );
      return this.answer(user, await this.state(call, manager));
    });
  }

  async remove(user: SessionUser, code: string, id: string): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const call = await this.editableCall(user, code, manager);
      if (!isUUID(id)) throw notFound('Assignment');
      const [row] = (await manager.query(
        `SELECT a.id, a.status, a.referee_id, p.reference FROM review_assignments a
           JOIN proposals p ON p.id = a.proposal_id
          WHERE a.id = $1 AND p.call_id = $2 FOR UPDATE OF a`,
        [id, call.id],
      )) as { id: string; status: ReviewStatus; referee_id: string; reference: string }[];
      if (!row) throw notFound('Assignment');
      if (row.status === 'submitted')
        throw conflict(
          'REVIEW_SUBMITTED',
          `The review of ${row.reference} is submitted; a submitted review is not removed`,
        );
      await manager.query(`DELETE FROM review_assignments WHERE id = $1`, [id]);
      await this.audit.record(
        {
          actorId: user.id,
          action: 'review.unassigned',
          subjectType: 'call',
          subjectId: call.id,
          details: {
            code: call.code,
            reference: row.reference,
            refereeId: row.referee_id,
            status: row.status,
          },
        },
        manager,
      );
    });
  }

  /** Writes the assignments and e-mails each referee once with all of theirs. */
  private async insert(
    manager: EntityManager,
    call: Call,
    user: SessionUser,
    made: { proposalId: string; refereeId: string }[],
    s: PoolState,
  ): Promise<void> {
    if (made.length === 0) return;
    const now = this.clock.now();
    await manager.query(
      `INSERT INTO review_assignments (proposal_id, referee_id, status, assigned_by, assigned_at,
                                       notified_at, updated_at)
       SELECT x.proposal_id, x.referee_id, 'invited', $3, $4, $4, $4
         FROM unnest($1::uuid[], $2::uuid[]) AS x(proposal_id, referee_id)`,
      [made.map((m) => m.proposalId), made.map((m) => m.refereeId), user.id, now],
    );
    const proposals = new Map(s.proposals.map((p) => [p.id, p]));
    const emails = s.referees.flatMap((r) => {
      const theirs = made
        .filter((m) => m.refereeId === r.id)
        .map((m) => proposals.get(m.proposalId)!);
      return theirs.length
        ? [
            assignmentEmail({
              base: this.config.publicUrl,
              to: { email: r.email, name: r.name },
              call,
              proposals: theirs.map((p) => ({ reference: p.reference, title: p.title })),
            }),
          ]
        : [];
    });
    await this.mail.enqueue(emails, manager);
  }

  private async visibleCall(user: SessionUser, code: string): Promise<Call> {
    const call = await this.calls.findByCode(code);
    if (!isStaff(user) && !hasCallRole(user, call.code, 'chair')) throw notFound('Call');
    return call;
  }

  /** The chair of this call, while referees may be placed; the row locked for the change. */
  private async editableCall(user: SessionUser, code: string, manager: EntityManager) {
    const call = await this.calls.findByCode(code, manager, true);
    if (!hasCallRole(user, call.code, 'chair')) {
      if (isStaff(user)) assertAllowed(false, 'Only the chair of the call assigns its referees');
      throw notFound('Call');
    }
    const now = this.clock.now();
    if (!isAssigning(call, now))
      throw conflict(
        'CALL_NOT_IN_REVIEW',
        `Call ${call.code} is ${effectiveStatus(call, now).replace(/_/g, ' ')}: referees are assigned after the deadline and before deliberation`,
      );
    return call;
  }

  private async state(call: Call, manager: EntityManager): Promise<PoolState> {
    const referees = (await manager.query(
      `SELECT u.id, u.name, u.email, u.affiliation, u.science_categories
         FROM call_roles r JOIN users u ON u.id = r.user_id
        WHERE r.call_id = $1 AND r.role = 'referee' AND u.active
        ORDER BY u.name, u.id`,
      [call.id],
    )) as PoolRow[];
    const proposals = (await manager.query(
      `SELECT p.id, p.reference, p.title, p.science_category, pu.name AS pi_name
         FROM proposals p
         LEFT JOIN proposal_members pm ON pm.proposal_id = p.id AND pm.role = 'pi'
         LEFT JOIN users pu ON pu.id = pm.user_id
        WHERE p.call_id = $1 AND p.status IN ('submitted', 'under_review')
        ORDER BY p.reference`,
      [call.id],
    )) as ProposalRow[];
    const assignments = (await manager.query(
      `SELECT a.id, a.proposal_id, a.referee_id, u.name AS referee_name, a.status,
              b.name AS assigned_by, a.assigned_at, a.decline_reason
         FROM review_assignments a
         JOIN proposals p ON p.id = a.proposal_id
         JOIN users u ON u.id = a.referee_id
         LEFT JOIN users b ON b.id = a.assigned_by
        WHERE p.call_id = $1
        ORDER BY a.assigned_at, u.name`,
      [call.id],
    )) as AssignmentRow[];
    const conflicts = (await manager.query(POOL_CONFLICTS_SQL, [call.id])) as ConflictRow[];
    return { call, referees, proposals, assignments, conflicts };
  }

  private answer(user: SessionUser, s: PoolState): CallRefereesResponse {
    const { call } = s;
    const counting = s.assignments.filter((a) => COUNTING_STATUSES.includes(a.status));
    const item = (a: AssignmentRow): AssignmentItem => ({
      id: a.id,
      refereeId: a.referee_id,
      refereeName: a.referee_name,
      status: a.status,
      assignedBy: a.assigned_by,
      assignedAt: a.assigned_at.toISOString(),
      declineReason: a.decline_reason,
    });
    const proposals: ProposalAssignments[] = s.proposals.map((p) => {
      const mine = s.assignments.filter((a) => a.proposal_id === p.id);
      return {
        proposalId: p.id,
        reference: p.reference,
        title: p.title,
        scienceCategory: p.science_category,
        piName: call.anonymousReview ? null : p.pi_name,
        assignments: mine.map(item),
        missing: Math.max(
          0,
          call.refereesPerProposal -
            mine.filter((a) => COUNTING_STATUSES.includes(a.status)).length,
        ),
      };
    });
    return {
      call: {
        code: call.code,
        title: call.title,
        reviewDueAt: call.reviewDueAt.toISOString(),
        scoreMin: call.scoreMin,
        scoreMax: call.scoreMax,
        scoreHigherIsBetter: call.scoreHigherIsBetter,
        anonymousReview: call.anonymousReview,
        timeZone: call.timeZone,
        refereesPerProposal: call.refereesPerProposal,
        status: effectiveStatus(call, this.clock.now()),
      },
      canEdit: hasCallRole(user, call.code, 'chair') && isAssigning(call, this.clock.now()),
      referees: s.referees.map((r) => ({
        userId: r.id,
        name: r.name,
        email: r.email,
        affiliation: r.affiliation,
        scienceCategories: r.science_categories,
        load: counting.filter((a) => a.referee_id === r.id).length,
        submitted: counting.filter((a) => a.referee_id === r.id && a.status === 'submitted').length,
        conflicts: s.conflicts
          .filter((c) => c.referee_id === r.id)
          .map((c) => ({
            proposalId: c.proposal_id,
            reference: c.reference,
            kind: c.kind,
            reason: c.reason,
          })),
      })),
      proposals,
    };
  }
}
