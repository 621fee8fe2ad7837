import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { planEntities } from './entities/index.js';
import { PlanController } from './plan.controller.js';
import { PlanService } from './plan.service.js';
import { ProgressService } from './progress.service.js';
import { RunsService } from './runs.service.js';

@Module({
  imports: [TypeOrmModule.forFeature(planEntities)],
  controllers: [PlanController],
  providers: [PlanService, RunsService, ProgressService],
})
export class PlanModule {}
