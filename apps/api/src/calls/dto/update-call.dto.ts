import { OmitType, PartialType } from '@nestjs/swagger';
import { CreateCallDto } from './create-call.dto.js';

/** Code and observatory are fixed once a call exists (proposal references carry the code). */
export class UpdateCallDto extends PartialType(
  OmitType(CreateCallDto, ['code', 'observatoryId']),
) {}
