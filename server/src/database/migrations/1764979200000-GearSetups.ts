import { MigrationInterface, QueryRunner } from 'typeorm';

/** The studio's gear (lights, modifiers, gel kits and their pieces) and saved dusk setups. */
export class GearSetups1764979200000 implements MigrationInterface {
  name = 'GearSetups1764979200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE gear_lights (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        name text NOT NULL,
        guide_number double precision NOT NULL,
        guide_number_unit text NOT NULL,
        meter_aperture double precision,
        meter_distance double precision,
        meter_distance_unit text,
        meter_iso double precision,
        meter_power_fraction double precision,
        notes text,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_gear_lights_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_gear_lights_org_name ON gear_lights (organization_id, name)`,
    );

    await q.query(`
      CREATE TABLE gear_modifiers (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        name text NOT NULL,
        kind text,
        loss_stops double precision NOT NULL,
        beam_angle_deg double precision,
        size double precision,
        size_unit text,
        notes text,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_gear_modifiers_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_gear_modifiers_org_name ON gear_modifiers (organization_id, name)`,
    );

    await q.query(`
      CREATE TABLE gear_gel_kits (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        name text NOT NULL,
        notes text,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_gear_gel_kits_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_gear_gel_kits_org_name ON gear_gel_kits (organization_id, name)`,
    );

    await q.query(`
      CREATE TABLE gear_gel_pieces (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        kit_id uuid NOT NULL,
        name text NOT NULL,
        mired_shift double precision NOT NULL,
        green_shift double precision NOT NULL,
        loss_stops double precision NOT NULL,
        position integer NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_gear_gel_pieces_kit FOREIGN KEY (kit_id)
          REFERENCES gear_gel_kits (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_gear_gel_pieces_kit_name ON gear_gel_pieces (kit_id, name)`,
    );

    await q.query(`
      CREATE TABLE setups (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        name text NOT NULL,
        venue text,
        notes text,
        shoot_date date NOT NULL,
        time_zone text NOT NULL,
        inputs jsonb NOT NULL,
        resolved_inputs jsonb NOT NULL,
        plan jsonb NOT NULL,
        created_by_user_id uuid,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_setups_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE,
        CONSTRAINT fk_setups_created_by FOREIGN KEY (created_by_user_id)
          REFERENCES users (id) ON DELETE SET NULL
      )`);
    await q.query(`CREATE INDEX ix_setups_org_created ON setups (organization_id, created_at, id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS setups`);
    await q.query(`DROP TABLE IF EXISTS gear_gel_pieces`);
    await q.query(`DROP TABLE IF EXISTS gear_gel_kits`);
    await q.query(`DROP TABLE IF EXISTS gear_modifiers`);
    await q.query(`DROP TABLE IF EXISTS gear_lights`);
  }
}
