import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import pg from 'pg';
import { createTestApp, type TestApp } from './support/app.js';
import { makeUser } from './support/factories.js';

const run = promisify(execFile);
const ROOT = fileURLToPath(new URL('../../..', import.meta.url));

/** Every table's row count and an md5 of its rows in a stable order: equal means same data. */
async function fingerprint(url: string): Promise<Record<string, string>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const { rows: tables } = await client.query<{ tablename: string }>(
      `SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`,
    );
    const result: Record<string, string> = {};
    for (const { tablename } of tables) {
      const { rows } = await client.query<{ n: string; digest: string | null }>(
        `SELECT count(*)::text AS n, md5(string_agg(t::text, '|' ORDER BY t::text)) AS digest FROM "${tablename}" t`,
      );
      result[tablename] = `${rows[0]?.n}:${rows[0]?.digest ?? ''}`;
    }
    return result;
  } finally {
    await client.end();
  }
}

describe('npm run backup / npm run restore', () => {
  let t: TestApp;
  let dir: string;
  const source = process.env.DATABASE_URL as string;
  const target = new URL(source);
  target.pathname = '/skyhours_restore_test';

  beforeAll(async () => {
    t = await createTestApp();
    dir = mkdtempSync(join(tmpdir(), 'skyhours-backup-'));
    await t.dataSource.query('DROP DATABASE IF EXISTS skyhours_restore_test');
    await t.dataSource.query('CREATE DATABASE skyhours_restore_test');
  });
  afterAll(async () => {
    await t.dataSource.query('DROP DATABASE IF EXISTS skyhours_restore_test WITH (FORCE)');
    await t.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('restores into an empty database exactly what was backed up', async () => {
    await makeUser(t.dataSource, { name: 'Backup Round-Trip Person' });
    const file = join(dir, 'round-trip.dump');
    await run(process.execPath, [join(ROOT, 'scripts/backup.mjs'), file], {
      env: { ...process.env, DATABASE_URL: source },
    });
    expect(statSync(file).size).toBeGreaterThan(0);
    const before = await fingerprint(source);

    await run(process.execPath, [join(ROOT, 'scripts/restore.mjs'), file], {
      env: { ...process.env, DATABASE_URL: target.toString() },
    });
    const after = await fingerprint(target.toString());

    expect(Object.keys(before)).toContain('users');
    expect(after).toEqual(before);
  }, 120_000);
});
