import { ApiProperty } from '@nestjs/swagger';
import { IsString, Matches } from 'class-validator';

/** The token of an e-mailed link: 32 random bytes in base64url. */
export class TokenDto {
  @ApiProperty({ description: 'The token from the e-mailed link' })
  @IsString()
  @Matches(/^[A-Za-z0-9_-]{43}$/, { message: 'token is not a token from a Skyhours link' })
  token: string;
}
