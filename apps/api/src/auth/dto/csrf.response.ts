import { ApiProperty } from '@nestjs/swagger';

export class CsrfResponse {
  @ApiProperty({ description: 'Send it back as the X-CSRF-Token header of every write' })
  token: string;
}
