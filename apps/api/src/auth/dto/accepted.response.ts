import { ApiProperty } from '@nestjs/swagger';

/** The answer to a request whose outcome arrives by e-mail; the same whatever the account's state. */
export class AcceptedResponse {
  @ApiProperty()
  message: string;
}
