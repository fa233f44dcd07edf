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
import { DEMO_SETUPS, demoSetupVersion, GEAR_TOKENS } from '../../src/setups/demo-setups.js';
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

// Earlier definitions of the demo jetty setup, as the repository history has them (the first
// seeded one, and the one before the background was allowed 2 stops under). Values inline, so
// the resolved inputs are the inputs.
const PLACE = { latitude: 54.21, longitude: -2.47, timeZone: 'Europe/London', elevation: 120 };
const JETTY_COMMON = {
  ...PLACE,
  date: '2026-12-05',
  sky: 'partly-cloudy',
  rim: { guideNumber: 36, distanceBehind: 2.5, lightHeight: 1, beamAngleDeg: 40 },
  backgroundDistance: 25,
  conditions: { windKmh: 24, nearWater: true, coldFogOrHaze: true },
};
const JETTY_V1 = {
  ...JETTY_COMMON,
  camera: { aperture: 2.8, isoMax: 6400, support: 'tripod' },
  key: {
    guideNumber: 60,
    guideNumberUnit: 'm',
    distance: 2,
    modifier: 'softbox',
    modifierLossStops: 1.5,
  },
};
const JETTY_V2 = {
  ...JETTY_COMMON,
  camera: { aperture: 2.8, isoMax: 6400, support: 'tripod' },
  key: {
    guideNumber: 60,
    guideNumberUnit: 'm',
    distance: 4,
    modifier: 'softbox-double-diffusion',
    modifierLossStops: 2.5,
  },
};

