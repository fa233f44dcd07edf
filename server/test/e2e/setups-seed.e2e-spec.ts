// The demo studio's gear and saved setups: idempotent seeding, invented generic gear, and plans
// that are exactly what the shared planner computes from the stored (resolved) inputs.
import type { DataSource } from 'typeorm';
import {
  GEL_CATALOGUE,
  planDuskSetup,
  type DuskSetupInput,
  type DuskSetupPlan,
} from '@lumenwright/shared';
import { accountsSeeder, DEMO_MEMBERS, DEMO_ORG_ID } from '../../src/auth/accounts.seeder.js';
import { gearSeeder } from '../../src/gear/gear.seeder.js';
import { setupsSeeder } from '../../src/setups/setups.seeder.js';
import { renderShotSheet } from '../../src/setups/sheet/shot-sheet.js';
import { migrate, openDataSource } from '../setup/db.js';

describe('gear and setups: demo seed', () => {
  let db: DataSource;
  beforeAll(async () => {
    await migrate();
    db = await openDataSource();
  }, 60000);
  afterAll(async () => {
    await db?.destroy();
  });

  const counts = async () =>
    (
      await db.query(
        `SELECT (SELECT count(*) FROM gear_lights WHERE organization_id = $1)::int AS lights,
                (SELECT count(*) FROM gear_modifiers WHERE organization_id = $1)::int AS modifiers,
                (SELECT count(*) FROM gear_gel_pieces p JOIN gear_gel_kits k ON k.id = p.kit_id
                  WHERE k.organization_id = $1)::int AS pieces,
                (SELECT count(*) FROM setups WHERE organization_id = $1)::int AS setups`,
        [DEMO_ORG_ID],
      )
    )[0];

  it('seeds twice without duplicating anything', async () => {
    await accountsSeeder.run(db);
    for (const s of [gearSeeder, setupsSeeder]) await s.run(db);
    const first = await counts();
    for (const s of [gearSeeder, setupsSeeder]) await s.run(db);
    expect(await counts()).toEqual(first);
    expect(first).toEqual({ lights: 2, modifiers: 2, pieces: GEL_CATALOGUE.length, setups: 2 });
  });

  it('stores plans equal to the planner’s output for the resolved inputs, saved by the demo photographer', async () => {
    // Read straight from the database: signing in as a demo member would add to the demo
    // studio's audit history, which the accounts seed test counts.
    const rows: {
      name: string;
      resolved_inputs: DuskSetupInput;
      plan: DuskSetupPlan;
      inputs: Record<string, unknown>;
      created_by_user_id: string | null;
    }[] = await db.query(
      `SELECT name, inputs, resolved_inputs, plan, created_by_user_id FROM setups
        WHERE organization_id = $1 ORDER BY name`,
      [DEMO_ORG_ID],
    );
    expect(rows).toHaveLength(2);
    const photographer = DEMO_MEMBERS.find((m) => m.role === 'photographer')!;
    for (const r of rows) {
      expect(r.plan).toEqual(JSON.parse(JSON.stringify(planDuskSetup(r.resolved_inputs))));
      expect(r.created_by_user_id).toBe(photographer.id);
      const sheet = renderShotSheet({
        name: r.name,
        venue: null,
        notes: null,
        date: r.plan.twilight.date,
        timeZone: r.plan.twilight.timeZone,
        author: photographer.name,
        plan: r.plan,
        resolvedInputs: r.resolved_inputs as unknown as Record<string, unknown>,
      });
      expect(sheet).toContain('<svg');
    }
    // One of them names the studio's gear by id.
    expect(rows.some((r) => typeof r.inputs.gelKitId === 'string')).toBe(true);
    // One lets the background go darker: its usable window ends later than at a fixed bias.
    const floored = rows.filter((r) => r.resolved_inputs.camera?.biasFloorStops !== undefined);
    expect(floored).toHaveLength(1);
    const r = floored[0]!;
    const { biasFloorStops: _floor, ...fixedCamera } = r.resolved_inputs.camera!;
    const fixed = planDuskSetup({ ...r.resolved_inputs, camera: fixedCamera });
    expect(r.plan.suggestedMinutes.some((m) => m.biasLoweredByStops > 0)).toBe(true);
    expect(Date.parse(r.plan.window.usableEnd!)).toBeGreaterThan(
      Date.parse(fixed.window.usableEnd!),
    );
    const lights: { name: string }[] = await db.query(
      `SELECT name FROM gear_lights WHERE organization_id = $1 ORDER BY name`,
      [DEMO_ORG_ID],
    );
    expect(lights.map((l) => l.name)).toEqual(['Key strobe A', 'Rim speedlight']);
  });
});
