import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProposalsModule } from '../proposals/proposals.module.js';
import { AllocationController } from './allocation.controller.js';
import { CommitteeReportService } from './committee-report.service.js';
import { allocationEntities } from './entities/index.js';
import { GrantsService } from './grants.service.js';
import { OutcomeService } from './outcome.service.js';
import { PublishService } from './publish.service.js';
import { StandingService } from './standing.service.js';

@Module({
  imports: [TypeOrmModule.forFeature(allocationEntities), ProposalsModule],
  controllers: [AllocationController],
  providers: [
    StandingService,
    GrantsService,
    PublishService,
    OutcomeService,
    CommitteeReportService,
  ],
  exports: [StandingService],
})
export class AllocationModule {}
