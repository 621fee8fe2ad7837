import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, Max, Min } from 'class-validator';

/** The multipart form's text fields; the PDF comes in the field `file`. */
export class UploadScienceCaseDto {
  @ApiProperty({ example: 7, description: "The proposal's version as you last saw it" })
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(2_000_000_000)
  version: number;

  @ApiProperty({ type: 'string', format: 'binary', description: 'The science case (PDF)' })
  file?: unknown;
}
