import {
  Body,
  Controller,
  Get,
  Param,
  Post,
  Res,
  StreamableFile,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { ApiBody, ApiConsumes, ApiCreatedResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user.js';
import { CurrentUser } from '../common/decorators/current-user.decorator.js';
import { SignedIn } from '../common/decorators/signed-in.decorator.js';
import { ProposalResponse } from './dto/proposal.response.js';
import { UploadScienceCaseDto } from './dto/upload-science-case.dto.js';
import { pdfDownload } from './pdf-download.js';
import { ScienceCaseUploadInterceptor } from './science-case-upload.interceptor.js';
import { ScienceCaseUploads } from './science-case-uploads.service.js';

/** The science case: upload (multipart) and download. */
@ApiTags('proposals')
@Controller('proposals/:reference/documents')
export class DocumentsController {
  constructor(private readonly uploads: ScienceCaseUploads) {}

  @SignedIn()
  @Post()
  @UseInterceptors(ScienceCaseUploadInterceptor)
  @ApiConsumes('multipart/form-data')
  @ApiBody({ type: UploadScienceCaseDto })
  @ApiCreatedResponse({ type: ProposalResponse })
  upload(
    @Param('reference') reference: string,
    @Body() dto: UploadScienceCaseDto,
    @UploadedFile() file: Express.Multer.File | undefined,
    @CurrentUser() user: SessionUser,
  ): Promise<ProposalResponse> {
    return this.uploads.upload(user, reference, dto.version, file);
  }

  @SignedIn()
  @Get('science-case')
  @ApiProduces('application/pdf')
  async download(
    @Param('reference') reference: string,
    @CurrentUser() user: SessionUser,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return pdfDownload(res, await this.uploads.download(user, reference));
  }
}
