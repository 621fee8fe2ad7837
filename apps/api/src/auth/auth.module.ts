import { Module } from '@nestjs/common';
import { PassportModule } from '@nestjs/passport';
import { UsersModule } from '../users/users.module.js';
import { AuthController } from './auth.controller.js';
import { AuthService } from './auth.service.js';
import { LocalStrategy } from './local.strategy.js';
import { PasswordResetService } from './password-reset.service.js';
import { SignInLimiter } from './rate-limit/sign-in-limiter.js';
import { RegistrationService } from './registration.service.js';
import { SessionSerializer } from './session.serializer.js';

@Module({
  imports: [PassportModule.register({ session: true }), UsersModule],
  controllers: [AuthController],
  providers: [
    AuthService,
    RegistrationService,
    PasswordResetService,
    SignInLimiter,
    LocalStrategy,
    SessionSerializer,
  ],
  exports: [AuthService],
})
export class AuthModule {}
