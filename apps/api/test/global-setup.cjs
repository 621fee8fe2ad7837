/**
 * Runs once before the e2e suite: refuses a database whose name lacks "test" (the suite writes
 * freely), then applies the real migrations with the compiled migration runner.
 */
const { execFileSync } = require('node:child_process');
const { existsSync } = require('node:fs');
const { join } = require('node:path');

module.exports = async function globalSetup() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL must point at a test database (npm test sets it)');
  const name = new URL(url).pathname.slice(1);
  if (!/test/i.test(name))
    throw new Error(`Refusing to run e2e tests against "${name}": its name lacks "test"`);
  const migrate = join(__dirname, '../dist/apps/api/src/database/migrate.js');
  if (!existsSync(migrate)) throw new Error('Build the API first: npm run build -w @skyhours/api');
  execFileSync(process.execPath, [migrate], { stdio: 'inherit', env: process.env });
};
