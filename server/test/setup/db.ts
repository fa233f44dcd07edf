// Direct database access for tests: migrations (idempotent) and a DataSource for assertions.
import { DataSource } from 'typeorm';
import { typeormOptions } from '../../src/database/typeorm.options.js';

let migrated = false;

export function testDatabaseUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set (the Jest global setup sets it)');
  return url;
}

export async function openDataSource(): Promise<DataSource> {
  const ds = new DataSource({ ...typeormOptions(testDatabaseUrl()), logging: false });
  return ds.initialize();
}

export async function migrate(): Promise<void> {
  if (migrated) return;
  const ds = await openDataSource();
  try {
    await ds.runMigrations({ transaction: 'each' });
    migrated = true;
  } finally {
    await ds.destroy();
  }
}
