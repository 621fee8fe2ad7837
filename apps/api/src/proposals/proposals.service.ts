import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import { CallsService } from '../calls/calls.service.js';
import type { Call } from '../calls/entities/call.entity.js';
import { Clock } from '../common/clock.js';
import { conflict, validationFailed } from '../common/errors/app-error.js';
import type { CreateProposalDto } from './dto/create-proposal.dto.js';
import type { ListProposalsQuery } from './dto/list-proposals.query.js';
import {
  ProposalListItemResponse,
  type ProposalPageResponse,
} from './dto/proposal-list.response.js';
import { ProposalResponse } from './dto/proposal.response.js';
import type { UpdateProposalDto } from './dto/update-proposal.dto.js';
import type { ProposalKind } from '../calls/call-lifecycle.js';
import { ProposalMember } from './entities/proposal-member.entity.js';
import { Proposal } from './entities/proposal.entity.js';
import { assertCallTakesSubmissions, ProposalAccess } from './proposal-access.service.js';
import { ProposalLoader } from './proposal-loader.js';
import { KIND_LABELS } from './proposal-options.js';

/** Creating proposals, the proposer's list, and the overview fields. */
@Injectable()
export class ProposalsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly calls: CallsService,
    private readonly access: ProposalAccess,
    private readonly loader: ProposalLoader,
    private readonly audit: AuditService,
    private readonly clock: Clock,
  ) {}

  /** A new draft in an open call; the creator is its PI. The number is the call's next one. */
  async create(user: SessionUser, code: string, dto: CreateProposalDto): Promise<ProposalResponse> {
    const call = await this.calls.getVisible(user, code);
    const now = this.clock.now();
    assertCallTakesSubmissions(call, now);
    assertKindAccepted(call, dto.kind);
    const { data, memberId } = await this.dataSource.transaction(async (manager) => {
      // The counter's row lock makes concurrent creations wait for each other's number.
      const numbered = (await manager.query(
        `INSERT INTO proposal_counters AS c (call_id, last_number) VALUES ($1, 1)
         ON CONFLICT (call_id) DO UPDATE SET last_number = c.last_number + 1
          WHERE c.last_number < 9999
         RETURNING last_number`,
        [call.id],
      )) as { last_number: number }[];
      const number = numbered[0]?.last_number;
      if (number === undefined)
        throw conflict('CALL_FULL', `Call ${call.code} has reached 9999 proposals`);
      const proposal = await manager.save(
        manager.create(Proposal, {
          callId: call.id,
          number,
          reference: `${call.code}-${String(number).padStart(4, '0')}`,
          title: dto.title,
          abstract: '',
          scienceCategory: dto.scienceCategory ?? null,
          kind: dto.kind,
          status: 'draft',
          version: 1,
          createdById: user.id,
          createdAt: now,
          updatedAt: now,
        }),
      );
      const member = await manager.save(
        manager.create(ProposalMember, {
          proposalId: proposal.id,
          userId: user.id,
          email: user.email.toLowerCase(),
          role: 'pi',
          canEdit: true,
          invitedById: user.id,
          invitedAt: now,
          joinedAt: now,
        }),
      );
      await this.audit.record(
        {
          actorId: user.id,
          action: 'proposal.created',
          subjectType: 'proposal',
          subjectId: proposal.id,
          details: { reference: proposal.reference, call: call.code, kind: dto.kind },
        },
        manager,
      );
      return { data: await this.loader.load(proposal.id, manager), memberId: member.id };
    });
    const me = data.members.find((m) => m.id === memberId);
    if (!me) throw new Error('the new PI is missing from the team');
    return ProposalResponse.from(data, me, now);
  }

  /** The user's proposals across calls, most recently changed first. */
  async list(user: SessionUser, query: ListProposalsQuery): Promise<ProposalPageResponse> {
    await this.access.attachPendingInvitations(user);
    const [{ total }] = (await this.dataSource.query(
      `SELECT count(*)::int AS total FROM proposal_members WHERE user_id = $1`,
      [user.id],
    )) as [{ total: number }];
    const rows = (await this.dataSource.query(
      `SELECT p.id, m.role FROM proposals p
         JOIN proposal_members m ON m.proposal_id = p.id AND m.user_id = $1
        ORDER BY p.updated_at DESC, p.reference
        LIMIT $2 OFFSET $3`,
      [user.id, query.pageSize, (query.page - 1) * query.pageSize],
    )) as { id: string; role: 'pi' | 'coi' }[];
    const data = await this.loader.loadMany(rows.map((r) => r.id));
    const roles = new Map(rows.map((r) => [r.id, r.role]));
    const now = this.clock.now();
    return {
      items: data.map((d) =>
        ProposalListItemResponse.from(d, roles.get(d.proposal.id) ?? 'coi', now),
      ),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  async get(user: SessionUser, reference: string): Promise<ProposalResponse> {
    const { data, me } = await this.access.read(user, reference);
    return ProposalResponse.from(data, me, this.clock.now());
  }

  async update(
    user: SessionUser,
    reference: string,
    dto: UpdateProposalDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'edit' }, async (ctx) => {
      const changes: Partial<Proposal> = {};
      if (dto.title !== undefined) changes.title = dto.title;
      if (dto.abstract !== undefined) changes.abstract = dto.abstract;
      if (dto.scienceCategory !== undefined) changes.scienceCategory = dto.scienceCategory;
      if (dto.kind !== undefined) {
        assertKindAccepted(ctx.call, dto.kind);
        changes.kind = dto.kind;
      }
      if (dto.continues !== undefined) {
        changes.continuesId =
          dto.continues === null
            ? null
            : await this.continued(ctx.user, ctx.proposal, dto.continues);
      }
      const fields = Object.keys(changes);
      if (fields.length === 0) return;
      await ctx.manager.update(Proposal, { id: ctx.proposal.id }, changes);
      await ctx.audit('proposal.updated', { fields });
    });
  }

  /**
   * The proposal a draft continues: an earlier one the user is on. Any other reference is
   * refused with the same words, so this does not tell whether someone else's exists.
   */
  private async continued(user: SessionUser, self: Proposal, reference: string): Promise<string> {
    const refused = validationFailed([
      { path: 'continues', message: `continues names no other proposal of yours (${reference})` },
    ]);
    if (reference === self.reference) throw refused;
    const rows = (await this.dataSource.query(
      `SELECT p.id FROM proposals p JOIN proposal_members m ON m.proposal_id = p.id
        WHERE p.reference = $1 AND m.user_id = $2`,
      [reference, user.id],
    )) as { id: string }[];
    if (!rows[0]) throw refused;
    return rows[0].id;
  }
}

function assertKindAccepted(call: Call, kind: ProposalKind): void {
  if (!call.proposalKinds.includes(kind))
    throw validationFailed([
      {
        path: 'kind',
        message: `Call ${call.code} does not accept ${KIND_LABELS[kind].toLowerCase()} proposals; it accepts ${call.proposalKinds.map((k) => KIND_LABELS[k].toLowerCase()).join(', ')}`,
      },
    ]);
}
