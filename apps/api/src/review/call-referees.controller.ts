import { Body, Controller, Delete, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CreateAssignmentDto } from './dto/create-assignment.dto.js';
import { RefereePoolService } from './referee-pool.service.js';
import type { AutoAssignResponse, CallRefereesResponse } from './review-contract.js';

/** A call's referees and assignments: its chair manages them, staff may look. */
@ApiTags('reviews')
@Controller('calls/:code')
export class CallRefereesController {
  constructor(private readonly pool: RefereePoolService) {}

  @Roles('chair', 'staff')
  @Get('referees')
  @ApiOkResponse({ description: 'CallRefereesResponse' })
  view(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser,
  ): Promise<CallRefereesResponse> {
    return this.pool.view(user, code);
  }

  @Roles('chair')
  @Post('assign')
  @HttpCode(200)
  @ApiOkResponse({ description: 'AutoAssignResponse' })
  assign(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser,
  ): Promise<AutoAssignResponse> {
    return this.pool.autoAssign(user, code);
  }

  @Roles('chair')
  @Post('assignments')
  @ApiOkResponse({ description: 'CallRefereesResponse' })
  add(
    @Param('code') code: string,
    @Body() dto: CreateAssignmentDto,
    @CurrentUser() user: SessionUser,
  ): Promise<CallRefereesResponse> {
    return this.pool.add(user, code, dto);
  }

  @Roles('chair')
  @Delete('assignments/:id')
  @HttpCode(204)
  async remove(
    @Param('code') code: string,
    @Param('id') id: string,
    @CurrentUser() user: SessionUser,
  ): Promise<void> {
    await this.pool.remove(user, code, id);
  }
}
