import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { assertAllowed } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { isAcceptingSubmissions } from '../calls/calls.service.js';
import { Call } from '../calls/entities/call.entity.js';
import { Clock } from '../common/clock.js';
import { conflict, notFound } from '../common/errors/app-error.js';
import { ProposalResponse } from './dto/proposal.response.js';
import { ProposalMember } from './entities/proposal-member.entity.js';
import { Proposal } from './entities/proposal.entity.js';
import { deadlinePassedMessage } from './proposal-checks.js';
import type { ProposalData, TeamMemberData } from './proposal-data.js';
import { ProposalLoader } from './proposal-loader.js';

const REFERENCE = /^[A-Z][A-Z0-9-]{1,15}-[0-9]{4}$/;

/** Who may do a write: any member, a member with the edit right, or the PI. */
export type WriteRight = 'member' | 'edit' | 'pi';

export interface WriteOptions {
  right: WriteRight;
  /**
   * 'draft-open' (the default): only a draft, and only while its call takes submissions — what
   * every change to the content needs. 'any': the change checks the state itself.
   */
  state?: 'draft-open' | 'any';
}

/** What a write's change sees: the locked proposal (no relations), its call, the member, now. */
export interface WriteContext {
  manager: EntityManager;
  proposal: Proposal;
  call: Call;
  member: ProposalMember;
  user: SessionUser;
  now: Date;
  audit(action: string, details?: Record<string, unknown>): Promise<void>;
}

export interface ReadResult {
  data: ProposalData;
  me: TeamMemberData;
}

/**
 * Rights and concurrency for every proposal route. A proposal the user is not on answers 404
 * exactly like one that does not exist; a member without the right for a write gets 403. Every
 * write locks the proposal's row, checks the version the user saw, and bumps it.
 */
@Injectable()
export class ProposalAccess {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly loader: ProposalLoader,
    private readonly clock: Clock,
    private readonly audit: AuditService,
  ) {}

  /**
   * The user's membership of the proposal, or 404. A pending invitation to the user's verified
   * address counts, and is turned into the membership of the account here (the first time the
   * invitee comes by).
   */
  async membership(
    user: SessionUser,
    reference: string,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<{ proposalId: string; memberId: string }> {
    const ref = reference.trim().toUpperCase();
    if (!REFERENCE.test(ref)) throw notFound('Proposal');
    const rows = (await manager.query(
      `SELECT p.id AS proposal_id, m.id AS member_id, m.user_id
         FROM proposals p JOIN proposal_members m ON m.proposal_id = p.id
        WHERE p.reference = $1
          AND (m.user_id = $2 OR (m.user_id IS NULL AND m.email = $3 AND $4::boolean))
        ORDER BY m.user_id NULLS LAST LIMIT 1`,
      [ref, user.id, user.email.toLowerCase(), user.emailVerified],
    )) as { proposal_id: string; member_id: string; user_id: string | null }[];
    const row = rows[0];
    if (!row) throw notFound('Proposal');
    if (row.user_id === null) await this.join(user, row.member_id, manager);
    return { proposalId: row.proposal_id, memberId: row.member_id };
  }

  /**
   * Turns every pending invitation to the user's address into membership, if the address is
   * verified. The accounts feature may call this when an address is confirmed; the proposals
   * routes call it too, so an invitation attaches however the invitee arrives.
   */
  async attachPendingInvitations(
    user: Pick<SessionUser, 'id' | 'email' | 'emailVerified'>,
    manager: EntityManager = this.dataSource.manager,
  ): Promise<string[]> {
    if (!user.emailVerified) return [];
    const rows = (await manager.query(
      `UPDATE proposal_members m SET user_id = $1, joined_at = $3
        WHERE m.user_id IS NULL AND m.email = $2
          AND NOT EXISTS (SELECT 1 FROM proposal_members o
                           WHERE o.proposal_id = m.proposal_id AND o.user_id = $1)
        RETURNING m.proposal_id`,
      [user.id, user.email.toLowerCase(), this.clock.now()],
    )) as [{ proposal_id: string }[], number];
    const proposalIds = rows[0].map((r) => r.proposal_id);
    for (const proposalId of proposalIds)
      await this.audit.record(
        {
          actorId: user.id,
          action: 'proposal.member_joined',
          subjectType: 'proposal',
          subjectId: proposalId,
          details: { email: user.email },
        },
        manager,
      );
    return proposalIds;
  }

  private async join(user: SessionUser, memberId: string, manager: EntityManager): Promise<void> {
    const [rows] = (await manager.query(
      `UPDATE proposal_members SET user_id = $1, joined_at = $3
        WHERE id = $2 AND user_id IS NULL RETURNING proposal_id`,
      [user.id, memberId, this.clock.now()],
    )) as [{ proposal_id: string }[], number];
    if (rows[0])
      await this.audit.record(
        {
          actorId: user.id,
          action: 'proposal.member_joined',
          subjectType: 'proposal',
          subjectId: rows[0].proposal_id,
          details: { email: user.email },
        },
        manager,
      );
  }

  /** The proposal with everything, as the user may see it. */
  async read(user: SessionUser, reference: string): Promise<ReadResult> {
    const { proposalId, memberId } = await this.membership(user, reference);
    const data = await this.loader.load(proposalId);
    return { data, me: memberOf(data, memberId) };
  }

  /**
   * One write: in a transaction, the row locked, the right and the version checked, the change
   * made, the version bumped; answers the updated proposal. `version` null is for a route whose
   * request carries none (never a change of content).
   */
  async write(
    user: SessionUser,
    reference: string,
    version: number | null,
    options: WriteOptions,
    change: (ctx: WriteContext) => Promise<void>,
  ): Promise<ProposalResponse> {
    const answer = await this.writeMaybeLeaving(user, reference, version, options, change);
    if (!answer) throw new Error('the write removed its own author from the team');
    return answer;
  }

  /** As write(), for the one change that may end the caller's membership: then null. */
  async writeMaybeLeaving(
    user: SessionUser,
    reference: string,
    version: number | null,
    options: WriteOptions,
    change: (ctx: WriteContext) => Promise<void>,
  ): Promise<ProposalResponse | null> {
    const { data, me } = await this.dataSource.transaction(async (manager) => {
      const { proposalId, memberId } = await this.membership(user, reference, manager);
      const proposal = await manager.findOne(Proposal, {
        where: { id: proposalId },
        lock: { mode: 'pessimistic_write' },
      });
      // Gone (or the member removed) between the look-up and the lock: as if never there.
      const member = await manager.findOneBy(ProposalMember, { id: memberId, proposalId });
      if (!proposal || !member) throw notFound('Proposal');
      assertRight(member, options.right);
      if (version !== null) assertVersion(proposal, version);
      const call = await manager.findOneOrFail(Call, {
        where: { id: proposal.callId },
        relations: { observatory: true },
      });
      const now = this.clock.now();
      if ((options.state ?? 'draft-open') === 'draft-open') assertDraftOpen(proposal, call, now);
      await change({
        manager,
        proposal,
        call,
        member,
        user,
        now,
        audit: (action, details = {}) =>
          this.audit.record(
            {
              actorId: user.id,
              action,
              subjectType: 'proposal',
              subjectId: proposal.id,
              details: { reference: proposal.reference, ...details },
            },
            manager,
          ),
      });
      await manager.query(
        `UPDATE proposals SET version = version + 1, updated_at = $2 WHERE id = $1`,
        [proposal.id, now],
      );
      const loaded = await this.loader.load(proposal.id, manager);
      // A member who left the team in this write reads it no more.
      const stillMember = loaded.members.find((m) => m.id === memberId);
      return { data: loaded, me: stillMember ?? null };
    });
    return me ? ProposalResponse.from(data, me, this.clock.now()) : null;
  }
}