describe('setups: demo versions on re-seed', () => {
  let db: DataSource;
  const jetty = DEMO_SETUPS.find((d) => d.key === 'winter-jetty')!;
  const terrace = DEMO_SETUPS.find((d) => d.key === 'terrace-engagement')!;
  const versionOf = (d: (typeof DEMO_SETUPS)[number], inputs: Record<string, unknown>) =>
    demoSetupVersion({ name: d.name, venue: d.venue, notes: d.notes, inputs }, GEAR_TOKENS);
  const current = (d: (typeof DEMO_SETUPS)[number]) => versionOf(d, d.inputs(GEAR_TOKENS));

  const recorded = async (key: string) =>
    (
      (await db.query(
        `SELECT row_id, version FROM demo_seed_rows
          WHERE organization_id = $1 AND kind = 'setup' AND demo_key = $2`,
        [DEMO_ORG_ID, key],
      )) as { row_id: string; version: string }[]
    )[0];
  const setup = async (id: string) =>
    (
      (await db.query(
        `SELECT id, name, venue, notes, inputs, resolved_inputs, plan, created_by_user_id,
                created_at, updated_at
           FROM setups WHERE id = $1`,
        [id],
      )) as {
        id: string;
        name: string;
        notes: string | null;
        inputs: Record<string, unknown>;
        resolved_inputs: DuskSetupInput;
        plan: DuskSetupPlan;
        updated_at: Date;
      }[]
    )[0];
  /** Stores old inputs and their plan in a demo row, as a seeder of that version wrote it. */
  const makeOld = async (id: string, inputs: Record<string, unknown>) => {
    const plan = planDuskSetup(inputs as unknown as DuskSetupInput);
    await db.query(`UPDATE setups SET inputs = $2, resolved_inputs = $2, plan = $3 WHERE id = $1`, [
      id,
      JSON.stringify(inputs),
      JSON.stringify(plan),
    ]);
    return plan;
  };
  let ownId: string;

  beforeAll(async () => {
    await migrate();
    db = await openDataSource();
    await accountsSeeder.run(db);
    for (const s of [gearSeeder, setupsSeeder]) await s.run(db);
  }, 60000);
  afterAll(async () => {
    await db?.destroy();
  });

  it('knows the earlier versions of the jetty setup from its history', () => {
    expect(jetty.earlierVersions).toEqual([versionOf(jetty, JETTY_V1), versionOf(jetty, JETTY_V2)]);
    expect(new Set(DEMO_SETUPS.map(current)).size).toBe(DEMO_SETUPS.length);
  });

  it('rewrites a demo setup recorded at an older version and leaves the studio’s own setup of the same name alone', async () => {
    const seeded = await recorded('winter-jetty');
    expect(seeded?.version).toBe(current(jetty));
    const oldPlan = await makeOld(seeded!.row_id, JETTY_V2);
    await db.query(
      `UPDATE demo_seed_rows SET version = $2 WHERE organization_id = $1 AND demo_key = 'winter-jetty'`,
      [DEMO_ORG_ID, versionOf(jetty, JETTY_V2)],
    );
    // The owner saved a setup under the same name (different background distance).
    const owner = DEMO_MEMBERS.find((m) => m.role === 'owner')!;
    const own = { ...JETTY_V2, backgroundDistance: 40 };
    const [row] = (await db.query(
      `INSERT INTO setups (organization_id, name, venue, notes, shoot_date, time_zone, inputs,
         resolved_inputs, plan, created_by_user_id)
       VALUES ($1, $2, NULL, 'our own', '2026-12-05', 'Europe/London', $3, $3, $4, $5)
       RETURNING id`,
      [
        DEMO_ORG_ID,
        jetty.name,
        JSON.stringify(own),
        JSON.stringify(planDuskSetup(own as unknown as DuskSetupInput)),
        owner.id,
      ],
    )) as { id: string }[];
    ownId = row!.id;
    const ownBefore = await setup(ownId);

    await setupsSeeder.run(db);

    const after = await setup(seeded!.row_id);
    expect(after?.inputs).toEqual(jetty.inputs(GEAR_TOKENS));
    expect(after?.resolved_inputs.camera?.biasFloorStops).toBe(-2);
    expect(after?.plan).toEqual(JSON.parse(JSON.stringify(planDuskSetup(after!.resolved_inputs))));
    // The fixed-bias plan ended its usable window earlier (see the first describe block).
    expect(Date.parse(after!.plan.window.usableEnd!)).toBeGreaterThan(
      Date.parse(oldPlan.window.usableEnd!),
    );
    expect(await recorded('winter-jetty')).toEqual({
      row_id: seeded!.row_id,
      version: current(jetty),
    });
    expect(await setup(ownId)).toEqual(ownBefore);

    // Once current, a re-seed writes nothing.
    await setupsSeeder.run(db);
    expect(await setup(seeded!.row_id)).toEqual(after);
  });

  it('takes over a row an earlier seeder wrote before versions were recorded, and only that row', async () => {
    const seeded = await recorded('winter-jetty');
    await makeOld(seeded!.row_id, JETTY_V1);
    await db.query(`DELETE FROM demo_seed_rows WHERE organization_id = $1 AND demo_key = $2`, [
      DEMO_ORG_ID,
      'winter-jetty',
    ]);
    const ownBefore = await setup(ownId);

    await setupsSeeder.run(db);

    expect(await recorded('winter-jetty')).toEqual({
      row_id: seeded!.row_id,
      version: current(jetty),
    });
    expect((await setup(seeded!.row_id))?.inputs).toEqual(jetty.inputs(GEAR_TOKENS));
    expect(await setup(ownId)).toEqual(ownBefore);
    const [n] = (await db.query(
      `SELECT count(*)::int AS n FROM setups WHERE organization_id = $1 AND name = $2`,
      [DEMO_ORG_ID, jetty.name],
    )) as { n: number }[];
    expect(n?.n).toBe(2);
  });

  it('leaves a demo setup the studio edited, and does not bring back one it deleted', async () => {
    const seeded = await recorded('terrace-engagement');
    // An older version is recorded, but the studio has since edited the notes.
    await db.query(
      `UPDATE demo_seed_rows SET version = $2 WHERE organization_id = $1 AND demo_key = $3`,
      [DEMO_ORG_ID, terrace.earlierVersions[0], 'terrace-engagement'],
    );
    await db.query(`UPDATE setups SET notes = 'Moved to the north lawn.' WHERE id = $1`, [
      seeded!.row_id,
    ]);
    const edited = await setup(seeded!.row_id);

    await setupsSeeder.run(db);
    expect(await setup(seeded!.row_id)).toEqual(edited);
    expect((await recorded('terrace-engagement'))?.version).toBe(terrace.earlierVersions[0]);

    await db.query(`DELETE FROM setups WHERE id = $1`, [seeded!.row_id]);
    await setupsSeeder.run(db);
    const [n] = (await db.query(
      `SELECT count(*)::int AS n FROM setups WHERE organization_id = $1 AND name = $2`,
      [DEMO_ORG_ID, terrace.name],
    )) as { n: number }[];
    expect(n?.n).toBe(0);
  });
});
