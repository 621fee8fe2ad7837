import {
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  Post,
  Put,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { Roles } from '../common/decorators/roles.decorator.js';
import { pdfDownload } from '../proposals/pdf-download.js';
import { ReasonDto } from './dto/reason.dto.js';
import { SaveReviewDto } from './dto/save-review.dto.js';
import type { ReviewDetail, ReviewListResponse } from './review-contract.js';
import { ReviewsService } from './reviews.service.js';

/** The referee's workspace: only their own assignments, in calls they referee. */
@ApiTags('reviews')
@Controller('reviews')
export class ReviewsController {
  constructor(private readonly reviews: ReviewsService) {}

  @Roles('referee')
  @Get()
  @ApiOkResponse({ description: 'ReviewListResponse' })
  async list(@CurrentUser() user: SessionUser): Promise<ReviewListResponse> {
    return { items: await this.reviews.list(user) };
  }

  @Roles('referee')
  @Get(':id')
  @ApiOkResponse({ description: 'ReviewDetail' })
  get(@Param('id') id: string, @CurrentUser() user: SessionUser): Promise<ReviewDetail> {
    return this.reviews.get(user, id);
  }

  @Roles('referee')
  @Get(':id/pdf')
  @ApiProduces('application/pdf')
  async pdf(
    @Param('id') id: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return pdfDownload(res, await this.reviews.pdf(user, id));
  }

  @Roles('referee')
  @Put(':id')
  @ApiOkResponse({ description: 'ReviewDetail' })
  save(
    @Param('id') id: string,
    @Body() dto: SaveReviewDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ReviewDetail> {
    return this.reviews.save(user, id, dto);
  }

  @Roles('referee')
  @Post(':id/decline')
  @HttpCode(200)
  @ApiOkResponse({ description: 'ReviewDetail' })
  decline(
    @Param('id') id: string,
    @Body() dto: ReasonDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ReviewDetail> {
    return this.reviews.decline(user, id, dto);
  }

  @Roles('referee')
  @Post(':id/conflict')
  @HttpCode(200)
  @ApiOkResponse({ description: 'ReviewDetail' })
  conflict(
    @Param('id') id: string,
    @Body() dto: ReasonDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ReviewDetail> {
    return this.reviews.declareConflict(user, id, dto);
  }
}
