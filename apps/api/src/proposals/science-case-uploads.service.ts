import { HttpStatus, Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { assertAllowed } from '../auth/policy.js';
import type { SessionUser } from '../auth/session-user.js';
import type { Call } from '../calls/entities/call.entity.js';
import { Clock } from '../common/clock.js';
import { AppError, notFound } from '../common/errors/app-error.js';
import { BYTES_PER_MB, ScienceCaseService } from '../documents/science-case.service.js';
import type { ProposalResponse } from './dto/proposal.response.js';
import { Proposal } from './entities/proposal.entity.js';
import { assertDraftOpen, assertVersion, ProposalAccess } from './proposal-access.service.js';
import { teamNames } from './proposal-data.js';
import type { DocumentFinding } from '../documents/document-finding.js';

/** No call may set a limit that makes the server hold more than this in memory per upload. */
export const UPLOAD_CEILING_BYTES = 50 * BYTES_PER_MB;

export interface UploadedFile {
  buffer: Buffer;
  originalname: string;
}

/**
 * The science case of a proposal: upload (judged by the document services, stored with the
 * proposal in one transaction), download, and the anonymity findings kept up to date with the team.
 */
@Injectable()
export class ScienceCaseUploads {
  constructor(
    private readonly access: ProposalAccess,
    private readonly documents: ScienceCaseService,
    private readonly clock: Clock,
  ) {}

  /**
   * The most bytes the user may upload to this proposal, checked before the body is read: a
   * stranger gets 404 and a Co-I without the edit right 403 without sending a file.
   */
  async uploadLimit(user: SessionUser, reference: string): Promise<{ bytes: number; mb: number }> {
    const { data, me } = await this.access.read(user, reference);
    assertAllowed(
      me.canEdit,
      'You can read this proposal but not change it: ask the PI for the edit right',
    );
    const mb = data.proposal.call.scienceCaseMaxMb;
    return { bytes: Math.min(Math.floor(mb * BYTES_PER_MB), UPLOAD_CEILING_BYTES), mb };
  }

  async upload(
    user: SessionUser,
    reference: string,
    version: number,
    file: UploadedFile | undefined,
  ): Promise<ProposalResponse> {
    if (!file)
      throw new AppError(
        HttpStatus.BAD_REQUEST,
        'FILE_MISSING',
        'Attach the science case (field file)',
        [{ path: 'file', message: 'Attach the science case as the form field "file"' }],
      );
    // Checked before the (slow) inspection, and again under the lock by write().
    const { data, me } = await this.access.read(user, reference);
    assertAllowed(
      me.canEdit,
      'You can read this proposal but not change it: ask the PI for the edit right',
    );
    assertVersion(data.proposal, version);
    assertDraftOpen(data.proposal, data.proposal.call, this.clock.now());
    const call = data.proposal.call;
    const names = call.anonymousReview ? teamNames(data.members) : [];
    const inspected = await this.documents.inspect(
      file.buffer,
      file.originalname,
      {
        maxBytes: Math.min(call.scienceCaseMaxMb * BYTES_PER_MB, UPLOAD_CEILING_BYTES),
        maxPages: call.scienceCasePageLimit,
      },
      call.anonymousReview ? { names } : null,
    );
    return this.access.write(user, reference, version, { right: 'edit' }, async (ctx) => {
      const stored = await this.documents.store(ctx.manager, {
        proposalId: ctx.proposal.id,
        bytes: file.buffer,
        inspected,
        uploadedBy: user.id,
      });
      await ctx.manager.update(
        Proposal,
        { id: ctx.proposal.id },
        { scienceCaseFindings: inspected.findings, scienceCaseNamesChecked: names },
      );
      await ctx.audit('proposal.science_case_uploaded', {
        documentId: stored.id,
        filename: inspected.filename,
        pages: inspected.pages,
        sizeBytes: inspected.sizeBytes,
        sha256: inspected.sha256,
        blockers: inspected.findings.filter((f) => f.level === 'blocker').length,
      });
    });
  }

  async download(
    user: SessionUser,
    reference: string,
  ): Promise<{ filename: string; bytes: Buffer }> {
    const { proposalId } = await this.access.membership(user, reference);
    const current = await this.documents.current(proposalId);
    if (!current) throw notFound('Science case');
    return { filename: current.filename, bytes: await this.documents.content(current.id) };
  }

  /**
   * In an anonymous call, makes the science case's findings again when the team's names are no
   * longer those they were made with (someone joined or left), and keeps them. Cheap when
   * nothing changed.
   */
  async refreshFindings(manager: EntityManager, proposal: Proposal, call: Call): Promise<void> {
    if (!call.anonymousReview) return;
    const current = await this.documents.current(proposal.id, manager);
    if (!current) return;
    const rows = (await manager.query(
      `SELECT u.name FROM proposal_members m JOIN users u ON u.id = m.user_id
        WHERE m.proposal_id = $1`,
      [proposal.id],
    )) as { name: string }[];
    const fresh = await this.findingsFor(
      proposal,
      current.id,
      rows.map((r) => r.name),
      manager,
    );
    if (!fresh) return;
    await manager.update(
      Proposal,
      { id: proposal.id },
      { scienceCaseFindings: fresh.findings, scienceCaseNamesChecked: fresh.names },
    );
  }

  /**
   * The findings for `names`, or null when the stored ones were made with these very names.
   * Updates `proposal` in memory; the caller stores them.
   */
  async findingsFor(
    proposal: Proposal,
    scienceCaseId: string,
    names: string[],
    manager?: EntityManager,
  ): Promise<{ findings: DocumentFinding[]; names: string[] } | null> {
    const sorted = [...names].sort();
    const checked = [...proposal.scienceCaseNamesChecked].sort();
    if (sorted.length === checked.length && sorted.every((n, i) => n === checked[i])) return null;
    const bytes = await this.documents.content(scienceCaseId, manager);
    const findings = await this.documents.anonymityFindings(bytes, sorted);
    proposal.scienceCaseFindings = findings;
    proposal.scienceCaseNamesChecked = sorted;
    return { findings, names: sorted };
  }
}
