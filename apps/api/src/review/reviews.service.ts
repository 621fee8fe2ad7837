import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { isUUID } from 'class-validator';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { hasCallRole } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import type { CallStatus } from '../calls/call-lifecycle.js';
import { Clock } from '../common/clock.js';
import { AppError, conflict, notFound, validationFailed } from '../common/errors/app-error.js';
import { compiledPdfName } from '../proposals/submission.service.js';
import type { ReasonDto } from './dto/reason.dto.js';
import type { SaveReviewDto } from './dto/save-review.dto.js';
import type { ReviewDetail, ReviewListItem, ReviewStatus } from './review-contract.js';
import { autoConflictSql } from './review-queries.js';
import { isReviewOpen, reviewClosedMessage, reviewIssues } from './review-rules.js';

interface AssignmentRow {
  id: string;
  proposal_id: string;
  referee_id: string;
  status: ReviewStatus;
  score: number | null;
  comment_to_pi: string;
  comment_to_committee: string;
  expertise: 1 | 2 | 3 | null;
  decline_reason: string | null;
  submitted_at: Date | null;
  updated_at: Date;
  version: number;
  reference: string;
  title: string;
  abstract: string;
  science_category: string;
  kind: string;
  submitted_version: number | null;
  total_hours: number | null;
  code: string;
  call_title: string;
  call_status: CallStatus;
  opens_at: Date;
  deadline_at: Date;
  review_due_at: Date;
  score_min: number;
  score_max: number;
  score_higher_is_better: boolean;
  anonymous_review: boolean;
  time_zone: string;
  conflict_reason: string | null;
  auto_conflict: boolean;
}

/**
 * One query for the referee's own assignments (`$1` the referee). The team is never selected:
 * nothing in these answers can name it, anonymous call or not.
 */
const ASSIGNMENTS_SQL = `
  SELECT a.id, a.proposal_id, a.referee_id, a.status, a.score, a.comment_to_pi,
         a.comment_to_committee, a.expertise, a.decline_reason, a.submitted_at, a.updated_at,
         a.version, p.reference, p.title, p.abstract, p.science_category, p.kind,
         p.submitted_version, v.total_hours, c.code, c.title AS call_title, c.status AS call_status,
         c.opens_at, c.deadline_at, c.review_due_at, c.score_min, c.score_max,
         c.score_higher_is_better, c.anonymous_review, c.time_zone, d.reason AS conflict_reason,
         ${autoConflictSql('ru', 'p.id')} AS auto_conflict
    FROM review_assignments a
    JOIN users ru ON ru.id = a.referee_id
    JOIN proposals p ON p.id = a.proposal_id
    JOIN calls c ON c.id = p.call_id
    JOIN call_roles cr ON cr.call_id = c.id AND cr.user_id = a.referee_id AND cr.role = 'referee'
    LEFT JOIN proposal_versions v ON v.proposal_id = p.id AND v.number = p.submitted_version
    LEFT JOIN referee_conflicts d ON d.referee_id = a.referee_id AND d.proposal_id = a.proposal_id
   WHERE a.referee_id = $1`;

