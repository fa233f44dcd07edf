// Seeds the invented demo scenario idempotently (safe to run on every start).
import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from '../config/config.js';
import { typeormOptions } from '../database/typeorm.options.js';
import { SEEDERS } from '../database/seeds/index.js';

const config = loadConfig();
const ds = new DataSource({ ...typeormOptions(config.databaseUrl), logging: false });
await ds.initialize();
try {
  for (const s of SEEDERS) {
    await s.run(ds, config);
    console.log(`seeded: ${s.name}`);
  }
} finally {
  await ds.destroy();
}
