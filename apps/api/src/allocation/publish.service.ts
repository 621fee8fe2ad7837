import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { assertChairOf, assertInDeliberation, UndecidedProposals } from './allocation-access.js';
import { type OutcomeFacts, outcomeEmail } from './outcome-email.js';
import type { PublishResponse, Standing, StandingRow } from './standing-contract.js';
import { IN_STANDING_SQL, StandingService } from './standing.service.js';

interface MemberRow {
  reference: string;
  email: string;
  name: string | null;
  role: 'pi' | 'coi';
}

/**
 * Publishing a call's outcome: one transaction moves the call to published, every proposal of its
 * standing to allocated or not allocated, and queues one outcome e-mail per person per proposal.
 * A fixed number of statements whatever the call's size.
 */
@Injectable()
export class PublishService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly standing: StandingService,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly clock: Clock,
    private readonly config: AppConfig,
  ) {}

  async publish(user: SessionUser, code: string, confirm: boolean): Promise<PublishResponse> {
    return this.dataSource.transaction(async (manager) => {
      const call = await this.standing.visibleCall(user, code, manager, true);
      assertChairOf(user, call);
      assertInDeliberation(call, 'the outcome');
      const standing = await this.standing.build(call, manager);
      const undecided = standing.undecided;
      if (undecided.length && !confirm) throw new UndecidedProposals(undecided);

      const now = this.clock.now();
      await manager.query(
        `INSERT INTO proposal_grants (proposal_id, tier, decided_by, updated_at)
         SELECT p.id, 'not_allocated', $3, $4 FROM proposals p
          WHERE p.call_id = $1 AND p.reference = ANY($2::text[])
         ON CONFLICT (proposal_id) DO NOTHING`,
        [call.id, undecided, user.id, now],
      );
      await manager.query(
        `UPDATE proposals p
            SET status = CASE WHEN g.tier = 'not_allocated' THEN 'not_allocated' ELSE 'allocated' END,
                updated_at = $2
           FROM proposal_grants g
          WHERE g.proposal_id = p.id AND p.call_id = $1 AND ${IN_STANDING_SQL}`,
        [call.id, now],
      );
      await manager.query(
        `UPDATE calls SET status = 'published', published_at = $2, status_changed_at = $2,
                          updated_at = $2
          WHERE id = $1`,
        [call.id, now],
      );

      const members = (await manager.query(
        `SELECT p.reference, lower(COALESCE(u.email, m.email)) AS email, u.name, m.role
           FROM proposal_members m
           JOIN proposals p ON p.id = m.proposal_id
           LEFT JOIN users u ON u.id = m.user_id
          WHERE p.call_id = $1 AND ${IN_STANDING_SQL}
          ORDER BY p.reference, m.role DESC, m.invited_at`,
        [call.id],
      )) as MemberRow[];
      const emails = outcomeEmails(standing, members, this.config.publicUrl);
      await this.mail.enqueue(emails, manager);

      const outcomes = Object.fromEntries(
        standing.rows.map((r) => [r.reference, r.tier ?? 'not_allocated']),
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'call.status_changed',
          subjectType: 'call',
          subjectId: call.id,
          details: { code: call.code, from: call.status, to: 'published' },
        },
        manager,
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'allocation.published',
          subjectType: 'call',
          subjectId: call.id,
          details: {
            code: call.code,
            outcomes,
            undecidedAsNotAllocated: undecided,
            emailsQueued: emails.length,
          },
        },
        manager,
      );
      return {
        code: call.code,
        status: 'published',
        publishedAt: now.toISOString(),
        emailsQueued: emails.length,
        undecidedAsNotAllocated: undecided,
      };
    });
  }
}

/** What the team is told about one row (undecided rows are published as not allocated). */
export function outcomeOf(
  standing: Pick<Standing, 'call' | 'configurations'>,
  row: StandingRow,
): OutcomeFacts {
  const nameOf = new Map(standing.configurations.map((c) => [c.id, c.name]));
  const tier = row.tier ?? 'not_allocated';
  const observations = row.observations.map((o) => ({
    targetName: o.targetName,
    configurationName: nameOf.get(o.configurationId) ?? '',
    bandName: o.bandName,
    hoursAsked: o.hoursAsked,
    hoursGranted: tier === 'not_allocated' ? 0 : (o.hoursGranted ?? 0),
  }));
  return {
    reference: row.reference,
    title: row.title,
    callCode: standing.call.code,
    tier,
    hoursAsked: row.hoursAsked,
    hoursGranted: observations.reduce((sum, o) => sum + o.hoursGranted, 0),
    observations,
    comments: commentsToPi(row.reviews.map((r) => r.commentToPi)),
  };
}

/** The comments to the PI that say something, sorted so their order tells nothing of who wrote them. */
export const commentsToPi = (comments: string[]): string[] =>
  comments
    .map((c) => c.trim())
    .filter((c) => c !== '')
    .sort((a, b) => a.localeCompare(b));

/**
 * One e-mail per address per proposal: a person on a team twice (a pending invitation to the
 * address of the PI's account) hears once; a person on two proposals hears about each.
 */
export function outcomeEmails(standing: Standing, members: MemberRow[], base: string) {
  const rowOf = new Map(standing.rows.map((r) => [r.reference, r]));
  return groupMembers(members).flatMap(([reference, people]) => {
    const row = rowOf.get(reference);
    if (!row) return [];
    const outcome = outcomeOf(standing, row);
    return people.map((p) => outcomeEmail({ base, to: p, outcome }));
  });
}

type Person = { email: string; name: string | null };

function groupMembers(members: MemberRow[]): [string, Person[]][] {
  const byProposal = new Map<string, Map<string, Person>>();
  for (const m of members) {
    const people = byProposal.get(m.reference) ?? new Map<string, Person>();
    byProposal.set(m.reference, people);
    const known = people.get(m.email);
    if (!known) people.set(m.email, { email: m.email, name: m.name });
    else if (!known.name && m.name) known.name = m.name;
  }
  return [...byProposal].map(([id, people]) => [id, [...people.values()]]);
}
