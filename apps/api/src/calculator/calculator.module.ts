import { Module } from '@nestjs/common';
import { CalculatorController } from './calculator.controller.js';
import { CalculatorService } from './calculator.service.js';

// CalculatorRateLimitGuard is not listed: @UseGuards makes its one instance for this module.
@Module({
  controllers: [CalculatorController],
  providers: [CalculatorService],
})
export class CalculatorModule {}
