// Seeds the demo studio's gear (idempotent: items are matched by name).
import type { DataSource } from 'typeorm';
import type { Seeder } from '../database/seeds/index.js';
import { DEMO_GEL_KIT, DEMO_LIGHTS, DEMO_MODIFIERS, findDemoOrganizationId } from './demo-gear.js';

export async function seedDemoGear(ds: DataSource, organizationId: string): Promise<void> {
  for (const l of DEMO_LIGHTS) {
    await ds.query(
      `INSERT INTO gear_lights (organization_id, name, guide_number, guide_number_unit, notes)
       VALUES ($1, $2, $3, $4, $5) ON CONFLICT (organization_id, name) DO NOTHING`,
      [organizationId, l.name, l.guideNumber, l.guideNumberUnit, l.notes],
    );
  }
  for (const m of DEMO_MODIFIERS) {
    await ds.query(
      `INSERT INTO gear_modifiers (organization_id, name, kind, loss_stops, beam_angle_deg, size, size_unit, notes)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8) ON CONFLICT (organization_id, name) DO NOTHING`,
      [organizationId, m.name, m.kind, m.lossStops, m.beamAngleDeg, m.size, m.sizeUnit, m.notes],
    );
  }
  const kit: { id: string }[] = await ds.query(
    `INSERT INTO gear_gel_kits (organization_id, name, notes) VALUES ($1, $2, $3)
     ON CONFLICT (organization_id, name) DO NOTHING RETURNING id`,
    [organizationId, DEMO_GEL_KIT.name, DEMO_GEL_KIT.notes],
  );
  const kitId = kit[0]?.id;
  if (!kitId) return; // the kit was there already: leave the studio's edits alone
  for (const [position, p] of DEMO_GEL_KIT.pieces.entries()) {
    await ds.query(
      `INSERT INTO gear_gel_pieces (kit_id, name, mired_shift, green_shift, loss_stops, position)
       VALUES ($1, $2, $3, $4, $5, $6)`,
      [kitId, p.name, p.miredShift, p.greenShift, p.lossStops, position],
    );
  }
}

export const gearSeeder: Seeder = {
  name: 'gear',
  run: async (ds) => {
    const org = await findDemoOrganizationId(ds);
    if (org) await seedDemoGear(ds, org);
  },
};
