import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CallsModule } from '../calls/calls.module.js';
import { CallRefereesController } from './call-referees.controller.js';
import { reviewEntities } from './entities/index.js';
import { RefereePoolService } from './referee-pool.service.js';
import { ReviewRemindersJob } from './review-reminders.job.js';
import { ReviewsController } from './reviews.controller.js';
import { ReviewsService } from './reviews.service.js';

@Module({
  imports: [TypeOrmModule.forFeature(reviewEntities), CallsModule],
  controllers: [ReviewsController, CallRefereesController],
  providers: [ReviewsService, RefereePoolService, ReviewRemindersJob],
})
export class ReviewModule {}
