// One place that knows the entity and migration lists; used by the app, the CLI bins and tests.
import type { DataSourceOptions } from 'typeorm';
import { SnakeNamingStrategy } from './naming.strategy.js';
import { ENTITIES } from './entities.js';
import { MIGRATIONS } from './migrations/index.js';

export function typeormOptions(databaseUrl: string): DataSourceOptions {
  return {
    type: 'postgres',
    url: databaseUrl,
    entities: ENTITIES,
    migrations: MIGRATIONS,
    namingStrategy: new SnakeNamingStrategy(),
    synchronize: false,
    migrationsRun: false,
    migrationsTransactionMode: 'each',
    extra: { max: 20, connectionTimeoutMillis: 5000, application_name: 'lumenwright' },
  };
}
