import { Controller, Get, Param, ParseIntPipe, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { validationFailed } from '../common/errors/app-error.js';
import { pdfDownload } from './pdf-download.js';
import type { ProposalSnapshot } from './proposal-snapshot.js';
import {
  CompareVersionsQuery,
  VersionComparisonResponse,
  VersionSummaryResponse,
} from './dto/version.response.js';
import { VersionsService } from './versions.service.js';

/** The submitted versions of a proposal and the compiled PDF of the latest. */
@ApiTags('proposals')
@Controller('proposals/:reference')
export class VersionsController {
  constructor(private readonly versions: VersionsService) {}

  @SignedIn()
  @Get('pdf')
  @ApiProduces('application/pdf')
  async pdf(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return pdfDownload(res, await this.versions.latestPdf(user, reference));
  }

  @SignedIn()
  @Get('versions')
  @ApiOkResponse({ type: [VersionSummaryResponse] })
  list(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<VersionSummaryResponse[]> {
    return this.versions.list(user, reference);
  }

  @SignedIn()
  @Get('versions/compare')
  @ApiOkResponse({ type: VersionComparisonResponse })
  compare(
    @Param('reference') reference: string,
    @Query() query: CompareVersionsQuery,
    @CurrentUser() user: SessionUser,
  ): Promise<VersionComparisonResponse> {
    return this.versions.compare(user, reference, query.from, query.to);
  }

  @SignedIn()
  @Get('versions/:n')
  @ApiOkResponse({ description: 'The ProposalSnapshot of that version' })
  snapshot(
    @Param('reference') reference: string,
    @Param(
      'n',
      new ParseIntPipe({
        exceptionFactory: () =>
          validationFailed([{ path: 'n', message: 'n must be a version number (1, 2, …)' }]),
      }),
    )
    n: number,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalSnapshot> {
    return this.versions.snapshot(user, reference, n);
  }
}
