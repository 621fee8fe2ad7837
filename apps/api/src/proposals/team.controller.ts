import { Body, Controller, Delete, HttpCode, Param, Patch, Post, Query, Res } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { ProposalResponse } from './dto/proposal.response.js';
import { InviteMemberDto, UpdateMemberDto } from './dto/team.dto.js';
import { VersionDto, VersionQuery } from './dto/version.dto.js';
import { TeamService } from './team.service.js';

/** The proposal's team: the PI's to manage. */
@ApiTags('proposals')
@Controller('proposals/:reference/team')
export class TeamController {
  constructor(private readonly team: TeamService) {}

  @SignedIn()
  @Post()
  @ApiCreatedResponse({ type: ProposalResponse })
  invite(
    @Param('reference') reference: string,
    @Body() dto: InviteMemberDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.team.invite(user, reference, dto);
  }

  @SignedIn()
  @Patch(':memberId')
  @ApiOkResponse({ type: ProposalResponse })
  update(
    @Param('reference') reference: string,
    @Param('memberId') memberId: string,
    @Body() dto: UpdateMemberDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.team.update(user, reference, memberId, dto);
  }

  /** 200 with the proposal; 204 when a Co-I has removed themselves (they no longer see it). */
  @SignedIn()
  @Delete(':memberId')
  @ApiOkResponse({ type: ProposalResponse })
  async remove(
    @Param('reference') reference: string,
    @Param('memberId') memberId: string,
    @Query() query: VersionQuery,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<ProposalResponse | undefined> {
    const proposal = await this.team.remove(user, reference, memberId, query.version);
    if (proposal) return proposal;
    res.status(204);
    return undefined;
  }

  @SignedIn()
  @Post(':memberId/make-pi')
  @HttpCode(200)
  @ApiOkResponse({ type: ProposalResponse })
  makePi(
    @Param('reference') reference: string,
    @Param('memberId') memberId: string,
    @Body() dto: VersionDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.team.makePi(user, reference, memberId, dto.version);
  }
}
