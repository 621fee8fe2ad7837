import { ApiProperty } from '@nestjs/swagger';

/** An account named in an entry: who acted, or whom it is about. */
export class AuditActorResponse {
  @ApiProperty()
  id: string;

  @ApiProperty()
  name: string;

  @ApiProperty()
  email: string;
}

/** One audit entry: who (actor), what (action, subject, details), when (at), from where (ip). */
export class AuditEventResponse {
  @ApiProperty()
  id: string;

  @ApiProperty({ format: 'date-time' })
  at: string;

  @ApiProperty({ type: AuditActorResponse, nullable: true })
  actor: AuditActorResponse | null;

  @ApiProperty({ example: 'auth.sign-in' })
  action: string;

  @ApiProperty({
    type: AuditActorResponse,
    nullable: true,
    description: 'The account the event is about, when it is about one',
  })
  subject: AuditActorResponse | null;

  @ApiProperty({ nullable: true, type: String, example: 'user' })
  subjectType: string | null;

  @ApiProperty({ nullable: true, type: String })
  subjectId: string | null;

  @ApiProperty({ type: 'object', additionalProperties: true })
  details: Record<string, unknown>;

  @ApiProperty({ nullable: true, type: String })
  ip: string | null;
}

export class AuditPageResponse {
  @ApiProperty({ type: [AuditEventResponse] })
  items: AuditEventResponse[];

  @ApiProperty()
  total: number;

  @ApiProperty()
  page: number;

  @ApiProperty()
  pageSize: number;
}
