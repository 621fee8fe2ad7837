import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { planEntities } from './entities/index.js';

@Module({
  imports: [TypeOrmModule.forFeature(planEntities)],
  controllers: [],
  providers: [],
})
export class PlanModule {}
