import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsIn, IsOptional, IsString, Length } from 'class-validator';
import { PROPOSAL_KINDS, type ProposalKind } from '../../calls/call-lifecycle.js';
import { SCIENCE_CATEGORIES } from '../proposal-options.js';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

export class CreateProposalDto {
  @ApiProperty({ example: 'Neutral hydrogen in the Kestrel filament' })
  @Transform(trim)
  @IsString()
  @Length(1, 300, { message: 'title must be 1 to 300 characters' })
  title: string;

  @ApiProperty({ enum: PROPOSAL_KINDS })
  @IsIn(PROPOSAL_KINDS, { message: `kind must be one of ${PROPOSAL_KINDS.join(', ')}` })
  kind: ProposalKind;

  @ApiProperty({ required: false, enum: SCIENCE_CATEGORIES })
  @IsOptional()
  @IsIn(SCIENCE_CATEGORIES, {
    message: 'scienceCategory must be one of GET /api/proposals/options',
  })
  scienceCategory?: string;
}
