import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One uploaded science case of a proposal. Uploads are never overwritten: a new one supersedes
 * the current one, so a submitted version can still name the file it was made from. The bytes
 * live in PostgreSQL, so every API process sees them and a submission is one transaction.
 */
@Entity('documents')
export class ScienceCaseDocument {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column('uuid', { name: 'proposal_id' })
  proposalId: string;

  /** Sanitised (see sanitiseFilename); safe for a Content-Disposition header via contentDisposition. */
  @Column('text')
  filename: string;

  /** Always application/pdf: the bytes were judged, not the name or the declared type. */
  @Column('text', { name: 'content_type' })
  contentType: string;

  @Column('int', { name: 'size_bytes' })
  sizeBytes: number;

  @Column('int')
  pages: number;

  /** Lower-case hex SHA-256 of the content. */
  @Column('text')
  sha256: string;

  /** Not read unless asked for (ScienceCaseService.content): lists need only the metadata. */
  @Column('bytea', { select: false })
  content?: Buffer;

  @Column('uuid', { name: 'uploaded_by' })
  uploadedBy: string;

  @Column('timestamptz', { name: 'uploaded_at' })
  uploadedAt: Date;

  /** Set when a newer upload replaced this one; null for the proposal's current science case. */
  @Column('timestamptz', { name: 'superseded_at', nullable: true })
  supersededAt: Date | null;
}
