import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { reviewEntities } from './entities/index.js';

@Module({
  imports: [TypeOrmModule.forFeature(reviewEntities)],
  controllers: [],
  providers: [],
})
export class ReviewModule {}
