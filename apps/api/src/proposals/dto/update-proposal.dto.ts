import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsIn, IsOptional, IsString, Matches, MaxLength } from 'class-validator';
import { PROPOSAL_KINDS, type ProposalKind } from '../../calls/call-lifecycle.js';
import { SCIENCE_CATEGORIES } from '../proposal-options.js';
import { VersionDto } from './version.dto.js';

const trim = ({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value);

/**
 * Only the fields sent change. A title or an abstract may be emptied (the checks then say so);
 * `null` clears the science category or the continued proposal.
 */
export class UpdateProposalDto extends VersionDto {
  @ApiProperty({ required: false })
  @IsOptional()
  @Transform(trim)
  @IsString()
  @MaxLength(300)
  title?: string;

  @ApiProperty({ required: false, description: 'Plain text; at most 300 words to submit' })
  @IsOptional()
  @IsString()
  @MaxLength(20000)
  abstract?: string;

  @ApiProperty({ required: false, nullable: true, enum: SCIENCE_CATEGORIES })
  @IsOptional()
  @IsIn(SCIENCE_CATEGORIES, {
    message: 'scienceCategory must be one of GET /api/proposals/options',
  })
  scienceCategory?: string | null;

  @ApiProperty({ required: false, enum: PROPOSAL_KINDS })
  @IsOptional()
  @IsIn(PROPOSAL_KINDS, { message: `kind must be one of ${PROPOSAL_KINDS.join(', ')}` })
  kind?: ProposalKind;

  @ApiProperty({
    required: false,
    nullable: true,
    example: 'AU26-0003',
    description: 'Reference of an earlier proposal of yours that this one continues',
  })
  @IsOptional()
  @Transform(({ value }) => (typeof value === 'string' ? value.trim().toUpperCase() : value))
  @IsString()
  @Matches(/^[A-Z][A-Z0-9-]{1,15}-[0-9]{4}$/, {
    message: 'continues must be a proposal reference such as AU26-0003',
  })
  continues?: string | null;
}
