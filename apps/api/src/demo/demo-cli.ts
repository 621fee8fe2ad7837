/**
 * `load-if-new` (npm start: only into a database that never had the demo), `load`, or `reset`
 * (npm run demo:reset: empty every table, then load).
 */
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../database/data-source.js';
import { clearAll, demoLoaded, loadDemo } from './load-demo.js';

const mode = process.argv[2] ?? 'load-if-new';
const url = process.env.DATABASE_URL;
if (!url) {
  console.error('DATABASE_URL is not set');
  process.exit(2);
}
const dataSource = new DataSource(dataSourceOptions(url));
await dataSource.initialize();
try {
  if (mode === 'load-if-new' && (await demoLoaded(dataSource))) {
    console.log('demo data already loaded; keeping the data as it is');
  } else {
    if (mode === 'reset') await clearAll(dataSource);
    await loadDemo(dataSource, { password: process.env.DEMO_PASSWORD ?? 'skyhours-demo' });
    console.log('demo data loaded');
  }
} finally {
  await dataSource.destroy();
}