/** The referee's workspace: their own assignments, the PDF to read, the review form. */
@Injectable()
export class ReviewsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clock: Clock,
    private readonly audit: AuditService,
  ) {}

  async list(user: SessionUser): Promise<ReviewListItem[]> {
    const rows = (await this.dataSource.query(
      `${ASSIGNMENTS_SQL} ORDER BY c.review_due_at, c.code, p.reference`,
      [user.id],
    )) as AssignmentRow[];
    const now = this.clock.now();
    return rows.filter((r) => hasCallRole(user, r.code, 'referee')).map((r) => listItem(r, now));
  }

  async get(user: SessionUser, id: string): Promise<ReviewDetail> {
    return detail(await this.load(user, id), this.clock.now());
  }

  /** The compiled PDF of the proposal's latest submitted version. */
  async pdf(user: SessionUser, id: string): Promise<{ filename: string; bytes: Buffer }> {
    const row = await this.load(user, id);
    const status = statusOf(row);
    if (status === 'conflicted' || status === 'declined')
      throw conflict(
        'ASSIGNMENT_CLOSED',
        `You ${status === 'declined' ? 'declined' : 'are in conflict with'} ${row.reference}; its PDF is no longer yours to read`,
      );
    const [file] = (await this.dataSource.query(
      `SELECT v.compiled_pdf FROM proposal_versions v
        WHERE v.proposal_id = $1 AND v.number = $2`,
      [row.proposal_id, row.submitted_version],
    )) as { compiled_pdf: Buffer | null }[];
    if (!file?.compiled_pdf || row.submitted_version === null)
      throw notFound('Compiled PDF (the proposal has no submitted version)');
    return {
      filename: compiledPdfName(row.reference, row.submitted_version),
      bytes: file.compiled_pdf,
    };
  }

  async save(user: SessionUser, id: string, dto: SaveReviewDto): Promise<ReviewDetail> {
    return this.write(user, id, dto.version, async (row, manager, now) => {
      const submitting = dto.submit === true || row.status === 'submitted';
      if (statusOf(row) === 'declined' || statusOf(row) === 'conflicted')
        throw conflict(
          'ASSIGNMENT_CLOSED',
          `You ${statusOf(row) === 'declined' ? 'declined' : 'are in conflict with'} ${row.reference}; its review cannot change`,
        );
      const issues = reviewIssues(
        {
          score: dto.score,
          expertise: dto.expertise,
          commentToPi: dto.commentToPi,
          commentToCommittee: dto.commentToCommittee,
        },
        { scoreMin: row.score_min, scoreMax: row.score_max },
        submitting,
      );
      if (issues.length) throw validationFailed(issues);
      const status: ReviewStatus = submitting ? 'submitted' : 'accepted';
      await manager.query(
        `UPDATE review_assignments
            SET status = $2, score = $3, comment_to_pi = $4, comment_to_committee = $5,
                expertise = $6, submitted_at = CASE WHEN $2 = 'submitted' THEN $7::timestamptz END,
                version = version + 1, updated_at = $7
          WHERE id = $1`,
        [row.id, status, dto.score, dto.commentToPi, dto.commentToCommittee, dto.expertise, now],
      );
      return {
        action:
          status === 'submitted'
            ? row.status === 'submitted'
              ? 'review.resubmitted'
              : 'review.submitted'
            : 'review.draft_saved',
        details: { score: dto.score, expertise: dto.expertise },
      };
    });
  }

  async decline(user: SessionUser, id: string, dto: ReasonDto): Promise<ReviewDetail> {
    return this.write(user, id, dto.version, async (row, manager, now) => {
      const status = statusOf(row);
      if (status === 'submitted')
        throw conflict(
          'REVIEW_SUBMITTED',
          `Your review of ${row.reference} is submitted; declare a conflict instead if you must withdraw it`,
        );
      if (status !== 'invited' && status !== 'accepted')
        throw conflict('ASSIGNMENT_CLOSED', `The assignment to ${row.reference} is ${status}`);
      await manager.query(
        `UPDATE review_assignments SET status = 'declined', decline_reason = $2,
                version = version + 1, updated_at = $3 WHERE id = $1`,
        [row.id, dto.reason, now],
      );
      return { action: 'review.declined', details: { reason: dto.reason } };
    });
  }

  /**
   * A conflict the referee declares: recorded for the proposal (the automatic pass then never
   * picks them for it again) and the assignment closed. A review already written is withdrawn,
   * as a conflicted score must not count.
   */
  async declareConflict(user: SessionUser, id: string, dto: ReasonDto): Promise<ReviewDetail> {
    return this.write(user, id, dto.version, async (row, manager, now) => {
      if (row.status === 'declined' || row.status === 'conflicted')
        throw conflict('ASSIGNMENT_CLOSED', `The assignment to ${row.reference} is ${row.status}`);
      await manager.query(
        `INSERT INTO referee_conflicts (referee_id, proposal_id, reason, declared_at)
         VALUES ($1, $2, $3, $4)
         ON CONFLICT (referee_id, proposal_id) DO UPDATE SET reason = $3, declared_at = $4`,
        [row.referee_id, row.proposal_id, dto.reason, now],
      );
      await manager.query(
        `UPDATE review_assignments SET status = 'conflicted', score = NULL, expertise = NULL,
                submitted_at = NULL, version = version + 1, updated_at = $2 WHERE id = $1`,
        [row.id, now],
      );
      return {
        action: 'review.conflict_declared',
        details: { reason: dto.reason, withdrewSubmitted: row.status === 'submitted' },
      };
    });
  }

  /**
   * One write of the referee's own assignment: locked, the version checked, the call's review
   * window checked by the server's clock, the change made and audited; answers the new state.
   */
  private async write(
    user: SessionUser,
    id: string,
    version: number,
    change: (
      row: AssignmentRow,
      manager: EntityManager,
      now: Date,
    ) => Promise<{ action: string; details: Record<string, unknown> }>,
  ): Promise<ReviewDetail> {
    return this.dataSource.transaction(async (manager) => {
      if (!isUUID(id)) throw notFound('Review');
      await manager.query(`SELECT 1 FROM review_assignments WHERE id = $1 FOR UPDATE`, [id]);
      const row = await this.load(user, id, manager);
      const now = this.clock.now();
      if (row.version !== version)
        throw conflict(
          'STALE_VERSION',
          `Your review of ${row.reference} has changed since you loaded it (you had version ${version}, it is now at version ${row.version}); reload it and make your change again`,
        );
      const call = {
        code: row.code,
        status: row.call_status,
        opensAt: row.opens_at,
        deadlineAt: row.deadline_at,
        reviewDueAt: row.review_due_at,
      };
      if (!isReviewOpen(call, now))
        throw new AppError(HttpStatus.CONFLICT, 'REVIEW_CLOSED', reviewClosedMessage(call, now));
      const { action, details } = await change(row, manager, now);
      await this.audit.record(
        {
          actorId: user.id,
          action,
          subjectType: 'review_assignment',
          subjectId: row.id,
          details: { reference: row.reference, call: row.code, ...details },
        },
        manager,
      );
      return detail(await this.load(user, id, manager), now);
    });
  }

  /** The user's own assignment in a call they still referee, or 404. */
  private async load(
    user: SessionUser,
    id: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<AssignmentRow> {
    if (!isUUID(id)) throw notFound('Review');
    const [row] = (await manager.query(`${ASSIGNMENTS_SQL} AND a.id = $2`, [user.id, id])) as
      AssignmentRow[] | [];
    if (!row || !hasCallRole(user, row.code, 'referee')) throw notFound('Review');
    return row;
  }
}

