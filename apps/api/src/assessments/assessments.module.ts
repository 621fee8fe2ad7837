import { Module } from '@nestjs/common';

/** Staff's technical assessment of each submitted proposal, with the overlap warnings. */
@Module({
  controllers: [],
  providers: [],
})
export class AssessmentsModule {}
