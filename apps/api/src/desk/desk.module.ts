import { Module } from '@nestjs/common';
import { DeskController } from './desk.controller.js';
import { DeskService } from './desk.service.js';

/** Each role's Desk: what waits for the signed-in user, read across the other modules' tables. */
@Module({
  controllers: [DeskController],
  providers: [DeskService],
})
export class DeskModule {}
