import { Column, Entity, PrimaryColumn } from 'typeorm';

export const VERDICTS = ['feasible', 'feasible_with_changes', 'not_feasible'] as const;
export type Verdict = (typeof VERDICTS)[number];

/** Staff's technical verdict on one submitted proposal; no row means not assessed yet. */
@Entity('technical_assessments')
export class TechnicalAssessment {
  @PrimaryColumn('uuid', { name: 'proposal_id' })
  proposalId: string;

  @Column('text')
  verdict: Verdict;

  @Column('text', { default: '' })
  note: string;

  @Column('uuid', { name: 'assessed_by', nullable: true })
  assessedById: string | null;

  @Column('timestamptz', { name: 'created_at' })
  createdAt: Date;

  @Column('timestamptz', { name: 'updated_at' })
  updatedAt: Date;
}
