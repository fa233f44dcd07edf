import { MigrationInterface, QueryRunner } from 'typeorm';

/** Per-user console preferences: metres or feet for distances (follows the person, not the browser). */
export class UserPreferences1765152000000 implements MigrationInterface {
  name = 'UserPreferences1765152000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE users
        ADD COLUMN length_unit text NOT NULL DEFAULT 'm' CHECK (length_unit IN ('m', 'ft'))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN IF EXISTS length_unit`);
  }
}
