import { MigrationInterface, QueryRunner } from 'typeorm';

/** Test frames: metadata and analysis (the originals and thumbnails are in object storage). */
export class Frames1764892800000 implements MigrationInterface {
  name = 'Frames1764892800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE frames (
        id uuid NOT NULL PRIMARY KEY,
        organization_id uuid NOT NULL,
        uploaded_by_user_id uuid,
        api_key_id uuid,
        file_name text,
        content_type text NOT NULL,
        byte_size integer NOT NULL,
        sha256 text NOT NULL,
        width integer NOT NULL,
        height integer NOT NULL,
        object_key text NOT NULL,
        thumbnail_key text NOT NULL,
        exif jsonb NOT NULL,
        analysis jsonb NOT NULL,
        cct_kelvin double precision,
        mired_offset double precision,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_frames_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX ix_frames_org_created ON frames (organization_id, created_at, id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS frames`);
  }
}
