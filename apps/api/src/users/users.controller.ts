import {
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Query,
  Req,
} from '@nestjs/common';
import { ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Request } from 'express';
import { originOf } from '../audit/request-origin.js';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { validationFailed } from '../common/errors/app-error.js';
import { ListUsersQuery } from './dto/list-users.query.js';
import { UpdateUserDto } from './dto/update-user.dto.js';
import { UserPageResponse, UserResponse } from './dto/user.response.js';
import { EmailVerificationService } from './email-verification.service.js';
import { UsersService } from './users.service.js';

const uuid = new ParseUUIDPipe({
  exceptionFactory: () => validationFailed([{ path: 'id', message: 'id must be a UUID' }]),
});

/** The Accounts screen: admins list accounts, change roles, deactivate and resend links. */
@ApiTags('users')
@Controller('users')
export class UsersController {
  constructor(
    private readonly users: UsersService,
    private readonly verification: EmailVerificationService,
  ) {}

  @Roles('admin')
  @Get()
  @ApiOkResponse({ type: UserPageResponse })
  async list(@Query() query: ListUsersQuery): Promise<UserPageResponse> {
    const { items, total } = await this.users.list(query);
    return {
      items: items.map(UserResponse.from),
      total,
      page: query.page,
      pageSize: query.pageSize,
    };
  }

  @Roles('admin')
  @Patch(':id')
  @ApiOkResponse({ type: UserResponse })
  async update(
    @Param('id', uuid) id: string,
    @Body() change: UpdateUserDto,
    @CurrentUser() actor: SessionUser,
    @Req() req: Request,
  ): Promise<UserResponse> {
    return UserResponse.from(await this.users.adminUpdate(id, change, actor, originOf(req)));
  }

  @Roles('admin')
  @Post(':id/resend-verification')
  @HttpCode(204)
  @ApiNoContentResponse({ description: 'A new link is in the outbox; earlier links stop working' })
  async resendVerification(@Param('id', uuid) id: string, @Req() req: Request): Promise<void> {
    await this.verification.resend(await this.users.get(id), originOf(req));
  }
}
