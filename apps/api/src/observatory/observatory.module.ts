import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { Configuration } from './entities/configuration.entity.js';
import { Observatory } from './entities/observatory.entity.js';
import { ReceiverBand } from './entities/receiver-band.entity.js';
import { ObservatoriesController } from './observatories.controller.js';
import { ObservatoryService } from './observatory.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([Observatory, Configuration, ReceiverBand])],
  controllers: [ObservatoriesController],
  providers: [ObservatoryService],
  exports: [ObservatoryService],
})
export class ObservatoryModule {}
