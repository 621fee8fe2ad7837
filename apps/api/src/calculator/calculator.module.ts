import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { Configuration } from '../observatory/entities/configuration.entity.js';
import { Observatory } from '../observatory/entities/observatory.entity.js';
import { ReceiverBand } from '../observatory/entities/receiver-band.entity.js';
import { CalculatorController } from './calculator.controller.js';
import { CalculatorService } from './calculator.service.js';

@Module({
  // Reads the stored array records that a request may name by id.
  imports: [TypeOrmModule.forFeature([Observatory, Configuration, ReceiverBand])],
  controllers: [CalculatorController],
  providers: [CalculatorService],
})
export class CalculatorModule {}
