import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource } from 'typeorm';
import type { SessionUser } from '../auth/session-user.js';
import { notFound } from '../common/errors/app-error.js';
import type { VersionSummaryResponse } from './dto/version.response.js';
import { ProposalVersion } from './entities/proposal-version.entity.js';
import { ProposalAccess } from './proposal-access.service.js';
import type { ProposalSnapshot } from './proposal-snapshot.js';
import { compiledPdfName } from './submission.service.js';
import { compareSnapshots, type VersionChange } from './version-compare.js';

/** The submitted versions of a proposal, for its team. */
@Injectable()
export class VersionsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly access: ProposalAccess,
  ) {}

  async list(user: SessionUser, reference: string): Promise<VersionSummaryResponse[]> {
    const { proposalId } = await this.access.membership(user, reference);
    const rows = (await this.dataSource.query(
      `SELECT v.number, v.submitted_at, u.name AS submitted_by, v.total_hours
         FROM proposal_versions v LEFT JOIN users u ON u.id = v.submitted_by
        WHERE v.proposal_id = $1 ORDER BY v.number`,
      [proposalId],
    )) as {
      number: number;
      submitted_at: Date;
      submitted_by: string | null;
      total_hours: number;
    }[];
    return rows.map((r) => ({
      number: r.number,
      submittedAt: r.submitted_at.toISOString(),
      submittedBy: r.submitted_by,
      totalHours: r.total_hours,
    }));
  }

  async snapshot(user: SessionUser, reference: string, n: number): Promise<ProposalSnapshot> {
    const { proposalId } = await this.access.membership(user, reference);
    return this.snapshotOf(proposalId, n);
  }

  async compare(
    user: SessionUser,
    reference: string,
    from: number,
    to: number,
  ): Promise<{ changes: VersionChange[] }> {
    const { proposalId } = await this.access.membership(user, reference);
    const rows = await this.dataSource.getRepository(ProposalVersion).find({
      where: [
        { proposalId, number: from },
        { proposalId, number: to },
      ],
    });
    const a = rows.find((r) => r.number === from);
    const b = rows.find((r) => r.number === to);
    if (!a) throw notFound(`Version ${from}`);
    if (!b) throw notFound(`Version ${to}`);
    return { changes: compareSnapshots(a.snapshot, b.snapshot) };
  }

  /** The compiled PDF of the latest submitted version. */
  async latestPdf(
    user: SessionUser,
    reference: string,
  ): Promise<{ filename: string; bytes: Buffer }> {
    const { proposalId } = await this.access.membership(user, reference);
    const row = await this.dataSource
      .getRepository(ProposalVersion)
      .createQueryBuilder('v')
      .addSelect('v.compiledPdf')
      .innerJoinAndSelect('v.proposal', 'p')
      .where('v.proposal_id = :proposalId AND v.number = p.submitted_version', { proposalId })
      .getOne();
    if (!row?.compiledPdf || !row.proposal)
      throw notFound('Compiled PDF (the proposal has not been submitted yet)');
    return {
      filename: compiledPdfName(row.proposal.reference, row.number),
      bytes: row.compiledPdf,
    };
  }

  private async snapshotOf(proposalId: string, n: number): Promise<ProposalSnapshot> {
    const row = await this.dataSource
      .getRepository(ProposalVersion)
      .findOne({ where: { proposalId, number: n }, select: { id: true, snapshot: true } });
    if (!row) throw notFound(`Version ${n}`);
    return row.snapshot;
  }
}
