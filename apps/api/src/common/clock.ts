import { Global, Injectable, Module } from '@nestjs/common';

/**
 * The server's clock. Rules that depend on time (deadlines, expiries, reminders) ask this instead
 * of `new Date()`, so tests can move time (test/support/app.ts puts a TestClock in its place).
 */
@Injectable()
export class Clock {
  now(): Date {
    return new Date();
  }
}

@Global()
@Module({ providers: [Clock], exports: [Clock] })
export class ClockModule {}
