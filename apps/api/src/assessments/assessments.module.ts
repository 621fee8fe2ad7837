import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProposalsModule } from '../proposals/proposals.module.js';
import { AssessmentsController } from './assessments.controller.js';
import { AssessmentsService } from './assessments.service.js';
import { TechnicalAssessment } from './entities/technical-assessment.entity.js';

/** Staff's technical assessment of each submitted proposal, with the overlap warnings. */
@Module({
  imports: [TypeOrmModule.forFeature([TechnicalAssessment]), ProposalsModule],
  controllers: [AssessmentsController],
  providers: [AssessmentsService],
})
export class AssessmentsModule {}
