import { Column, Entity, PrimaryColumn } from 'typeorm';

/** One person's private calendar link; only the token's SHA-256 is kept. */
@Entity('calendar_feeds')
export class CalendarFeed {
  @PrimaryColumn('uuid', { name: 'user_id' })
  userId: string;

  @Column('text', { name: 'token_sha256', unique: true })
  tokenSha256: string;

  @Column('timestamptz', { name: 'created_at' })
  createdAt: Date;
}
