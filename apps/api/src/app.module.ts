import { Module } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ScheduleModule } from '@nestjs/schedule';
import { AuditModule } from './audit/audit.module.js';
import { AuthModule } from './auth/auth.module.js';
import { CalculatorModule } from './calculator/calculator.module.js';
import { CallsModule } from './calls/calls.module.js';
import { ClockModule } from './common/clock.js';
import { ErrorEnvelopeFilter } from './common/filters/error-envelope.filter.js';
import { CsrfGuard } from './common/guards/csrf.guard.js';
import { RolesGuard } from './common/guards/roles.guard.js';
import { SessionAuthGuard } from './common/guards/session-auth.guard.js';
import { ConfigModule } from './config/config.module.js';
import { DatabaseModule } from './database/database.module.js';
import { DocumentsModule } from './documents/documents.module.js';
import { HealthModule } from './health/health.module.js';
import { MailModule } from './mail/mail.module.js';
import { ObservatoryModule } from './observatory/observatory.module.js';
import { ProposalsModule } from './proposals/proposals.module.js';
import { UsersModule } from './users/users.module.js';
import { AllocationModule } from './allocation/allocation.module.js';
import { AssessmentsModule } from './assessments/assessments.module.js';
import { DeskModule } from './desk/desk.module.js';
import { PlanModule } from './plan/plan.module.js';
import { ReviewModule } from './review/review.module.js';

@Module({
  imports: [
    ConfigModule,
    ClockModule,
    DatabaseModule,
    AuditModule,
    MailModule,
    UsersModule,
    AuthModule,
    HealthModule,
    ScheduleModule.forRoot(),
    ObservatoryModule,
    CallsModule,
    CalculatorModule,
    DocumentsModule,
    ProposalsModule,
    AssessmentsModule,
    ReviewModule,
    AllocationModule,
    PlanModule,
    DeskModule,
  ],
  providers: [
    // Order matters: CSRF, then sign-in, then roles.
    { provide: APP_GUARD, useClass: CsrfGuard },
    { provide: APP_GUARD, useClass: SessionAuthGuard },
    { provide: APP_GUARD, useClass: RolesGuard },
    { provide: APP_FILTER, useClass: ErrorEnvelopeFilter },
  ],
})
export class AppModule {}