export function memberOf(data: ProposalData, memberId: string): TeamMemberData {
  const me = data.members.find((m) => m.id === memberId);
  if (!me) throw notFound('Proposal');
  return me;
}

function assertRight(member: ProposalMember, right: WriteRight): void {
  if (right === 'pi')
    assertAllowed(member.role === 'pi', 'Only the PI of the proposal may do this');
  if (right === 'edit')
    assertAllowed(
      member.canEdit,
      'You can read this proposal but not change it: ask the PI for the edit right',
    );
}

export function assertVersion(proposal: Pick<Proposal, 'version' | 'reference'>, seen: number) {
  if (proposal.version !== seen)
    throw conflict(
      'STALE_VERSION',
      `${proposal.reference} has changed since you loaded it (you had version ${seen}, it is now at version ${proposal.version}); reload it and make your change again`,
    );
}

/** Content changes only in a draft, and only while the call takes submissions. */
export function assertDraftOpen(proposal: Proposal, call: Call, now: Date): void {
  if (proposal.status === 'submitted')
    throw conflict(
      'PROPOSAL_SUBMITTED',
      `${proposal.reference} is submitted and read-only; reopen it to change it`,
    );
  if (proposal.status !== 'draft')
    throw conflict(
      'PROPOSAL_READ_ONLY',
      `${proposal.reference} is ${proposal.status.replace(/_/g, ' ')} and can no longer change`,
    );
  assertCallTakesSubmissions(call, now);
}

export function assertCallTakesSubmissions(call: Call, now: Date): void {
  if (isAcceptingSubmissions(call, now)) return;
  if (now.getTime() >= call.deadlineAt.getTime())
    throw conflict('DEADLINE_PASSED', deadlinePassedMessage(call));
  throw conflict('CALL_NOT_OPEN', `Call ${call.code} does not take submissions now`);
}
