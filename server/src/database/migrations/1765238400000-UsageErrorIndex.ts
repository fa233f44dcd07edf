import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The latest failed calls of an organisation (the console's "Recent errors", `outcome=error`)
 * without reading past its successful ones: a partial index over 4xx/5xx events only, created on
 * every monthly partition by PostgreSQL.
 */
export class UsageErrorIndex1765238400000 implements MigrationInterface {
  name = 'UsageErrorIndex1765238400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE INDEX IF NOT EXISTS ix_usage_events_org_errors
         ON usage_events (organization_id, occurred_at DESC, id DESC) WHERE status >= 400`,
    );
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX IF EXISTS ix_usage_events_org_errors`);
  }
}
