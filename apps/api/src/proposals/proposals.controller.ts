import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { ChecksResponse } from './dto/checks.response.js';
import { CreateProposalDto } from './dto/create-proposal.dto.js';
import { ListProposalsQuery } from './dto/list-proposals.query.js';
import { ProposalOptionsResponse, ProposalPageResponse } from './dto/proposal-list.response.js';
import { ProposalResponse } from './dto/proposal.response.js';
import { UpdateProposalDto } from './dto/update-proposal.dto.js';
import { VersionDto } from './dto/version.dto.js';
import { ProposalsService } from './proposals.service.js';
import { SubmissionService } from './submission.service.js';

/** Proposals: create in a call, the proposer's list, the overview, checks and submission. */
@ApiTags('proposals')
@Controller()
export class ProposalsController {
  constructor(
    private readonly proposals: ProposalsService,
    private readonly submission: SubmissionService,
  ) {}

  @Public()
  @Get('proposals/options')
  @ApiOkResponse({ type: ProposalOptionsResponse })
  options(): ProposalOptionsResponse {
    return ProposalOptionsResponse.build();
  }

  @SignedIn()
  @Post('calls/:code/proposals')
  @ApiCreatedResponse({ type: ProposalResponse })
  create(
    @Param('code') code: string,
    @Body() dto: CreateProposalDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.proposals.create(user, code, dto);
  }

  @SignedIn()
  @Get('proposals')
  @ApiOkResponse({ type: ProposalPageResponse })
  list(
    @Query() query: ListProposalsQuery,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalPageResponse> {
    return this.proposals.list(user, query);
  }

  @SignedIn()
  @Get('proposals/:reference')
  @ApiOkResponse({ type: ProposalResponse })
  get(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.proposals.get(user, reference);
  }

  @SignedIn()
  @Patch('proposals/:reference')
  @ApiOkResponse({ type: ProposalResponse })
  update(
    @Param('reference') reference: string,
    @Body() dto: UpdateProposalDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.proposals.update(user, reference, dto);
  }

  @SignedIn()
  @Get('proposals/:reference/checks')
  @ApiOkResponse({ type: ChecksResponse })
  checks(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<ChecksResponse> {
    return this.submission.checks(user, reference);
  }

  @SignedIn()
  @Post('proposals/:reference/submit')
  @HttpCode(200)
  @ApiOkResponse({ type: ProposalResponse })
  submit(
    @Param('reference') reference: string,
    @Body() dto: VersionDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.submission.submit(user, reference, dto.version);
  }

  @SignedIn()
  @Post('proposals/:reference/reopen')
  @HttpCode(200)
  @ApiOkResponse({ type: ProposalResponse })
  reopen(
    @Param('reference') reference: string,
    @Body() dto: VersionDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.submission.reopen(user, reference, dto.version);
  }

  @SignedIn()
  @Post('proposals/:reference/withdraw')
  @HttpCode(200)
  @ApiOkResponse({ type: ProposalResponse })
  withdraw(
    @Param('reference') reference: string,
    @Body() dto: VersionDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.submission.withdraw(user, reference, dto.version);
  }
}
