import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsOptional } from 'class-validator';
import type { PublishRequest } from '../standing-contract.js';

export class PublishDto implements PublishRequest {
  @ApiProperty({
    required: false,
    description: 'Publish even though some proposals have no decision: they become not allocated',
  })
  @IsOptional()
  @IsBoolean({ message: 'confirm must be true or false' })
  confirm?: boolean;
}
