import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { allocationEntities } from './entities/index.js';

@Module({
  imports: [TypeOrmModule.forFeature(allocationEntities)],
  controllers: [],
  providers: [],
})
export class AllocationModule {}
