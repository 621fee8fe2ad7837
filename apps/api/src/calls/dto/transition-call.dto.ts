import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import { CALL_STATUSES, type CallStatus } from '../call-lifecycle.js';

export class TransitionCallDto {
  @ApiProperty({ enum: CALL_STATUSES })
  @IsIn(CALL_STATUSES)
  to: CallStatus;
}
