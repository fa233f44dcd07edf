// Seeds the demo studio's saved setups. Plans are computed now, by the same planner as the API,
// from inputs with fixed dates. Each row the seeder writes is recorded in demo_seed_rows with the
// version of its definition, so a re-seed after a definition changed rewrites that row, and only
// while it holds exactly what the seeder wrote: a setup the studio edited, deleted or made itself
// (even under a demo name) is never touched. One transaction under an advisory lock.
import type { DataSource, EntityManager } from 'typeorm';
import type { Seeder } from '../database/seeds/index.js';
import { findDemoRow, recordDemoRow } from '../database/seeds/demo-versions.js';
import { DEMO_MEMBERS } from '../auth/accounts.seeder.js';
import { findDemoOrganizationId } from '../gear/demo-gear.js';
import { GelKitEntity } from '../gear/entities/gel-kit.entity.js';
import { LightEntity } from '../gear/entities/light.entity.js';
import { ModifierEntity } from '../gear/entities/modifier.entity.js';
import { GearReferenceResolver } from '../gear/gear-reference.resolver.js';
import { GelKitsService } from '../gear/gel-kits.service.js';
import { LightsService } from '../gear/lights.service.js';
import { ModifiersService } from '../gear/modifiers.service.js';
import {
  DEMO_SETUPS,
  demoSetupVersion,
  GEAR_TOKENS,
  type DemoGearIds,
  type DemoSetupContent,
} from './demo-setups.js';
import { SetupPlanner } from './setup-planner.service.js';

/** The demo studio's photographer saved them. */
const PHOTOGRAPHER_ID = DEMO_MEMBERS.find((m) => m.role === 'photographer')?.id ?? null;

type DemoSetup = (typeof DEMO_SETUPS)[number];
type StoredSetup = DemoSetupContent & { id: string };

async function idOf(m: EntityManager, table: string, organizationId: string, name: string) {
  const rows: { id: string }[] = await m.query(
    `SELECT id FROM ${table} WHERE organization_id = $1 AND name = $2`,
    [organizationId, name],
  );
  return rows[0]?.id ?? null;
}

/** What the seeder did with each demo setup (for tests and the seed log). */
export type SeedOutcome = 'created' | 'updated' | 'current' | 'left';

export async function seedDemoSetups(
  ds: DataSource,
  m: EntityManager,
  organizationId: string,
): Promise<Record<string, SeedOutcome>> {
  const found = {
    keyLight: await idOf(m, 'gear_lights', organizationId, 'Key strobe A'),
    rimLight: await idOf(m, 'gear_lights', organizationId, 'Rim speedlight'),
    octa: await idOf(m, 'gear_modifiers', organizationId, '90 cm octa'),
    grid: await idOf(m, 'gear_modifiers', organizationId, 'Grid 20°'),
    gelKit: await idOf(m, 'gear_gel_kits', organizationId, 'Studio gel kit'),
  };
  if (Object.values(found).some((v) => v === null)) return {}; // the studio removed demo gear
  const ids = found as DemoGearIds;
  const planner = new SetupPlanner(
    new GearReferenceResolver(
      new LightsService(ds.getRepository(LightEntity)),
      new ModifiersService(ds.getRepository(ModifierEntity)),
      new GelKitsService(ds.getRepository(GelKitEntity), ds),
    ),
  );
  const read = async (where: string, value: string): Promise<StoredSetup[]> =>
    m.query(
      `SELECT id, name, venue, notes, inputs FROM setups WHERE organization_id = $1 AND ${where} = $2
        ORDER BY created_at, id`,
      [organizationId, value],
    );

  const write = async (demo: DemoSetup, rowId: string | null): Promise<string> => {
    const c = await planner.compute(organizationId, demo.inputs(ids));
    const values = [
      organizationId,
      demo.name,
      demo.venue,
      demo.notes,
      c.date,
      c.timeZone,
      JSON.stringify(c.inputs),
      JSON.stringify(c.resolvedInputs),
      JSON.stringify(c.plan),
    ];
    if (rowId) {
      await m.query(
        `UPDATE setups SET name = $2, venue = $3, notes = $4, shoot_date = $5, time_zone = $6,
           inputs = $7, resolved_inputs = $8, plan = $9, updated_at = now()
         WHERE organization_id = $1 AND id = $10`,
        [...values, rowId],
      );
      return rowId;
    }
    const rows: { id: string }[] = await m.query(
      `INSERT INTO setups (organization_id, name, venue, notes, shoot_date, time_zone, inputs,
         resolved_inputs, plan, created_by_user_id)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, (SELECT id FROM users WHERE id = $10))
       RETURNING id`,
      [...values, PHOTOGRAPHER_ID],
    );
    return rows[0]!.id;
  };

  const outcomes: Record<string, SeedOutcome> = {};
  for (const demo of DEMO_SETUPS) {
    const version = demoSetupVersion({ ...demo, inputs: demo.inputs(GEAR_TOKENS) }, GEAR_TOKENS);
    const record = async (rowId: string) =>
      recordDemoRow(m, organizationId, 'setup', demo.key, { rowId, version });
    const seeded = await findDemoRow(m, organizationId, 'setup', demo.key);
    if (seeded) {
      if (seeded.version === version) {
        outcomes[demo.key] = 'current';
        continue;
      }
      const [row] = await read('id', seeded.rowId);
      // Deleted by the studio, or edited since it was seeded: theirs now.
      if (!row || demoSetupVersion(row, ids) !== seeded.version) {
        outcomes[demo.key] = 'left';
        continue;
      }
      await record(await write(demo, row.id));
      outcomes[demo.key] = 'updated';
      continue;
    }
    // Not recorded: a row from a seeder before versions (it holds one of the definition's
    // versions exactly), a setup the studio made under that name, or nothing yet.
    const named = await read('name', demo.name);
    const known = new Set([version, ...demo.earlierVersions]);
    const legacy = named.find((r) => known.has(demoSetupVersion(r, ids)));
    if (legacy) {
      const current = demoSetupVersion(legacy, ids) === version;
      await record(current ? legacy.id : await write(demo, legacy.id));
      outcomes[demo.key] = current ? 'current' : 'updated';
    } else if (named.length) {
      outcomes[demo.key] = 'left'; // the studio's own setup by that name: no twin beside it
    } else {
      await record(await write(demo, null));
      outcomes[demo.key] = 'created';
    }
  }
  return outcomes;
}

export const setupsSeeder: Seeder = {
  name: 'setups',
  run: async (ds) => {
    const org = await findDemoOrganizationId(ds);
    if (!org) return;
    await ds.transaction(async (m) => {
      await m.query(`SELECT pg_advisory_xact_lock(hashtext('lumenwright:setups-seed'))`);
      await seedDemoSetups(ds, m, org);
    });
  },
};
