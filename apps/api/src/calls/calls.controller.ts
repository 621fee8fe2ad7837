import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CallsService } from './calls.service.js';
import { CallPageResponse, CallResponse } from './dto/call.response.js';
import { CreateCallDto } from './dto/create-call.dto.js';
import { ListCallsQuery } from './dto/list-calls.query.js';
import { TransitionCallDto } from './dto/transition-call.dto.js';
import { UpdateCallDto } from './dto/update-call.dto.js';

/** Calls for proposals: public to read (planned ones staff only), staff to run. */
@ApiTags('calls')
@Controller('calls')
export class CallsController {
  constructor(
    private readonly calls: CallsService,
    private readonly clock: Clock,
  ) {}

  @Public()
  @Get()
  @ApiOkResponse({ type: CallPageResponse })
  async list(
    @Query() query: ListCallsQuery,
    @CurrentUser() user: SessionUser | undefined,
  ): Promise<CallPageResponse> {
    const { items, total } = await this.calls.list(user, query);
    const now = this.clock.now();
    return {
      items: items.map((c) => CallResponse.from(c, now)),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  @Public()
  @Get(':code')
  @ApiOkResponse({ type: CallResponse })
  async get(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser | undefined,
  ): Promise<CallResponse> {
    return CallResponse.from(await this.calls.getVisible(user, code), this.clock.now());
  }

  @Roles('staff')
  @Post()
  @ApiCreatedResponse({ type: CallResponse })
  async create(
    @Body() dto: CreateCallDto,
    @CurrentUser() user: SessionUser,
  ): Promise<CallResponse> {
    return CallResponse.from(await this.calls.create(dto, user), this.clock.now());
  }

  @Roles('staff')
  @Patch(':code')
  @ApiOkResponse({ type: CallResponse })
  async update(
    @Param('code') code: string,
    @Body() dto: UpdateCallDto,
    @CurrentUser() user: SessionUser,
  ): Promise<CallResponse> {
    return CallResponse.from(await this.calls.update(code, dto, user), this.clock.now());
  }

  @Roles('staff')
  @Post(':code/transition')
  @HttpCode(200)
  @ApiOkResponse({ type: CallResponse })
  async transition(
    @Param('code') code: string,
    @Body() dto: TransitionCallDto,
    @CurrentUser() user: SessionUser,
  ): Promise<CallResponse> {
    return CallResponse.from(await this.calls.transition(code, dto.to, user), this.clock.now());
  }
}
