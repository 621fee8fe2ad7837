import { Injectable } from '@nestjs/common';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { pdfFonts } from '../documents/pdf-fonts.js';
import { drawCommitteeReport } from './committee-report.js';
import { StandingService } from './standing.service.js';

/** The committee report PDF of a call, for its chair and staff (as the standing). */
@Injectable()
export class CommitteeReportService {
  constructor(
    private readonly standing: StandingService,
    private readonly clock: Clock,
  ) {}

  async forUser(user: SessionUser, code: string): Promise<{ filename: string; bytes: Buffer }> {
    const standing = await this.standing.forUser(user, code);
    const bytes = await drawCommitteeReport(standing, pdfFonts(), { now: this.clock.now() });
    return { filename: `${standing.call.code}-committee-report.pdf`, bytes };
  }
}
