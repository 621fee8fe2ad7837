import { ApiProperty } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { VERDICTS, type Verdict } from '../entities/technical-assessment.entity.js';

export const NOTE_MAX = 10_000;

/** `PUT /api/proposals/:reference/assessment`. */
export class SaveAssessmentDto {
  @ApiProperty({ enum: VERDICTS })
  @IsIn(VERDICTS, { message: `verdict must be one of ${VERDICTS.join(', ')}` })
  verdict: Verdict;

  @ApiProperty({
    required: false,
    maxLength: NOTE_MAX,
    description: 'For the committee and, once published, the team',
  })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(NOTE_MAX, { message: `note must be at most ${NOTE_MAX} characters` })
  note?: string;
}
