import { Body, Controller, Delete, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { CallRolesService } from './call-roles.service.js';
import { CallRoleListResponse, CallRoleResponse } from './dto/call-role.response.js';
import { GrantCallRoleDto } from './dto/grant-call-role.dto.js';

/** Who chairs and referees a call; staff only. */
@ApiTags('calls')
@Controller('calls/:code/roles')
export class CallRolesController {
  constructor(private readonly roles: CallRolesService) {}

  @Roles('staff')
  @Get()
  @ApiOkResponse({ type: CallRoleListResponse })
  async list(@Param('code') code: string): Promise<CallRoleListResponse> {
    return { items: await this.roles.list(code) };
  }

  @Roles('staff')
  @Post()
  @ApiCreatedResponse({ type: CallRoleResponse })
  grant(
    @Param('code') code: string,
    @Body() dto: GrantCallRoleDto,
    @CurrentUser() user: SessionUser,
  ): Promise<CallRoleResponse> {
    return this.roles.grant(code, dto, user);
  }

  @Roles('staff')
  @Delete(':id')
  @HttpCode(204)
  async revoke(
    @Param('code') code: string,
    @Param('id') id: string,
    @CurrentUser() user: SessionUser,
  ): Promise<void> {
    await this.roles.revoke(code, id, user);
  }
}
