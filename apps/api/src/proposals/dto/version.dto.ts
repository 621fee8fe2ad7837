import { ApiProperty } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, Max, Min } from 'class-validator';

/** The proposal's version as the user last saw it; every write carries it. */
export class VersionDto {
  @ApiProperty({ example: 7, description: "The proposal's version as you last saw it" })
  @IsInt()
  @Min(1)
  @Max(2_000_000_000)
  version: number;
}

/** The same for DELETE, in the query: `?version=7`. */
export class VersionQuery {
  @ApiProperty({ example: 7, description: "The proposal's version as you last saw it" })
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(2_000_000_000)
  version: number;
}
