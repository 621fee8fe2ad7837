import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { CalcInputError } from '@skyhours/calc';
import type { DataSource, EntityManager } from 'typeorm';
import { hasCallRole, isStaff } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { type CallStatus, effectiveStatus } from '../calls/call-lifecycle.js';
import { Clock } from '../common/clock.js';
import { conflict, notFound } from '../common/errors/app-error.js';
import {
  buildStanding,
  type ObservationFacts,
  type ProposalFacts,
  type ReviewFacts,
  type StandingInput,
} from './standing-builder.js';
import type { Standing, StandingConfiguration, Tier, Verdict } from './standing-contract.js';

/** Proposals that take part in the review: everything submitted, whatever happened next. */
export const IN_STANDING_SQL = `p.status NOT IN ('draft', 'withdrawn')`;

/** The call as the allocation routes read it (one query, with its site). */
export interface AllocationCall {
  id: string;
  code: string;
  title: string;
  status: CallStatus;
  storedStatus: CallStatus;
  timeZone: string;
  deadlineAt: Date;
  reviewDueAt: Date;
  publishedAt: Date | null;
  scoreMin: number;
  scoreMax: number;
  scoreHigherIsBetter: boolean;
  anonymousReview: boolean;
  refereesPerProposal: number;
  observatoryId: string;
  observatoryName: string;
  latitudeDeg: number;
  elevationLimitDeg: number;
}

interface CallRow {
  id: string;
  code: string;
  title: string;
  status: CallStatus;
  time_zone: string;
  deadline_at: Date;
  review_due_at: Date;
  published_at: Date | null;
  score_min: number;
  score_max: number;
  score_higher_is_better: boolean;
  anonymous_review: boolean;
  referees_per_proposal: number;
  observatory_id: string;
  observatory_name: string;
  latitude_deg: number;
  elevation_limit_deg: number;
}

/** Who sees a call's standing: its chair and staff. */
export const canSeeStanding = (user: SessionUser, code: string) =>
  isStaff(user) || hasCallRole(user, code, 'chair');

/**
 * The chair's standing of a call, read in a fixed number of statements whatever its size (the
 * call, its configurations, its proposals, their observations, their reviews), then put together
 * by buildStanding.
 */
