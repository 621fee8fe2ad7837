import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Patch,
  Post,
  Put,
  Res,
} from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Public } from '../common/decorators/public.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { notFound } from '../common/errors/app-error.js';
import { AppConfig } from '../config/app-config.js';
import { contentDisposition } from '../documents/content-disposition.js';
import { PlanSettingsDto } from './dto/plan-settings.dto.js';
import { SplitRunDto, UpdateRunDto } from './dto/update-run.dto.js';
import type { Plan, PlanCallSummary, PlanRun, Progress } from './plan-contract.js';
import { runsCalendar, runsCsv } from './plan-exports.js';
import { PlanService } from './plan.service.js';
import { ProgressService } from './progress.service.js';
import { RunsService } from './runs.service.js';

const uuid = new ParseUUIDPipe({ exceptionFactory: () => notFound('Run') });

function download(res: Response, type: string, filename: string) {
  res.setHeader('Content-Type', type);
  res.setHeader('Content-Disposition', contentDisposition(filename));
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', 'private, no-store');
}

/** Operations: the plan of a published call, its runs, the team's progress and calendar feed. */
@ApiTags('plan')
@Controller()
export class PlanController {
  constructor(
    private readonly plans: PlanService,
    private readonly runs: RunsService,
    private readonly progress: ProgressService,
    private readonly config: AppConfig,
  ) {}

  @Roles('staff', 'chair')
  @Get('plans')
  listCalls(@CurrentUser() user: SessionUser): Promise<PlanCallSummary[]> {
    return this.plans.listCalls(user);
  }

  @SignedIn()
  @Get('calls/:code/plan')
  @ApiOkResponse({ description: 'The plan: settings, runs, unplaced, totals, LST pressure' })
  get(@Param('code') code: string, @CurrentUser() user: SessionUser): Promise<Plan> {
    return this.plans.get(user, code);
  }

  @Roles('staff')
  @Put('calls/:code/plan/settings')
  updateSettings(
    @Param('code') code: string,
    @Body() dto: PlanSettingsDto,
    @CurrentUser() user: SessionUser,
  ): Promise<Plan> {
    return this.plans.updateSettings(user, code, dto);
  }

  @Roles('staff')
  @Post('calls/:code/plan/generate')
  @HttpCode(200)
  generate(@Param('code') code: string, @CurrentUser() user: SessionUser): Promise<Plan> {
    return this.plans.generate(user, code);
  }

  @SignedIn()
  @Get('calls/:code/plan.ics')
  async calendar(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const plan = await this.plans.get(user, code);
    download(res, 'text/calendar; charset=utf-8', `${plan.call.code}-plan.ics`);
    return runsCalendar({
      name: `Skyhours plan ${plan.call.code}`,
      runs: plan.runs,
      zoneOf: () => plan.site.timeZone,
      host: new URL(this.config.publicUrl).host,
    });
  }

  @SignedIn()
  @Get('calls/:code/runs.csv')
  async csv(
    @Param('code') code: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const plan = await this.plans.get(user, code);
    download(res, 'text/csv; charset=utf-8', `${plan.call.code}-runs.csv`);
    return runsCsv(plan.runs, plan.site.timeZone);
  }

  @Roles('staff')
  @Patch('runs/:id')
  update(
    @Param('id', uuid) id: string,
    @Body() dto: UpdateRunDto,
    @CurrentUser() user: SessionUser,
  ): Promise<PlanRun> {
    return this.runs.update(user, id, dto);
  }

  @Roles('staff')
  @Post('runs/:id/split')
  @HttpCode(200)
  split(
    @Param('id', uuid) id: string,
    @Body() dto: SplitRunDto,
    @CurrentUser() user: SessionUser,
  ): Promise<PlanRun[]> {
    return this.runs.split(user, id, dto);
  }

  @Roles('staff')
  @Delete('runs/:id')
  @HttpCode(204)
  async remove(@Param('id', uuid) id: string, @CurrentUser() user: SessionUser): Promise<void> {
    await this.runs.remove(user, id);
  }

  @SignedIn()
  @Get('proposals/:reference/progress')
  getProgress(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
  ): Promise<Progress> {
    return this.progress.progress(user, reference);
  }

  @Roles('proposer')
  @Post('me/calendar-feed')
  rotateFeed(@CurrentUser() user: SessionUser): Promise<{ url: string; createdAt: string }> {
    return this.progress.rotateFeed(user);
  }

  @Public()
  @Get('calendar/:token.ics')
  async feed(
    @Param('token') token: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<string> {
    const { runs, siteZones } = await this.progress.feedRuns(token);
    res.setHeader('Content-Type', 'text/calendar; charset=utf-8');
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    return runsCalendar({
      name: 'Skyhours: my runs',
      runs,
      zoneOf: (run) => siteZones.get((run as PlanRun & { callId: string }).callId) ?? 'UTC',
      host: new URL(this.config.publicUrl).host,
    });
  }
}
