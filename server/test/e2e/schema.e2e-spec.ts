// Migrations are the only way the schema changes: after applying them all, TypeORM must find
// nothing left to do for the entities (a forgotten or hand-edited migration fails here).
import { DataSource } from 'typeorm';
import { migrate, openDataSource } from '../setup/db.js';

describe('database schema', () => {
  let ds: DataSource;
  beforeAll(async () => {
    await migrate();
    ds = await openDataSource();
  });
  afterAll(async () => {
    await ds.destroy();
  });

  it('has no pending migrations', async () => {
    expect(await ds.showMigrations()).toBe(false);
  });

  it('matches the entities exactly (no migration left to generate)', async () => {
    const pending = await ds.driver.createSchemaBuilder().log();
    expect(pending.upQueries.map((q) => q.query)).toEqual([]);
  });
});
