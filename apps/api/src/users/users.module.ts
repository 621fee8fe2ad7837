import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CallsModule } from '../calls/calls.module.js';
import { AccountTokensService } from './account-tokens.service.js';
import { EmailVerificationService } from './email-verification.service.js';
import { AccountToken } from './entities/account-token.entity.js';
import { User } from './entities/user.entity.js';
import { UsersController } from './users.controller.js';
import { UsersService } from './users.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([User, AccountToken]), CallsModule],
  controllers: [UsersController],
  providers: [UsersService, AccountTokensService, EmailVerificationService],
  exports: [UsersService, AccountTokensService, EmailVerificationService],
})
export class UsersModule {}
