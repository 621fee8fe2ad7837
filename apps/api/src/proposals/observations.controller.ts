import { Body, Controller, Delete, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { CreateObservationDto, UpdateObservationDto } from './dto/observation.dto.js';
import { ProposalResponse } from './dto/proposal.response.js';
import { VersionQuery } from './dto/version.dto.js';
import { ObservationsService } from './observations.service.js';

@ApiTags('proposals')
@Controller('proposals/:reference/observations')
export class ObservationsController {
  constructor(private readonly observations: ObservationsService) {}

  @SignedIn()
  @Post()
  @ApiCreatedResponse({ type: ProposalResponse })
  create(
    @Param('reference') reference: string,
    @Body() dto: CreateObservationDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.observations.create(user, reference, dto);
  }

  @SignedIn()
  @Patch(':observationId')
  @ApiOkResponse({ type: ProposalResponse })
  update(
    @Param('reference') reference: string,
    @Param('observationId') observationId: string,
    @Body() dto: UpdateObservationDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.observations.update(user, reference, observationId, dto);
  }

  @SignedIn()
  @Delete(':observationId')
  @ApiOkResponse({ type: ProposalResponse })
  remove(
    @Param('reference') reference: string,
    @Param('observationId') observationId: string,
    @Query() query: VersionQuery,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.observations.remove(user, reference, observationId, query.version);
  }
}
