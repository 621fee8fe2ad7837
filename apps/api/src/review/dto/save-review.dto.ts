import { ApiProperty } from '@nestjs/swagger';
import {
  IsBoolean,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  MaxLength,
  ValidateIf,
} from 'class-validator';
import { VersionDto } from '../../proposals/dto/version.dto.js';

/**
 * The whole review form. A draft may leave any field empty; `submit: true` needs a score and
 * the expertise (the scale is the call's, checked by the service, which knows it).
 */
export class SaveReviewDto extends VersionDto {
  @ApiProperty({
    nullable: true,
    example: 4,
    description: "On the call's scale scoreMin..scoreMax",
  })
  @ValidateIf((_o, v) => v !== null)
  @IsNumber(
    { allowNaN: false, allowInfinity: false, maxDecimalPlaces: 2 },
    {
      message: 'score must be a number (at most 2 decimals) or null',
    },
  )
  score: number | null;

  @ApiProperty({ description: 'Shown to the PI, without your name', maxLength: 20000 })
  @IsString()
  @MaxLength(20000)
  commentToPi: string;

  @ApiProperty({ description: 'Shown to the chair only', maxLength: 20000 })
  @IsString()
  @MaxLength(20000)
  commentToCommittee: string;

  @ApiProperty({ nullable: true, enum: [1, 2, 3], description: '1 general, 2 related, 3 expert' })
  @ValidateIf((_o, v) => v !== null)
  @IsIn([1, 2, 3], { message: 'expertise must be 1, 2 or 3 (or null in a draft)' })
  expertise: 1 | 2 | 3 | null;

  @ApiProperty({ required: false, default: false })
  @IsOptional()
  @IsBoolean()
  submit?: boolean;
}
