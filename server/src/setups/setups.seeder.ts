// Seeds the demo studio's saved setups (idempotent: matched by name). Plans are computed now,
// by the same planner as the API, from inputs with fixed dates.
import type { DataSource } from 'typeorm';
import type { Seeder } from '../database/seeds/index.js';
import { DEMO_MEMBERS } from '../auth/accounts.seeder.js';
import { findDemoOrganizationId } from '../gear/demo-gear.js';
import { GelKitEntity } from '../gear/entities/gel-kit.entity.js';
import { LightEntity } from '../gear/entities/light.entity.js';
import { ModifierEntity } from '../gear/entities/modifier.entity.js';
import { GearReferenceResolver } from '../gear/gear-reference.resolver.js';
import { GelKitsService } from '../gear/gel-kits.service.js';
import { LightsService } from '../gear/lights.service.js';
import { ModifiersService } from '../gear/modifiers.service.js';
import { DEMO_SETUPS, type DemoGearIds } from './demo-setups.js';
import { SetupPlanner } from './setup-planner.service.js';

/** The demo studio's photographer saved them. */
const PHOTOGRAPHER_ID = DEMO_MEMBERS.find((m) => m.role === 'photographer')?.id ?? null;

async function idOf(ds: DataSource, table: string, organizationId: string, name: string) {
  const rows: { id: string }[] = await ds.query(
    `SELECT id FROM ${table} WHERE organization_id = $1 AND name = $2`,
    [organizationId, name],
  );
  return rows[0]?.id ?? null;
}

export async function seedDemoSetups(ds: DataSource, organizationId: string): Promise<void> {
  const ids = {
    keyLight: await idOf(ds, 'gear_lights', organizationId, 'Key strobe A'),
    rimLight: await idOf(ds, 'gear_lights', organizationId, 'Rim speedlight'),
    octa: await idOf(ds, 'gear_modifiers', organizationId, '90 cm octa'),
    grid: await idOf(ds, 'gear_modifiers', organizationId, 'Grid 20°'),
    gelKit: await idOf(ds, 'gear_gel_kits', organizationId, 'Studio gel kit'),
  };
  if (Object.values(ids).some((v) => v === null)) return; // the studio removed demo gear
  const planner = new SetupPlanner(
    new GearReferenceResolver(
      new LightsService(ds.getRepository(LightEntity)),
      new ModifiersService(ds.getRepository(ModifierEntity)),
      new GelKitsService(ds.getRepository(GelKitEntity), ds),
    ),
  );
  for (const demo of DEMO_SETUPS) {
    if (await idOf(ds, 'setups', organizationId, demo.name)) continue;
    const c = await planner.compute(organizationId, demo.inputs(ids as DemoGearIds));
    await ds.query(
      `INSERT INTO setups (organization_id, name, venue, notes, shoot_date, time_zone, inputs,
         resolved_inputs, plan, created_by_user_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9,
         (SELECT id FROM users WHERE id = $10))`,
      [
        organizationId,
        demo.name,
        demo.venue,
        demo.notes,
        c.date,
        c.timeZone,
        JSON.stringify(c.inputs),
        JSON.stringify(c.resolvedInputs),
        JSON.stringify(c.plan),
        PHOTOGRAPHER_ID,
      ],
    );
  }
}

export const setupsSeeder: Seeder = {
  name: 'setups',
  run: async (ds) => {
    const org = await findDemoOrganizationId(ds);
    if (org) await seedDemoSetups(ds, org);
  },
};
