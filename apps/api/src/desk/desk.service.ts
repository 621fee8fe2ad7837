import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '../auth/session-user.js';
import { proposalChecks } from '../proposals/proposal-checks.js';
import { ProposalLoader } from '../proposals/proposal-loader.js';
import type {
  DeskAssignment,
  DeskCall,
  DeskChairCall,
  DeskDraft,
  DeskPlan,
  DeskProgress,
  DeskResponse,
  DeskSubmitted,
} from './dto/desk.response.js';

const iso = (d: Date | string) => new Date(d).toISOString();
const round = (h: number) => Math.round(h * 100) / 100;
/** Assignments still owed: asked or accepted, not yet submitted. */
const OWED = ['invited', 'accepted'];

interface MyProposalRow {
  id: string;
  reference: string;
  title: string;
  status: string;
  call_code: string;
  deadline_at: Date;
  published: boolean;
  tier: string | null;
  granted: number | null;
  obtained: number | null;
  runs_to_come: number;
}

/**
 * What waits for the signed-in user, per role they hold, read straight from the tables the other
 * features write (a fixed number of queries whatever the data: at most about fifteen).
 */
@Injectable()
export class DeskService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async desk(user: SessionUser, now: Date): Promise<DeskResponse> {
    const answer: DeskResponse = { now: now.toISOString() };
    if (user.roles.includes('proposer')) answer.proposer = await this.proposer(user, now);
    if (user.roles.includes('referee')) answer.referee = await this.referee(user);
    if (user.roles.includes('chair')) answer.chair = await this.chair(user);
    if (user.roles.includes('staff')) answer.staff = await this.staff(now);
    if (user.roles.includes('admin')) answer.admin = await this.admin();
    return answer;
  }

  private async proposer(
    user: SessionUser,
    now: Date,
  ): Promise<NonNullable<DeskResponse['proposer']>> {
    const q = this.dataSource;
    const calls: {
      code: string;
      title: string;
      status: string;
      deadline_at: Date;
      time_zone: string;
    }[] = await q.query(
      `SELECT code, title, status, deadline_at, time_zone FROM calls
          WHERE status = 'open' AND opens_at <= $1 AND deadline_at > $1
          ORDER BY deadline_at`,
      [now],
    );
    const mine: MyProposalRow[] = await q.query(
      `SELECT p.id, p.reference, p.title, p.status, c.code AS call_code, c.deadline_at,
              c.published_at IS NOT NULL AS published, g.tier,
              (SELECT sum(og.hours) FROM observation_grants og WHERE og.proposal_id = p.id) AS granted,
              (SELECT sum(r.hours_obtained) FROM runs r
                 JOIN proposal_observations o ON o.id = r.observation_id
                WHERE o.proposal_id = p.id AND r.status = 'observed') AS obtained,
              (SELECT count(*)::int FROM runs r
                 JOIN proposal_observations o ON o.id = r.observation_id
                WHERE o.proposal_id = p.id AND r.status = 'planned' AND r.starts_at > $2) AS runs_to_come
         FROM proposals p
         JOIN proposal_members m ON m.proposal_id = p.id AND m.user_id = $1
         JOIN calls c ON c.id = p.call_id
         LEFT JOIN proposal_grants g ON g.proposal_id = p.id
        WHERE p.status <> 'withdrawn'
        ORDER BY c.deadline_at DESC, p.reference`,
      [user.id, now],
    );
    const draftRows = mine.filter((p) => p.status === 'draft');
    const loaded = await new ProposalLoader(this.dataSource).loadMany(draftRows.map((d) => d.id));
    const checks = new Map(loaded.map((d) => [d.proposal.id, proposalChecks(d, now)]));
    const drafts: DeskDraft[] = draftRows.map((p) => {
      const c = checks.get(p.id);
      return {
        reference: p.reference,
        title: p.title,
        callCode: p.call_code,
        deadlineAt: iso(p.deadline_at),
        blockers: c?.blockers ?? 0,
        warnings: c?.warnings ?? 0,
        blockerMessages: (c?.items ?? [])
          .filter((i) => i.level === 'blocker')
          .slice(0, 3)
          .map((i) => i.message),
        link: { screen: 'proposal', params: { reference: p.reference, section: 'checks' } },
      };
    });
    const submitted: DeskSubmitted[] = mine
      .filter((p) => p.status !== 'draft')
      .map((p) => ({
        reference: p.reference,
        title: p.title,
        callCode: p.call_code,
        status: p.status,
        // The chair's decisions stay private until the call's outcomes are published.
        tier: p.published ? p.tier : null,
        link: { screen: 'proposal', params: { reference: p.reference } },
      }));
    const progress: DeskProgress[] = mine
      .filter((p) => p.published && p.granted !== null && p.granted > 0)
      .map((p) => ({
        reference: p.reference,
        title: p.title,
        callCode: p.call_code,
        hoursGranted: round(p.granted!),
        hoursObtained: round(p.obtained ?? 0),
        runsToCome: p.runs_to_come,
        link: { screen: 'proposal', params: { reference: p.reference } },
      }));
    return {
      openCalls: calls.map((c) => this.callItem(c, { screen: 'call', params: { code: c.code } })),
      drafts,
      submitted,
      progress,
    };
  }

  private async referee(user: SessionUser): Promise<NonNullable<DeskResponse['referee']>> {
    const rows: {
      id: string;
      status: string;
      reference: string;
      title: string;
      code: string;
      review_due_at: Date;
    }[] = await this.dataSource.query(
      `SELECT a.id, a.status, p.reference, p.title, c.code, c.review_due_at
         FROM review_assignments a
         JOIN proposals p ON p.id = a.proposal_id
         JOIN calls c ON c.id = p.call_id
        WHERE a.referee_id = $1 AND c.status IN ('in_review', 'deliberation')
          AND a.status NOT IN ('declined', 'conflicted')
        ORDER BY c.review_due_at, p.reference`,
      [user.id],
    );
    // Only calls in which the user is a referee now (a withdrawn role hides its assignments).
    const mine = new Set(user.callRoles.filter((g) => g.role === 'referee').map((g) => g.callCode));
    const visible = rows.filter((r) => mine.has(r.code));
    const toDo: DeskAssignment[] = visible
      .filter((r) => OWED.includes(r.status))
      .map((r) => ({
        id: r.id,
        reference: r.reference,
        title: r.title,
        callCode: r.code,
        status: r.status,
        dueAt: iso(r.review_due_at),
        link: { screen: 'review', params: { assignmentId: r.id } },
      }));
    const calls = new Map<string, { code: string; dueAt: string; done: number; total: number }>();
    for (const r of visible) {
      const c = calls.get(r.code) ?? {
        code: r.code,
        dueAt: iso(r.review_due_at),
        done: 0,
        total: 0,
      };
      c.total += 1;
      if (r.status === 'submitted') c.done += 1;
      calls.set(r.code, c);
    }
    return { toDo, calls: [...calls.values()] };
  }

  private async chair(user: SessionUser): Promise<NonNullable<DeskResponse['chair']>> {
    const codes = user.callRoles.filter((g) => g.role === 'chair').map((g) => g.callCode);
    if (codes.length === 0) return { calls: [] };
    const calls: {
      id: string;
      code: string;
      title: string;
      status: string;
      review_due_at: Date;
      proposals: number;
      reviews_done: number;
      reviews_expected: number;
      undecided: number;
    }[] = await this.dataSource.query(
      `SELECT c.id, c.code, c.title, c.status, c.review_due_at,
              (SELECT count(*)::int FROM proposals p
                WHERE p.call_id = c.id AND p.submitted_version IS NOT NULL AND p.status <> 'withdrawn') AS proposals,
              (SELECT count(*)::int FROM review_assignments a JOIN proposals p ON p.id = a.proposal_id
                WHERE p.call_id = c.id AND a.status = 'submitted') AS reviews_done,
              (SELECT count(*)::int FROM review_assignments a JOIN proposals p ON p.id = a.proposal_id
                WHERE p.call_id = c.id AND a.status NOT IN ('declined', 'conflicted')) AS reviews_expected,
              (SELECT count(*)::int FROM proposals p
                WHERE p.call_id = c.id AND p.submitted_version IS NOT NULL AND p.status <> 'withdrawn'
                  AND NOT EXISTS (SELECT 1 FROM proposal_grants g WHERE g.proposal_id = p.id)) AS undecided
         FROM calls c
        WHERE c.code = ANY($1) AND c.status IN ('closed', 'in_review', 'deliberation', 'published')
        ORDER BY c.review_due_at`,
      [codes],
    );
    const pressure: { call_id: string; name: string; offered: number; asked: number | null }[] =
      await this.dataSource.query(
        `SELECT cc.call_id, cf.name, cc.hours_offered AS offered,
                (SELECT sum(o.hours_asked) FROM proposal_observations o
                   JOIN proposals p ON p.id = o.proposal_id
                  WHERE p.call_id = cc.call_id AND o.configuration_id = cc.configuration_id
                    AND p.submitted_version IS NOT NULL AND p.status <> 'withdrawn') AS asked
           FROM call_capacities cc JOIN configurations cf ON cf.id = cc.configuration_id
          WHERE cc.call_id = ANY($1)
          ORDER BY cf.longest_baseline_m`,
        [calls.map((c) => c.id)],
      );
    return {
      calls: calls.map((c): DeskChairCall => ({
        code: c.code,
        title: c.title,
        status: c.status,
        reviewDueAt: iso(c.review_due_at),
        proposals: c.proposals,
        reviewsDone: c.reviews_done,
        reviewsExpected: c.reviews_expected,
        undecided: c.undecided,
        pressure: pressure
          .filter((p) => p.call_id === c.id)
          .map((p) => ({
            configuration: p.name,
            hoursAsked: round(p.asked ?? 0),
            hoursOffered: p.offered,
            ratio: Math.round(((p.asked ?? 0) / p.offered) * 100) / 100,
          })),
        link: { screen: 'standing', params: { code: c.code } },
      })),
    };
  }

  private async staff(now: Date): Promise<NonNullable<DeskResponse['staff']>> {
    const q = this.dataSource;
    const calls: {
      code: string;
      title: string;
      status: string;
      deadline_at: Date;
      time_zone: string;
    }[] = await q.query(
      `SELECT code, title, status, deadline_at, time_zone FROM calls
          WHERE status <> 'archived' ORDER BY deadline_at DESC`,
    );
    const waiting: { code: string; waiting: number }[] = await q.query(
      `SELECT c.code, count(*)::int AS waiting FROM proposals p JOIN calls c ON c.id = p.call_id
        WHERE c.status IN ('closed', 'in_review', 'deliberation')
          AND p.submitted_version IS NOT NULL AND p.status <> 'withdrawn'
          AND NOT EXISTS (SELECT 1 FROM technical_assessments t WHERE t.proposal_id = p.id)
        GROUP BY c.code ORDER BY c.code`,
    );
    const plans: {
      code: string;
      generated_at: Date | null;
      planned: number;
      to_record: number;
      observed: number;
      lost: number;
    }[] = await q.query(
      `SELECT c.code, pl.generated_at,
              count(r.id) FILTER (WHERE r.status = 'planned' AND r.ends_at > $1)::int AS planned,
              count(r.id) FILTER (WHERE r.status = 'planned' AND r.ends_at <= $1)::int AS to_record,
              count(r.id) FILTER (WHERE r.status = 'observed')::int AS observed,
              count(r.id) FILTER (WHERE r.status = 'lost')::int AS lost
         FROM calls c
         LEFT JOIN plans pl ON pl.call_id = c.id
         LEFT JOIN runs r ON r.call_id = c.id
        WHERE pl.call_id IS NOT NULL OR c.status = 'published'
        GROUP BY c.code, pl.generated_at, c.deadline_at
        ORDER BY c.deadline_at DESC`,
      [now],
    );
    return {
      calls: calls.map((c) => this.callItem(c, { screen: 'call', params: { code: c.code } })),
      assessmentsWaiting: waiting.map((w) => ({
        callCode: w.code,
        waiting: w.waiting,
        link: { screen: 'assessments', params: { code: w.code } },
      })),
      plans: plans.map((p): DeskPlan => ({
        callCode: p.code,
        generatedAt: p.generated_at ? iso(p.generated_at) : null,
        runsPlanned: p.planned,
        runsToRecord: p.to_record,
        runsObserved: p.observed,
        runsLost: p.lost,
        link: { screen: 'plan', params: { code: p.code } },
      })),
    };
  }

  private async admin(): Promise<NonNullable<DeskResponse['admin']>> {
    const [counts]: { accounts: number; unverified: number }[] = await this.dataSource.query(
      `SELECT count(*)::int AS accounts,
              count(*) FILTER (WHERE email_verified_at IS NULL)::int AS unverified
         FROM users`,
    );
    const events: { at: Date; action: string; name: string | null; subject_type: string | null }[] =
      await this.dataSource.query(
        `SELECT e.at, e.action, u.name, e.subject_type FROM audit_events e
           LEFT JOIN users u ON u.id = e.actor_id
          ORDER BY e.at DESC, e.id DESC LIMIT 8`,
      );
    return {
      accounts: counts!.accounts,
      unverified: counts!.unverified,
      recentEvents: events.map((e) => ({
        at: iso(e.at),
        action: e.action,
        actorName: e.name,
        subjectType: e.subject_type,
      })),
      link: { screen: 'accounts', params: {} },
    };
  }

  private callItem(
    c: { code: string; title: string; status: string; deadline_at: Date; time_zone: string },
    link: DeskCall['link'],
  ): DeskCall {
    return {
      code: c.code,
      title: c.title,
      status: c.status,
      deadlineAt: iso(c.deadline_at),
      timeZone: c.time_zone,
      link,
    };
  }
}
