import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The tables every feature stands on: accounts, sessions, the outbox, the audit log. */
export class Foundation1764626400000 implements MigrationInterface {
  name = 'Foundation1764626400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE app_meta (
        key text PRIMARY KEY,
        value jsonb NOT NULL,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL UNIQUE CHECK (email = lower(email)),
        name text NOT NULL,
        affiliation text NOT NULL,
        country text NOT NULL,
        orcid text,
        password_hash text NOT NULL,
        email_verified_at timestamptz,
        roles text[] NOT NULL DEFAULT '{}',
        science_categories text[] NOT NULL DEFAULT '{}',
        active boolean NOT NULL DEFAULT true,
        session_epoch int NOT NULL DEFAULT 0,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE audit_events (
        id bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
        at timestamptz NOT NULL DEFAULT now(),
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        action text NOT NULL,
        subject_type text,
        subject_id text,
        details jsonb NOT NULL DEFAULT '{}',
        ip text
      )`);
    await q.query(`CREATE INDEX audit_events_subject ON audit_events (subject_type, subject_id)`);
    await q.query(`CREATE INDEX audit_events_at ON audit_events (at DESC)`);
    await q.query(`
      CREATE TABLE outbox_messages (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        created_at timestamptz NOT NULL DEFAULT now(),
        to_address text NOT NULL,
        subject text NOT NULL,
        text text NOT NULL,
        html text,
        attachments jsonb NOT NULL DEFAULT '[]',
        kind text NOT NULL,
        attempts int NOT NULL DEFAULT 0,
        next_attempt_at timestamptz NOT NULL DEFAULT now(),
        last_error text,
        sent_at timestamptz
      )`);
    await q.query(
      `CREATE INDEX outbox_due ON outbox_messages (next_attempt_at) WHERE sent_at IS NULL`,
    );
    // The session store's table, as connect-pg-simple documents it (its table.sql).
    await q.query(`
      CREATE TABLE session (
        sid varchar NOT NULL COLLATE "default" PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX "IDX_session_expire" ON session (expire)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE session`);
    await q.query(`DROP TABLE outbox_messages`);
    await q.query(`DROP TABLE audit_events`);
    await q.query(`DROP TABLE users`);
    await q.query(`DROP TABLE app_meta`);
  }
}
