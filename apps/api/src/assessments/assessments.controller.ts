import { Body, Controller, Get, Param, Put } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { AssessmentsService } from './assessments.service.js';
import {
  AssessmentCallResponse,
  AssessmentResponse,
  CallAssessmentsResponse,
} from './dto/assessment.response.js';
import { SaveAssessmentDto } from './dto/save-assessment.dto.js';

/** Technical assessments: staff's verdict on each submitted proposal, with checks and overlaps. */
@ApiTags('assessments')
@Controller()
export class AssessmentsController {
  constructor(private readonly assessments: AssessmentsService) {}

  @Roles('staff')
  @Get('assessments/calls')
  @ApiOkResponse({ type: [AssessmentCallResponse] })
  calls(): Promise<AssessmentCallResponse[]> {
    return this.assessments.calls();
  }

  @Roles('staff')
  @Get('calls/:code/assessments')
  @ApiOkResponse({ type: CallAssessmentsResponse })
  forCall(@Param('code') code: string): Promise<CallAssessmentsResponse> {
    return this.assessments.forCall(code);
  }

  @SignedIn()
  @Get('proposals/:reference/assessment')
  @ApiOkResponse({ type: AssessmentResponse })
  get(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<AssessmentResponse> {
    return this.assessments.forProposal(user, reference);
  }

  @Roles('staff')
  @Put('proposals/:reference/assessment')
  @ApiOkResponse({ type: AssessmentResponse })
  save(
    @Param('reference') reference: string,
    @Body() dto: SaveAssessmentDto,
    @CurrentUser() user: SessionUser,
  ): Promise<AssessmentResponse> {
    return this.assessments.save(user, reference, dto);
  }
}
