import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** Small key/value facts about this installation, e.g. when the demo was loaded. */
@Entity('app_meta')
export class AppMeta {
  @PrimaryColumn('text')
  key: string;

  @Column('jsonb')
  value: unknown;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
