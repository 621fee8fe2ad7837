import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { Clock } from '../common/clock.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import type { DeskResponse } from './dto/desk.response.js';
import { DeskService } from './desk.service.js';

/** The signed-in user's Desk: each of their roles' section, only ever about their own work. */
@ApiTags('desk')
@Controller('desk')
export class DeskController {
  constructor(
    private readonly desk: DeskService,
    private readonly clock: Clock,
  ) {}

  @SignedIn()
  @Get()
  @ApiOkResponse({ description: 'One section per role the user holds' })
  get(@CurrentUser() user: SessionUser): Promise<DeskResponse> {
    return this.desk.desk(user, this.clock.now());
  }
}
