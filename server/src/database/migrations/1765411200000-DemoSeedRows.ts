import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The demo seeder's record of the rows it wrote: one per organisation, kind and demo key, with
 * the row's id and the version (content fingerprint) of the demo definition it was written from.
 * A row the seeder did not write has no record, so a re-seed never touches it; a record whose
 * row is gone means the studio deleted it, and the seeder leaves it deleted.
 */
export class DemoSeedRows1765411200000 implements MigrationInterface {
  name = 'DemoSeedRows1765411200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE demo_seed_rows (
        organization_id uuid NOT NULL,
        kind text NOT NULL,
        demo_key text NOT NULL,
        row_id uuid NOT NULL,
        version text NOT NULL,
        seeded_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT pk_demo_seed_rows PRIMARY KEY (organization_id, kind, demo_key),
        CONSTRAINT fk_demo_seed_rows_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS demo_seed_rows`);
  }
}
