import { HttpStatus } from '@nestjs/common';
import type { DataSource, EntityManager } from 'typeorm';
import { AppError, conflict } from '../common/errors/app-error.js';

export const pgCode = (error: unknown): string | undefined =>
  (error as { driverError?: { code?: string } })?.driverError?.code ??
  (error as { code?: string })?.code;

/** The 409 when a concurrent writer took the time between our read and our write. */
export const concurrentClash = () =>
  conflict('RUN_CLASH', 'Another run was placed in the same time meanwhile; reload and try again');

/**
 * The 409 for a run that would overlap another, naming the other run (its proposal and UTC times):
 * the exclusion constraint itself says nothing a person can act on. null when the time is free.
 */
export async function findClash(
  db: DataSource | EntityManager,
  startsAt: string,
  endsAt: string,
  exceptId: string | null,
): Promise<AppError | null> {
  const rows: Array<{ id: string; reference: string; starts_at: Date; ends_at: Date }> =
    await db.query(
      `SELECT r.id, p.reference, r.starts_at, r.ends_at
         FROM runs r
         JOIN proposal_observations o ON o.id = r.observation_id
         JOIN proposals p ON p.id = o.proposal_id
        WHERE tstzrange(r.starts_at, r.ends_at) && tstzrange($1, $2)
          AND ($3::uuid IS NULL OR r.id <> $3)
        ORDER BY r.starts_at LIMIT 1`,
      [startsAt, endsAt, exceptId],
    );
  const other = rows[0];
  if (!other) return null;
  return new AppError(
    HttpStatus.CONFLICT,
    'RUN_CLASH',
    `The run would overlap the run of ${other.reference} from ${other.starts_at.toISOString()} to ${other.ends_at.toISOString()} (UTC)`,
    [{ path: 'startsAt', message: `Overlaps the run of ${other.reference} (${other.id})` }],
  );
}
