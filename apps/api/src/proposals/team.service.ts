import { Injectable } from '@nestjs/common';
import { isUUID } from 'class-validator';
import type { EntityManager } from 'typeorm';
import { assertAllowed } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { conflict, notFound } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { MailService } from '../mail/mail.service.js';
import { User } from '../users/entities/user.entity.js';
import type { InviteMemberDto, UpdateMemberDto } from './dto/team.dto.js';
import type { ProposalResponse } from './dto/proposal.response.js';
import { ProposalMember } from './entities/proposal-member.entity.js';
import { ProposalAccess, type WriteContext } from './proposal-access.service.js';
import { invitationEmail, newPiEmail } from './proposal-emails.js';
import { ScienceCaseUploads } from './science-case-uploads.service.js';

/** More would be a collaboration's member list, not a proposal team. */
const MAX_TEAM = 100;

/** The team: the PI invites Co-Is, grants or takes the edit right, and hands the PI role on. */
@Injectable()
export class TeamService {
  constructor(
    private readonly access: ProposalAccess,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly scienceCases: ScienceCaseUploads,
  ) {}

  async invite(
    user: SessionUser,
    reference: string,
    dto: InviteMemberDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'pi' }, async (ctx) => {
      const { manager, proposal, now } = ctx;
      const email = dto.email;
      const [{ taken, size }] = (await manager.query(
        `SELECT bool_or(m.email = $2 OR u.email = $2) AS taken, count(*)::int AS size
           FROM proposal_members m LEFT JOIN users u ON u.id = m.user_id
          WHERE m.proposal_id = $1`,
        [proposal.id, email],
      )) as [{ taken: boolean | null; size: number }];
      if (taken) throw conflict('ALREADY_ON_TEAM', `${email} is already on the team`);
      if (size >= MAX_TEAM)
        throw conflict('TEAM_FULL', `A proposal team has at most ${MAX_TEAM} members`);
      const account = await manager.findOneBy(User, { email });
      const verified = account !== null && account.active && account.emailVerifiedAt !== null;
      await manager.insert(ProposalMember, {
        proposalId: proposal.id,
        userId: verified ? account.id : null,
        email,
        role: 'coi',
        canEdit: dto.canEdit,
        invitedById: user.id,
        invitedAt: now,
        joinedAt: verified ? now : null,
      });
      await ctx.audit('proposal.member_invited', {
        email,
        canEdit: dto.canEdit,
        joined: verified,
      });
      await this.mail.enqueue(
        invitationEmail({
          base: this.config.publicUrl,
          proposal,
          callCode: ctx.call.code,
          email,
          inviter: user.name,
          canEdit: dto.canEdit,
          account:
            account && account.active
              ? { name: account.name, verified: account.emailVerifiedAt !== null }
              : null,
        }),
        manager,
      );
      if (verified) await this.scienceCases.refreshFindings(manager, proposal, ctx.call);
    });
  }

  async update(
    user: SessionUser,
    reference: string,
    memberId: string,
    dto: UpdateMemberDto,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, dto.version, { right: 'pi' }, async (ctx) => {
      const member = await this.findMember(ctx.manager, ctx.proposal.id, memberId);
      if (member.role === 'pi')
        throw conflict('PI_ALWAYS_EDITS', 'The PI always has the right to edit');
      if (member.canEdit === dto.canEdit) return;
      await ctx.manager.update(ProposalMember, { id: member.id }, { canEdit: dto.canEdit });
      await ctx.audit('proposal.member_updated', { email: member.email, canEdit: dto.canEdit });
    });
  }

  /**
   * The PI takes a Co-I (or a pending invitation) off the team; a Co-I may leave on their own.
   * Null when the caller has left: they can no longer read the proposal.
   */
  async remove(
    user: SessionUser,
    reference: string,
    memberId: string,
    version: number,
  ): Promise<ProposalResponse | null> {
    return this.access.writeMaybeLeaving(
      user,
      reference,
      version,
      { right: 'member' },
      async (ctx) => {
        const member = await this.findMember(ctx.manager, ctx.proposal.id, memberId);
        const leaving = member.id === ctx.member.id;
        assertAllowed(
          leaving || ctx.member.role === 'pi',
          'Only the PI may remove others from the team',
        );
        if (member.role === 'pi')
          throw conflict(
            'PI_CANNOT_LEAVE',
            'The PI cannot leave the team: hand the PI role to a Co-I first',
          );
        await ctx.manager.delete(ProposalMember, { id: member.id });
        await ctx.audit(leaving ? 'proposal.member_left' : 'proposal.member_removed', {
          email: member.email,
        });
        if (member.userId)
          await this.scienceCases.refreshFindings(ctx.manager, ctx.proposal, ctx.call);
      },
    );
  }

  /** The PI hands the role to a Co-I who has joined; the old PI stays as a Co-I who can edit. */
  async makePi(
    user: SessionUser,
    reference: string,
    memberId: string,
    version: number,
  ): Promise<ProposalResponse> {
    return this.access.write(user, reference, version, { right: 'pi' }, async (ctx) => {
      const member = await this.findMember(ctx.manager, ctx.proposal.id, memberId);
      if (member.id === ctx.member.id) throw conflict('ALREADY_PI', 'You are the PI already');
      if (!member.userId)
        throw conflict(
          'MEMBER_NOT_JOINED',
          `${member.email} has not joined yet; only a Co-I with an account can become PI`,
        );
      // Demote first: the database allows one PI per proposal at every moment.
      await ctx.manager.update(
        ProposalMember,
        { id: ctx.member.id },
        { role: 'coi', canEdit: true },
      );
      await ctx.manager.update(ProposalMember, { id: member.id }, { role: 'pi', canEdit: true });
      await ctx.audit('proposal.pi_handed_over', { from: ctx.user.email, to: member.email });
      const newPi = await ctx.manager.findOneByOrFail(User, { id: member.userId });
      await this.mail.enqueue(
        newPiEmail({
          base: this.config.publicUrl,
          proposal: ctx.proposal,
          to: { email: newPi.email, name: newPi.name },
          from: ctx.user.name,
        }),
        ctx.manager,
      );
    });
  }

  private async findMember(
    manager: WriteContext['manager'] & EntityManager,
    proposalId: string,
    memberId: string,
  ): Promise<ProposalMember> {
    const member = isUUID(memberId)
      ? await manager.findOneBy(ProposalMember, { id: memberId, proposalId })
      : null;
    if (!member) throw notFound('Team member');
    return member;
  }
}
