import { createHash } from 'node:crypto';
import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import { assertAllowed } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { AppError, conflict } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { CompiledPdfService } from '../documents/compiled-pdf.service.js';
import { ScienceCaseService } from '../documents/science-case.service.js';
import { MailService } from '../mail/mail.service.js';
import type { Configuration } from '../observatory/entities/configuration.entity.js';
import type { Observatory } from '../observatory/entities/observatory.entity.js';
import type { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import type { ProposalResponse } from './dto/proposal.response.js';
import { ProposalObservation } from './entities/proposal-observation.entity.js';
import { ProposalVersion } from './entities/proposal-version.entity.js';
import { Proposal } from './entities/proposal.entity.js';
import { calculateObservation } from './observation-calculation.js';
import {
  assertCallTakesSubmissions,
  assertDraftOpen,
  assertVersion,
  ProposalAccess,
} from './proposal-access.service.js';
import { type CheckSummary, proposalChecks } from './proposal-checks.js';
import { type ProposalData, teamNames } from './proposal-data.js';
import { receiptEmail } from './proposal-emails.js';
import { ScienceCaseUploads } from './science-case-uploads.service.js';
import { buildSnapshot } from './snapshot-builder.js';

/** A larger compiled PDF goes out as a link only: one copy per recipient sits in the outbox. */
const MAX_ATTACHMENT_BYTES = 15_000_000;

export const compiledPdfName = (reference: string, versionNumber: number) =>
  `${reference}-v${versionNumber}.pdf`;

/** Checks, submission (a frozen, numbered version with its compiled PDF), reopening, withdrawal. */
@Injectable()
export class SubmissionService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ProposalAccess,
    private readonly scienceCases: ScienceCaseUploads,
    private readonly documents: ScienceCaseService,
    private readonly compiledPdf: CompiledPdfService,
    private readonly mail: MailService,
    private readonly config: AppConfig,
    private readonly clock: Clock,
  ) {}

  async checks(user: SessionUser, reference: string): Promise<CheckSummary> {
    const { data } = await this.access.read(user, reference);
    if (data.proposal.call.anonymousReview && data.scienceCase)
      // Findings made with an older team are made again (and kept) before they are shown.
      await this.dataSource.transaction((manager) =>
        this.scienceCases.refreshFindings(manager, data.proposal, data.proposal.call),
      );
    return proposalChecks(data, this.clock.now());
  }

  /**
   * Submits: only a verified account with the edit right, with no blocker, before the deadline
   * by the server's clock. The slow work (calculations, text, the compiled PDF) is done first
   * from the proposal as the user saw it; then one transaction locks the row, checks that the
   * version is still that one — a second click finds it bumped and gets 409 STALE_VERSION — and
   * freezes the version, marks the proposal submitted and queues the receipts.
   */
  async submit(user: SessionUser, reference: string, version: number): Promise<ProposalResponse> {
    const { data, me } = await this.access.read(user, reference);
    assertAllowed(
      me.canEdit,
      'You can read this proposal but not submit it: ask the PI for the edit right',
    );
    assertAllowed(
      user.emailVerified,
      'Confirm your e-mail address before submitting (see the message we sent you)',
    );
    assertVersion(data.proposal, version);
    const submittedAt = this.clock.now();
    assertDraftOpen(data.proposal, data.proposal.call, submittedAt);

    const recalculated = this.recalculate(data);
    const findings = await this.freshFindings(data);
    const checks = proposalChecks(data, submittedAt);
    if (checks.blockers > 0) {
      const blockers = checks.items.filter((c) => c.level === 'blocker');
      throw new AppError(
        HttpStatus.CONFLICT,
        'HAS_BLOCKERS',
        `${blockers.length} blocker${blockers.length > 1 ? 's stop' : ' stops'} the submission: ${blockers.map((b) => b.message).join(' ')}`,
        blockers.map((b) => ({ path: b.field, message: b.message })),
      );
    }
    const number = (data.proposal.submittedVersion ?? 0) + 1;
    const snapshot = buildSnapshot(data, number, submittedAt);
    const scienceCaseBytes = data.scienceCase
      ? await this.documents.content(data.scienceCase.id)
      : null;
    const pdf = await this.compiledPdf.compile(snapshot, scienceCaseBytes);
    const sha256 = createHash('sha256').update(pdf).digest('hex');

    return this.access.write(user, reference, version, { right: 'edit' }, async (ctx) => {
      const { manager, proposal } = ctx;
      for (const o of recalculated)
        await manager.update(
          ProposalObservation,
          { id: o.id },
          { result: o.result, checks: o.checks },
        );
      if (findings)
        await manager.update(
          Proposal,
          { id: proposal.id },
          { scienceCaseFindings: findings.findings, scienceCaseNamesChecked: findings.names },
        );
      await manager.insert(ProposalVersion, {
        proposalId: proposal.id,
        number,
        submittedAt,
        submittedById: user.id,
        totalHours: snapshot.totalHours,
        snapshot,
        scienceCaseId: data.scienceCase?.id ?? null,
        compiledPdf: pdf,
        compiledPdfSha256: sha256,
      });
      await manager.update(
        Proposal,
        { id: proposal.id },
        { status: 'submitted', submittedVersion: number, submittedAt, withdrawnAt: null },
      );
      await ctx.audit('proposal.submitted', {
        version: number,
        totalHours: snapshot.totalHours,
        compiledPdfSha256: sha256,
      });
      const attach = pdf.length <= MAX_ATTACHMENT_BYTES;
      await this.mail.enqueue(
        data.members
          .filter((m) => m.joined)
          .map((m) =>
            receiptEmail({
              base: this.config.publicUrl,
              proposal,
              callCode: ctx.call.code,
              versionNumber: number,
              submittedAt,
              submittedBy: user.name,
              totalHours: snapshot.totalHours,
              to: { email: m.email, name: m.name ?? m.email },
              pdf: attach
                ? { filename: compiledPdfName(proposal.reference, number), content: pdf }
                : null,
            }),
          ),
        manager,
      );
    });
  }

  /** A submitted (or withdrawn) proposal becomes an editable draft again, before the deadline. */
  async reopen(user: SessionUser, reference: string, version: number): Promise<ProposalResponse> {
    return this.access.write(
      user,
      reference,
      version,
      { right: 'edit', state: 'any' },
      async (ctx) => {
        if (ctx.proposal.status !== 'submitted' && ctx.proposal.status !== 'withdrawn')
          throw conflict(
            'NOT_SUBMITTED',
            `${ctx.proposal.reference} is ${ctx.proposal.status.replace(/_/g, ' ')}; only a submitted or withdrawn proposal can be reopened`,
          );
        assertCallTakesSubmissions(ctx.call, ctx.now);
        const from = ctx.proposal.status;
        await ctx.manager.update(
          Proposal,
          { id: ctx.proposal.id },
          { status: 'draft', withdrawnAt: null },
        );
        await ctx.audit('proposal.reopened', {
          from,
          submittedVersion: ctx.proposal.submittedVersion,
        });
      },
    );
  }

  /** The PI withdraws a draft or a submitted proposal; it is then out of the call. */
  async withdraw(user: SessionUser, reference: string, version: number): Promise<ProposalResponse> {
    return this.access.write(
      user,
      reference,
      version,
      { right: 'pi', state: 'any' },
      async (ctx) => {
        if (ctx.proposal.status !== 'draft' && ctx.proposal.status !== 'submitted')
          throw conflict(
            'CANNOT_WITHDRAW',
            `${ctx.proposal.reference} is ${ctx.proposal.status.replace(/_/g, ' ')} and can no longer be withdrawn`,
          );
        const from = ctx.proposal.status;
        await ctx.manager.update(
          Proposal,
          { id: ctx.proposal.id },
          { status: 'withdrawn', withdrawnAt: ctx.now },
        );
        await ctx.audit('proposal.withdrawn', { from });
      },
    );
  }

  /**
   * The calculator's numbers again, with the observatory as it is now (staff may have changed a
   * band since the observation was saved). Changes `data` in place; returns what changed.
   */
  private recalculate(data: ProposalData): ProposalObservation[] {
    const observatory = data.proposal.call.observatory as Observatory;
    const targets = new Map(data.targets.map((t) => [t.id, t]));
    const changed: ProposalObservation[] = [];
    for (const o of data.observations) {
      const target = targets.get(o.targetId);
      if (!target) continue;
      const { result, checks } = calculateObservation({
        observatory,
        band: o.band as ReceiverBand,
        configuration: o.configuration as Configuration,
        target,
        observation: o,
      });
      if (JSON.stringify(result) !== JSON.stringify(o.result)) {
        o.result = result;
        o.checks = checks;
        changed.push(o);
      }
    }
    return changed;
  }

  /** Anonymity findings for the team as it is now, when those stored were made for another. */
  private async freshFindings(data: ProposalData) {
    const { proposal, scienceCase } = data;
    if (!proposal.call.anonymousReview || !scienceCase) return null;
    return this.scienceCases.findingsFor(proposal, scienceCase.id, teamNames(data.members));
  }
}
