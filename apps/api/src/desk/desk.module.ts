import { Module } from '@nestjs/common';

/** Each role's Desk: what waits for the signed-in user, read across the other modules' tables. */
@Module({
  controllers: [],
  providers: [],
})
export class DeskModule {}