/** An automatic conflict closes an assignment not yet submitted, as a declared one does. */
function statusOf(r: AssignmentRow): ReviewStatus {
  if (r.auto_conflict && r.status !== 'declined') return 'conflicted';
  return r.status;
}

function listItem(r: AssignmentRow, now: Date): ReviewListItem {
  const status = statusOf(r);
  return {
    id: r.id,
    reference: r.reference,
    title: r.title,
    scienceCategory: r.science_category,
    call: {
      code: r.code,
      title: r.call_title,
      reviewDueAt: r.review_due_at.toISOString(),
      scoreMin: r.score_min,
      scoreMax: r.score_max,
      scoreHigherIsBetter: r.score_higher_is_better,
      anonymousReview: r.anonymous_review,
      timeZone: r.time_zone,
    },
    status,
    editable:
      status !== 'declined' &&
      status !== 'conflicted' &&
      isReviewOpen(
        {
          status: r.call_status,
          opensAt: r.opens_at,
          deadlineAt: r.deadline_at,
          reviewDueAt: r.review_due_at,
        },
        now,
      ),
    score: r.score,
    updatedAt: r.updated_at.toISOString(),
    submittedAt: r.submitted_at?.toISOString() ?? null,
  };
}

function detail(r: AssignmentRow, now: Date): ReviewDetail {
  const item = listItem(r, now);
  const closed = item.status === 'conflicted' || item.status === 'declined';
  return {
    ...item,
    // Once in conflict or declined, the proposal's content is no longer the referee's to read.
    abstract: closed ? '' : r.abstract,
    kind: r.kind,
    versionNumber: r.submitted_version ?? 0,
    totalHours: r.total_hours ?? 0,
    commentToPi: r.comment_to_pi,
    commentToCommittee: r.comment_to_committee,
    expertise: r.expertise,
    version: r.version,
    declineReason: r.decline_reason,
    conflictReason: r.conflict_reason,
  };
}
