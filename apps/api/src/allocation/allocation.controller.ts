import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  Post,
  Put,
  Query,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { contentDisposition } from '../documents/content-disposition.js';
import { pdfDownload } from '../proposals/pdf-download.js';
import { CommitteeReportService } from './committee-report.service.js';
import { GrantDto } from './dto/grant.dto.js';
import { PublishDto } from './dto/publish.dto.js';
import { StandingQuery } from './dto/standing.query.js';
import { GrantsService } from './grants.service.js';
import { OutcomeService } from './outcome.service.js';
import { PublishService } from './publish.service.js';
import type {
  GrantResponse,
  ProposalOutcome,
  PublishResponse,
  Standing,
} from './standing-contract.js';
import { standingCsv } from './standing-csv.js';
import { StandingService } from './standing.service.js';

/**
 * The chair's standing, grants and publication of a call, and a proposal's outcome. Global roles
 * let in chairs and staff; the services then narrow to the call's own chair (404 for another's).
 */
@ApiTags('allocation')
@Controller()
export class AllocationController {
  constructor(
    private readonly standing: StandingService,
    private readonly grants: GrantsService,
    private readonly publisher: PublishService,
    private readonly outcomes: OutcomeService,
    private readonly report: CommitteeReportService,
  ) {}

  @Roles('chair', 'staff')
  @Get('calls/:code/standing')
  @ApiOkResponse({ description: 'The standing (standing-contract.ts), or CSV with ?format=csv' })
  @ApiProduces('application/json', 'text/csv')
  async getStanding(
    @Param('code') code: string,
    @Query() query: StandingQuery,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<Standing | string> {
    const standing = await this.standing.forUser(user, code);
    if (query.format !== 'csv') return standing;
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', contentDisposition(`${standing.call.code}-standing.csv`));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, no-store');
    return standingCsv(standing);
  }

  @Roles('chair', 'staff')
  @Get('calls/:code/report.pdf')
  @ApiProduces('application/pdf')
  async getReport(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return pdfDownload(res, await this.report.forUser(user, code));
  }

  @Roles('chair')
  @Post('calls/:code/publish')
  @HttpCode(200)
  @ApiOkResponse({ description: 'PublishResponse (standing-contract.ts)' })
  async publish(
    @Param('code') code: string,
    @Body() dto: PublishDto,
    @CurrentUser() user: SessionUser,
  ): Promise<PublishResponse> {
    return this.publisher.publish(user, code, dto.confirm === true);
  }

  @Roles('chair')
  @Put('proposals/:reference/grant')
  @ApiOkResponse({ description: 'GrantResponse (standing-contract.ts)' })
  async putGrant(
    @Param('reference') reference: string,
    @Body() dto: GrantDto,
    @CurrentUser() user: SessionUser,
  ): Promise<GrantResponse> {
    return this.grants.set(user, reference, dto);
  }

  @Roles('chair')
  @Delete('proposals/:reference/grant')
  @ApiOkResponse({
    description: 'GrantResponse (standing-contract.ts): the proposal undecided again',
  })
  async deleteGrant(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<GrantResponse> {
    return this.grants.clear(user, reference);
  }

  @SignedIn()
  @Get('proposals/:reference/outcome')
  @ApiOkResponse({
    description: 'ProposalOutcome (standing-contract.ts), for the team once published',
  })
  async getOutcome(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalOutcome> {
    return this.outcomes.forUser(user, reference);
  }
}
