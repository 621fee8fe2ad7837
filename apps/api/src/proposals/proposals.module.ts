import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CallsModule } from '../calls/calls.module.js';
import { DocumentsModule } from '../documents/documents.module.js';
import { DocumentsController } from './documents.controller.js';
import { ProposalMember } from './entities/proposal-member.entity.js';
import { ProposalObservation } from './entities/proposal-observation.entity.js';
import { ProposalTarget } from './entities/proposal-target.entity.js';
import { ProposalVersion } from './entities/proposal-version.entity.js';
import { Proposal } from './entities/proposal.entity.js';
import { ObservationsController } from './observations.controller.js';
import { ObservationsService } from './observations.service.js';
import { ProposalAccess } from './proposal-access.service.js';
import { ProposalLoader } from './proposal-loader.js';
import { ProposalRemindersJob } from './proposal-reminders.job.js';
import { ProposalsController } from './proposals.controller.js';
import { ProposalsService } from './proposals.service.js';
import { ScienceCaseUploadInterceptor } from './science-case-upload.interceptor.js';
import { ScienceCaseUploads } from './science-case-uploads.service.js';
import { SubmissionService } from './submission.service.js';
import { TargetsController } from './targets.controller.js';
import { TargetsService } from './targets.service.js';
import { TeamController } from './team.controller.js';
import { TeamService } from './team.service.js';
import { VersionsController } from './versions.controller.js';
import { VersionsService } from './versions.service.js';

@Module({
  imports: [
    TypeOrmModule.forFeature([
      Proposal,
      ProposalMember,
      ProposalTarget,
      ProposalObservation,
      ProposalVersion,
    ]),
    CallsModule,
    DocumentsModule,
  ],
  controllers: [
    ProposalsController,
    TeamController,
    TargetsController,
    ObservationsController,
    DocumentsController,
    VersionsController,
  ],
  providers: [
    ProposalAccess,
    ProposalLoader,
    ProposalsService,
    TeamService,
    TargetsService,
    ObservationsService,
    ScienceCaseUploads,
    ScienceCaseUploadInterceptor,
    SubmissionService,
    VersionsService,
    ProposalRemindersJob,
  ],
  exports: [ProposalAccess, ProposalLoader],
})
export class ProposalsModule {}
