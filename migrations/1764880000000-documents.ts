import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Uploaded science cases. proposal_id has no foreign key yet: the proposals table comes in a
 * later migration, which adds it. At most one row per proposal is current (not superseded).
 */
export class Documents1764880000000 implements MigrationInterface {
  name = 'Documents1764880000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE documents (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL,
        filename text NOT NULL CHECK (filename ~* '^.+\\.pdf$' AND length(filename) <= 255),
        content_type text NOT NULL,
        size_bytes int NOT NULL CHECK (size_bytes > 0),
        pages int NOT NULL CHECK (pages > 0),
        sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
        content bytea NOT NULL,
        uploaded_by uuid NOT NULL REFERENCES users(id),
        uploaded_at timestamptz NOT NULL DEFAULT now(),
        superseded_at timestamptz,
        CHECK (octet_length(content) = size_bytes)
      )`);
    // PDFs are compressed already: storing them without another compression pass saves CPU.
    await q.query(`ALTER TABLE documents ALTER COLUMN content SET STORAGE EXTERNAL`);
    await q.query(
      `CREATE UNIQUE INDEX documents_current ON documents (proposal_id) WHERE superseded_at IS NULL`,
    );
    await q.query(`CREATE INDEX documents_proposal ON documents (proposal_id, uploaded_at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE documents`);
  }
}
