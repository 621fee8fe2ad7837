import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { CallDeadlineJob } from './call-deadline.job.js';
import { CallRolesController } from './call-roles.controller.js';
import { CallRolesService } from './call-roles.service.js';
import { CallSubscribers } from './call-subscribers.js';
import { CallsController } from './calls.controller.js';
import { CallsService } from './calls.service.js';
import { CallCapacity } from './entities/call-capacity.entity.js';
import { CallRoleInvitation } from './entities/call-role-invitation.entity.js';
import { GrantedCallRole } from './entities/call-role.entity.js';
import { Call } from './entities/call.entity.js';

@Module({
  imports: [TypeOrmModule.forFeature([Call, CallCapacity, GrantedCallRole, CallRoleInvitation])],
  controllers: [CallRolesController, CallsController],
  providers: [CallsService, CallRolesService, CallSubscribers, CallDeadlineJob],
  exports: [CallsService, CallRolesService, CallSubscribers],
})
export class CallsModule {}
