import 'reflect-metadata';
import { DataSource, type DataSourceOptions } from 'typeorm';
import { migrations } from '../../../../migrations/index.js';
import { entities } from './entities.js';

/**
 * The one DataSource definition, used by the Nest app (through TypeOrmModule) and by the migration
 * CLI. Schema changes only ever come from migrations: synchronize stays off.
 */
export function dataSourceOptions(databaseUrl: string): DataSourceOptions {
  return {
    type: 'postgres',
    url: databaseUrl,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    extra: { max: 20, connectionTimeoutMillis: 5000 },
  };
}

/** For the TypeORM CLI (`typeorm -d dist/apps/api/src/database/data-source.js`). */
export default new DataSource(dataSourceOptions(process.env.DATABASE_URL ?? ''));
