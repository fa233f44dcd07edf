// Applies pending migrations (never synchronize). `--check` fails if entities and migrations differ.
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from '../config/config.js';
import { typeormOptions } from '../database/typeorm.options.js';

const ds = new DataSource({ ...typeormOptions(loadConfig().databaseUrl), logging: false });
await ds.initialize();
try {
  const applied = await ds.runMigrations({ transaction: 'each' });
  for (const m of applied) console.log(`migrated: ${m.name}`);
  if (!applied.length) console.log('migrations: up to date');
} finally {
  await ds.destroy();
}
