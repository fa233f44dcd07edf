// The demo studio's gear and saved setups: idempotent seeding, invented generic gear, and plans
// that are exactly what the shared planner computes from the stored (resolved) inputs.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { GEL_CATALOGUE, planDuskSetup, type DuskSetupInput } from '@lumenwright/shared';
import {
  accountsSeeder,
  DEMO_MEMBERS,
  DEMO_ORG_ID,
  DEMO_PASSWORD,
} from '../../src/auth/accounts.seeder.js';
import { gearSeeder } from '../../src/gear/gear.seeder.js';
import { setupsSeeder } from '../../src/setups/setups.seeder.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

describe('gear and setups: demo seed', () => {
  let t: TestApp;
  let db: DataSource;
  beforeAll(async () => {
    t = await bootApp();
    db = await openDataSource();
  }, 60000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
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

  it('stores plans equal to the planner’s output for the resolved inputs, readable by the demo photographer', async () => {
    const rows: {
      resolved_inputs: DuskSetupInput;
      plan: unknown;
      inputs: Record<string, unknown>;
    }[] = await db.query(
      `SELECT inputs, resolved_inputs, plan FROM setups WHERE organization_id = $1 ORDER BY name`,
      [DEMO_ORG_ID],
    );
    expect(rows).toHaveLength(2);
    for (const r of rows)
      expect(r.plan).toEqual(JSON.parse(JSON.stringify(planDuskSetup(r.resolved_inputs))));
    // One of them names the studio's gear by id.
    expect(rows.some((r) => typeof r.inputs.gelKitId === 'string')).toBe(true);
    const photographer = DEMO_MEMBERS.find((m) => m.role === 'photographer')!;
    const agent = request.agent(t.url);
    await agent
      .post('/v1/auth/sign-in')
      .send({ email: photographer.email, password: DEMO_PASSWORD })
      .expect(200);
    const list = await agent.get('/v1/setups').query({ q: 'lakeside' }).expect(200);
    expect(list.body.data).toHaveLength(1);
    const sheet = await agent.get(`/v1/setups/${list.body.data[0].id}/sheet`).expect(200);
    expect(sheet.text).toContain('<svg');
    const lights = await agent.get('/v1/gear/lights').expect(200);
    expect(lights.body.data.map((l: { name: string }) => l.name).sort()).toEqual([
      'Key strobe A',
      'Rim speedlight',
    ]);
  });
});