@Injectable()
export class StandingService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly clock: Clock,
  ) {}

  /** The call, or 404 (also for a caller who is neither its chair nor staff). */
  async visibleCall(
    user: SessionUser,
    code: string,
    manager: EntityManager = this.dataSource.manager,
    lock = false,
  ): Promise<AllocationCall> {
    const call = await this.findCall(code, manager, lock);
    if (!call || !canSeeStanding(user, call.code)) throw notFound('Call');
    return call;
  }

  async findCall(
    code: string,
    manager: EntityManager = this.dataSource.manager,
    lock = false,
  ): Promise<AllocationCall | null> {
    const rows = (await manager.query(
      `SELECT c.id, c.code, c.title, c.status, c.time_zone, c.deadline_at, c.review_due_at,
              c.published_at, c.score_min, c.score_max, c.score_higher_is_better,
              c.anonymous_review, c.referees_per_proposal, c.observatory_id,
              o.name AS observatory_name, o.site_latitude_deg AS latitude_deg,
              o.elevation_limit_deg
         FROM calls c JOIN observatories o ON o.id = c.observatory_id
        WHERE c.code = $1 ${lock ? 'FOR UPDATE OF c' : ''}`,
      [code.trim().toUpperCase()],
    )) as CallRow[];
    const row = rows[0];
    return row ? this.toCall(row) : null;
  }

  private toCall(row: CallRow): AllocationCall {
    return {
      id: row.id,
      code: row.code,
      title: row.title,
      status: effectiveStatus(
        { status: row.status, deadlineAt: row.deadline_at },
        this.clock.now(),
      ),
      storedStatus: row.status,
      timeZone: row.time_zone,
      deadlineAt: row.deadline_at,
      reviewDueAt: row.review_due_at,
      publishedAt: row.published_at,
      scoreMin: row.score_min,
      scoreMax: row.score_max,
      scoreHigherIsBetter: row.score_higher_is_better,
      anonymousReview: row.anonymous_review,
      refereesPerProposal: row.referees_per_proposal,
      observatoryId: row.observatory_id,
      observatoryName: row.observatory_name,
      latitudeDeg: row.latitude_deg,
      elevationLimitDeg: row.elevation_limit_deg,
    };
  }

  async forUser(user: SessionUser, code: string): Promise<Standing> {
    return this.build(await this.visibleCall(user, code));
  }

  /** The standing of a call the caller has already been allowed to see. */
  async build(
    call: AllocationCall,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<Standing> {
    const input = await this.load(call, manager);
    try {
      return buildStanding(input);
    } catch (error) {
      // A score off the call's scale (the scale changed after reviews came in) is the data's
      // problem, not a fault of ours: say which.
      if (error instanceof CalcInputError)
        throw conflict(
          'SCORES_OFF_SCALE',
          `The reviews of call ${call.code} do not fit its score scale ${call.scoreMin}–${call.scoreMax}: ${error.message}`,
        );
      throw error;
    }
  }

  private async load(call: AllocationCall, manager: EntityManager): Promise<StandingInput> {
    const configurations = (await manager.query(
      `SELECT cfg.id, cfg.name, COALESCE(cc.hours_offered, 0) AS hours_offered,
              to_char(cfg.in_use_from, 'YYYY-MM-DD') AS in_use_from,
              to_char(cfg.in_use_to, 'YYYY-MM-DD') AS in_use_to
         FROM configurations cfg
         LEFT JOIN call_capacities cc ON cc.configuration_id = cfg.id AND cc.call_id = $1
        WHERE cfg.observatory_id = $2
          AND (cc.call_id IS NOT NULL OR EXISTS (
                SELECT 1 FROM proposal_observations o JOIN proposals p ON p.id = o.proposal_id
                 WHERE o.configuration_id = cfg.id AND p.call_id = $1 AND ${IN_STANDING_SQL}))
        ORDER BY cfg.in_use_from, cfg.name`,
      [call.id, call.observatoryId],
    )) as {
      id: string;
      name: string;
      hours_offered: number;
      in_use_from: string;
      in_use_to: string | null;
    }[];

    const proposals = (await manager.query(
      `SELECT p.id, p.reference, p.title, p.science_category, p.kind,
              COALESCE(pi.name, '') AS pi_name,
              ta.verdict, COALESCE(ta.note, '') AS technical_note, g.tier,
              COALESCE(ra.active, 0)::int AS active_assignments
         FROM proposals p
         LEFT JOIN LATERAL (
           SELECT COALESCE(u.name, m.email) AS name
             FROM proposal_members m LEFT JOIN users u ON u.id = m.user_id
            WHERE m.proposal_id = p.id AND m.role = 'pi'
            ORDER BY m.invited_at LIMIT 1) pi ON true
         LEFT JOIN technical_assessments ta ON ta.proposal_id = p.id
         LEFT JOIN proposal_grants g ON g.proposal_id = p.id
         LEFT JOIN (
           SELECT a.proposal_id, count(*) AS active FROM review_assignments a
            WHERE a.status IN ('invited', 'accepted', 'submitted')
            GROUP BY a.proposal_id) ra ON ra.proposal_id = p.id
        WHERE p.call_id = $1 AND ${IN_STANDING_SQL}`,
      [call.id],
    )) as {
      id: string;
      reference: string;
      title: string;
      science_category: string | null;
      kind: string;
      pi_name: string;
      verdict: Verdict | null;
      technical_note: string;
      tier: Tier | null;
      active_assignments: number;
    }[];

    const observations = (await manager.query(
      `SELECT o.id, o.proposal_id, t.name AS target_name, t.ra_deg, t.dec_deg,
              o.configuration_id, b.name AS band_name, o.hours_asked, og.hours AS hours_granted
         FROM proposal_observations o
         JOIN proposals p ON p.id = o.proposal_id
         JOIN proposal_targets t ON t.id = o.target_id
         JOIN receiver_bands b ON b.id = o.band_id
         LEFT JOIN observation_grants og ON og.observation_id = o.id
        WHERE p.call_id = $1 AND ${IN_STANDING_SQL}
        ORDER BY o.proposal_id, o.position`,
      [call.id],
    )) as {
      id: string;
      proposal_id: string;
      target_name: string;
      ra_deg: number;
      dec_deg: number;
      configuration_id: string;
      band_name: string;
      hours_asked: number;
      hours_granted: number | null;
    }[];

    const reviews = (await manager.query(
      `SELECT a.id, a.proposal_id, a.referee_id, u.name AS referee_name, a.score, a.expertise,
              a.comment_to_pi, a.comment_to_committee, a.submitted_at
         FROM review_assignments a
         JOIN proposals p ON p.id = a.proposal_id
         JOIN users u ON u.id = a.referee_id
        WHERE p.call_id = $1 AND ${IN_STANDING_SQL} AND a.status = 'submitted'
        ORDER BY a.submitted_at, a.id`,
      [call.id],
    )) as {
      id: string;
      proposal_id: string;
      referee_id: string;
      referee_name: string;
      score: number;
      expertise: 1 | 2 | 3;
      comment_to_pi: string;
      comment_to_committee: string;
      submitted_at: Date;
    }[];

    const standingConfigurations: StandingConfiguration[] = configurations.map((c) => ({
      id: c.id,
      name: c.name,
      hoursOffered: c.hours_offered,
      inUseFrom: c.in_use_from,
      inUseTo: c.in_use_to,
    }));
    return {
      call: {
        code: call.code,
        title: call.title,
        status: call.status,
        timeZone: call.timeZone,
        scoreMin: call.scoreMin,
        scoreMax: call.scoreMax,
        scoreHigherIsBetter: call.scoreHigherIsBetter,
        anonymousReview: call.anonymousReview,
        refereesPerProposal: call.refereesPerProposal,
        reviewDueAt: call.reviewDueAt.toISOString(),
        publishedAt: call.publishedAt?.toISOString() ?? null,
        reviewDueDate: call.reviewDueAt.toISOString().slice(0, 10),
      },
      site: { latitudeDeg: call.latitudeDeg, elevationLimitDeg: call.elevationLimitDeg },
      configurations: standingConfigurations,
      proposals: proposals.map((p): ProposalFacts => ({
        id: p.id,
        reference: p.reference,
        title: p.title,
        category: p.science_category,
        kind: p.kind,
        piName: p.pi_name,
        // Before any assignment, the call's number of referees per proposal is what is expected.
        reviewsExpected: p.active_assignments || call.refereesPerProposal,
        verdict: p.verdict,
        technicalNote: p.technical_note,
        tier: p.tier,
      })),
      observations: observations.map((o): ObservationFacts => ({
        id: o.id,
        proposalId: o.proposal_id,
        targetName: o.target_name,
        raDeg: o.ra_deg,
        decDeg: o.dec_deg,
        configurationId: o.configuration_id,
        bandName: o.band_name,
        hoursAsked: o.hours_asked,
        hoursGranted: o.hours_granted,
      })),
      reviews: reviews.map((r): ReviewFacts => ({
        assignmentId: r.id,
        proposalId: r.proposal_id,
        refereeId: r.referee_id,
        refereeName: r.referee_name,
        score: r.score,
        expertise: r.expertise,
        commentToPi: r.comment_to_pi,
        commentToCommittee: r.comment_to_committee,
        submittedAt: r.submitted_at.toISOString(),
      })),
    };
  }
}
