// Jest global setup: a real PostgreSQL (the test script's throwaway cluster, or a reusable local
// one under .data/test-postgres) and a fresh database per run.
import path from 'node:path';

export default async function globalSetup() {
  const root = path.resolve(__dirname, '../../..');
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const pg = require(
    path.join(root, 'scripts/lib/pg.mjs'),
  ) as typeof import('../../../scripts/lib/pg.mjs');
  let url = process.env.TEST_DATABASE_URL;
  if (!url) {
    const c = pg.cluster({
      dir: process.env.TEST_PG_DIR ?? path.join(root, '.data/test-postgres'),
      port: Number(process.env.TEST_PG_PORT ?? 54330),
      fast: true,
      log: () => undefined,
    });
    c.start();
    const name = `lw_test_${Date.now().toString(36)}_${process.pid}`;
    url = c.createDatabase(name);
    process.env.TEST_DATABASE_URL = url;
  }
  // Migrations run from bootApp()/migrate() (global setup bypasses Jest's module mapping).
}
