import { MigrationInterface, QueryRunner } from 'typeorm';

/** Extensions the schema relies on: citext for case-insensitive e-mail addresses. */
export class Init1764633600000 implements MigrationInterface {
  name = 'Init1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS citext`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP EXTENSION IF EXISTS citext`);
  }
}
