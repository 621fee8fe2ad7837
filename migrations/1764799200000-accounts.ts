import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts: single-use e-mailed tokens (stored as SHA-256 hashes only), rate-limit counters shared by
 * every API process, and the time of each account's last sign-in.
 */
export class Accounts1764799200000 implements MigrationInterface {
  name = 'Accounts1764799200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE account_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        purpose text NOT NULL CHECK (purpose IN ('verify-email', 'reset-password')),
        token_hash text NOT NULL UNIQUE CHECK (token_hash ~ '^[0-9a-f]{64}$'),
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX account_tokens_user ON account_tokens (user_id, purpose)`);
    // One row per limited key (route, limit and tracker, hashed); a fixed window with a block.
    await q.query(`
      CREATE TABLE rate_limit_counters (
        key text PRIMARY KEY,
        hits int NOT NULL,
        window_ends_at timestamptz NOT NULL,
        blocked_until timestamptz
      )`);
    await q.query(
      `CREATE INDEX rate_limit_counters_window ON rate_limit_counters (window_ends_at)`,
    );
    await q.query(`ALTER TABLE users ADD COLUMN last_sign_in_at timestamptz`);
    await q.query(`CREATE INDEX audit_events_actor ON audit_events (actor_id, at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX audit_events_actor`);
    await q.query(`ALTER TABLE users DROP COLUMN last_sign_in_at`);
    await q.query(`DROP TABLE rate_limit_counters`);
    await q.query(`DROP TABLE account_tokens`);
  }
}
