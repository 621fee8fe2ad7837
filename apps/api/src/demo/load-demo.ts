import type { DataSource } from 'typeorm';
import { loadDemoArchive } from './demo-archive.js';
import { loadDemoCalls } from './demo-calls.js';
import type { DemoContext } from './demo-context.js';
import { loadDemoObservatory } from './demo-observatory.js';
import { loadDemoProposals } from './demo-proposals.js';
import { loadDemoReviews } from './demo-reviews.js';
import { loadDemoUsers } from './demo-users.js';

export const DEMO_MARKER = 'demo_loaded_at';

/** The demo's sections, in order; each feature adds its own. */
const SECTIONS = [
  loadDemoUsers,
  loadDemoObservatory,
  loadDemoCalls,
  loadDemoProposals,
  loadDemoReviews,
  loadDemoArchive,
];

export async function loadDemo(
  dataSource: DataSource,
  options: { password: string; now?: Date },
): Promise<void> {
  const context: DemoContext = {
    now: options.now ?? new Date(),
    password: options.password,
    users: new Map(),
  };
  await dataSource.transaction(async (manager) => {
    for (const section of SECTIONS) await section(manager, context);
    await manager.query(
      `INSERT INTO app_meta (key, value) VALUES ($1, to_jsonb($2::text))
       ON CONFLICT (key) DO UPDATE SET value = EXCLUDED.value, updated_at = now()`,
      [DEMO_MARKER, context.now.toISOString()],
    );
  });
}

export async function demoLoaded(dataSource: DataSource): Promise<boolean> {
  const rows: unknown[] = await dataSource.query('SELECT 1 FROM app_meta WHERE key = $1', [
    DEMO_MARKER,
  ]);
  return rows.length > 0;
}

/** Empties every table the migrations made (not the migrations' own record) before a reload. */
export async function clearAll(dataSource: DataSource): Promise<void> {
  const tables: { tablename: string }[] = await dataSource.query(
    `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'migrations'`,
  );
  if (tables.length === 0) return;
  await dataSource.query(
    `TRUNCATE ${tables.map((t) => `"${t.tablename}"`).join(', ')} RESTART IDENTITY CASCADE`,
  );
}
