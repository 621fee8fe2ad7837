/**
 * Runs (or with `revert`, undoes the last of) the migrations against DATABASE_URL.
 * Used by `npm start`, `npm test` and `npm run migrate`.
 */
import { DataSource } from 'typeorm';
import { dataSourceOptions } from './data-source.js';

const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(2);
}
const dataSource = new DataSource(dataSourceOptions(url));
await dataSource.initialize();
try {
  if (process.argv[2] === 'revert') {
    await dataSource.undoLastMigration({ transaction: 'each' });
  } else {
    const ran = await dataSource.runMigrations({ transaction: 'each' });
    console.log(
      ran.length
        ? `migrations applied: ${ran.map((m) => m.name).join(', ')}`
        : 'database schema up to date',
    );
  }
} finally {
  await dataSource.destroy();
}
