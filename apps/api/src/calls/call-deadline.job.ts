import { Injectable, Logger } from '@nestjs/common';
import { Cron, CronExpression } from '@nestjs/schedule';
import { CallsService } from './calls.service.js';

/**
 * Stores `closed` on calls whose deadline has passed, once a minute. Nothing depends on its being
 * on time: every request reads the effective status from the clock, so a late job lets no
 * submission through. It keeps the stored status (and the audit log) true for queries and reports.
 */
@Injectable()
export class CallDeadlineJob {
  private readonly logger = new Logger('CallDeadlineJob');

  constructor(private readonly calls: CallsService) {}

  @Cron(CronExpression.EVERY_MINUTE, { name: 'close-calls-at-deadline', waitForCompletion: true })
  async run(): Promise<void> {
    try {
      const closed = await this.calls.closeDueCalls();
      if (closed.length) this.logger.log(`closed at their deadline: ${closed.join(', ')}`);
    } catch (error) {
      this.logger.warn(`closing calls failed: ${String(error)}`);
    }
  }
}
