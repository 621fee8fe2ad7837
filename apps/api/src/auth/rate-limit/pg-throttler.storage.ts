import type { ThrottlerStorage } from '@nestjs/throttler';
import type { DataSource } from 'typeorm';

export interface CounterState {
  totalHits: number;
  timeToExpire: number;
  isBlocked: boolean;
  timeToBlockExpire: number;
}

interface Row {
  hits: number;
  time_to_expire: number;
  is_blocked: boolean;
  time_to_block_expire: number;
}

const PRUNE_EVERY_MS = 10 * 60_000;

/**
 * Rate-limit counters in PostgreSQL, so a limit holds across every API process: a fixed
 * window per key, and once the hits pass the limit, a block for `blockDuration`. One upsert does
 * the whole step, under the row's lock, so concurrent requests count exactly.
 * It implements @nestjs/throttler's storage interface (`ttl` and `blockDuration` in milliseconds,
 * answers in seconds), though the package itself is not loaded: it is CommonJS requiring the
 * ESM-only @nestjs/common 12, which Node 20 manages but jest does not. See RateLimitGuard.
 */
export class PgThrottlerStorage implements ThrottlerStorage {
  private lastPrune = 0;

  constructor(private readonly dataSource: DataSource) {}

  async increment(
    key: string,
    ttl: number,
    limit: number,
    blockDuration: number,
  ): Promise<CounterState> {
    await this.pruneNowAndThen();
    const rows: Row[] = await this.dataSource.query(
      `INSERT INTO rate_limit_counters AS c (key, hits, window_ends_at, blocked_until)
       VALUES ($1, 1, now() + $2::float8 * interval '1 millisecond',
               CASE WHEN 1 > $3 THEN now() + $4::float8 * interval '1 millisecond' END)
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE
           WHEN c.blocked_until > now() THEN c.hits
           WHEN c.window_ends_at <= now() OR c.blocked_until IS NOT NULL THEN 1
           ELSE c.hits + 1 END,
         window_ends_at = CASE
           WHEN c.blocked_until > now() THEN c.window_ends_at
           WHEN c.window_ends_at <= now() OR c.blocked_until IS NOT NULL THEN EXCLUDED.window_ends_at
           ELSE c.window_ends_at END,
         blocked_until = CASE
           WHEN c.blocked_until > now() THEN c.blocked_until
           WHEN c.window_ends_at <= now() OR c.blocked_until IS NOT NULL THEN EXCLUDED.blocked_until
           WHEN c.hits + 1 > $3 THEN now() + $4::float8 * interval '1 millisecond'
           ELSE NULL END
       RETURNING ${RETURNED}`,
      [key, ttl, limit, blockDuration],
    );
    return toState(rows[0] as Row);
  }

  /** The key's state without counting a hit (null when the key has no live window). */
  async peek(key: string): Promise<CounterState | null> {
    const rows: Row[] = await this.dataSource.query(
      `SELECT ${RETURNED} FROM rate_limit_counters
        WHERE key = $1 AND (window_ends_at > now() OR blocked_until > now())`,
      [key],
    );
    return rows[0] ? toState(rows[0]) : null;
  }

  async reset(key: string): Promise<void> {
    await this.dataSource.query(`DELETE FROM rate_limit_counters WHERE key = $1`, [key]);
  }

  /** Drops windows that are over, at most every few minutes per process. */
  private async pruneNowAndThen(): Promise<void> {
    if (Date.now() - this.lastPrune < PRUNE_EVERY_MS) return;
    this.lastPrune = Date.now();
    await this.dataSource.query(
      `DELETE FROM rate_limit_counters
        WHERE window_ends_at < now() AND (blocked_until IS NULL OR blocked_until < now())`,
    );
  }
}

const RETURNED = `hits,
  GREATEST(0, CEIL(EXTRACT(EPOCH FROM (window_ends_at - now()))))::int AS time_to_expire,
  COALESCE(blocked_until > now(), false) AS is_blocked,
  GREATEST(0, COALESCE(CEIL(EXTRACT(EPOCH FROM (blocked_until - now()))), 0))::int AS time_to_block_expire`;

const toState = (row: Row): CounterState => ({
  totalHits: row.hits,
  timeToExpire: row.time_to_expire,
  isBlocked: row.is_blocked,
  timeToBlockExpire: row.time_to_block_expire,
});
