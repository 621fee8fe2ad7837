import { Body, Controller, Delete, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import {
  ApiCreatedResponse,
  ApiExtraModels,
  ApiOkResponse,
  ApiTags,
  getSchemaPath,
} from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { ProposalResponse } from './dto/proposal.response.js';
import {
  CreateTargetDto,
  ImportPreviewResponse,
  ImportTargetsDto,
  UpdateTargetDto,
} from './dto/target.dto.js';
import { VersionQuery } from './dto/version.dto.js';
import { TargetsService } from './targets.service.js';

@ApiTags('proposals')
@Controller('proposals/:reference/targets')
export class TargetsController {
  constructor(private readonly targets: TargetsService) {}

  @SignedIn()
  @Post()
  @ApiCreatedResponse({ type: ProposalResponse })
  create(
    @Param('reference') reference: string,
    @Body() dto: CreateTargetDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.targets.create(user, reference, dto);
  }

  /** Declared before `:targetId` routes; `import` is a path of its own. */
  @SignedIn()
  @Post('import')
  @HttpCode(200)
  @ApiExtraModels(ImportPreviewResponse, ProposalResponse)
  @ApiOkResponse({
    description: 'dryRun true: the preview; false: the proposal with the targets saved',
    schema: {
      oneOf: [
        { $ref: getSchemaPath(ImportPreviewResponse) },
        { $ref: getSchemaPath(ProposalResponse) },
      ],
    },
  })
  import(
    @Param('reference') reference: string,
    @Body() dto: ImportTargetsDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ImportPreviewResponse | ProposalResponse> {
    return this.targets.import(user, reference, dto);
  }

  @SignedIn()
  @Patch(':targetId')
  @ApiOkResponse({ type: ProposalResponse })
  update(
    @Param('reference') reference: string,
    @Param('targetId') targetId: string,
    @Body() dto: UpdateTargetDto,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.targets.update(user, reference, targetId, dto);
  }

  @SignedIn()
  @Delete(':targetId')
  @ApiOkResponse({ type: ProposalResponse })
  remove(
    @Param('reference') reference: string,
    @Param('targetId') targetId: string,
    @Query() query: VersionQuery,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.targets.remove(user, reference, targetId, query.version);
  }
}
