import { ApiProperty } from '@nestjs/swagger';
import { IsUUID } from 'class-validator';

/** The chair puts one referee of the call's pool on one of its proposals. */
export class CreateAssignmentDto {
  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'proposalId must be the id of a proposal of this call' })
  proposalId: string;

  @ApiProperty({ format: 'uuid' })
  @IsUUID('all', { message: 'refereeId must be the id of a referee of this call' })
  refereeId: string;
}
