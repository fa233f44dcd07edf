// The demo studio: idempotent seeding, one member per role who can sign in.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import {
  accountsSeeder,
  DEMO_MEMBERS,
  DEMO_ORG_ID,
  DEMO_PASSWORD,
  DEMO_PLAN,
} from '../../src/auth/accounts.seeder.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

describe('accounts: demo seed', () => {
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

  it('seeds twice without duplicating anything, and every demo member signs in with their role', async () => {
    // The seeder's own audit rows (user agent 'demo seed'): other specs sign the demo owner in.
    const count = async () =>
      (
        await db.query(
          `SELECT (SELECT count(*) FROM memberships WHERE organization_id = $1)::int AS m,
                (SELECT count(*) FROM api_keys WHERE organization_id = $1)::int AS k,
                (SELECT count(*) FROM audit_events
                  WHERE organization_id = $1 AND user_agent = 'demo seed')::int AS a`,
          [DEMO_ORG_ID],
        )
      )[0];
    await accountsSeeder.run(db);
    const first = await count();
    await accountsSeeder.run(db);
    expect(await count()).toEqual(first);
    expect(first).toEqual({ m: 4, k: 3, a: 12 });
    // The four members fit the demo studio's plan, with seats to spare for invitations.
    const [plan] = await db.query(
      `SELECT p.code, p.seats FROM organizations o JOIN plans p ON p.code = o.plan_code WHERE o.id = $1`,
      [DEMO_ORG_ID],
    );
    expect(plan).toEqual({ code: DEMO_PLAN, seats: 10 });
    expect(first.m).toBeLessThan(plan.seats);
    for (const m of DEMO_MEMBERS) {
      expect(m.email.endsWith('.test')).toBe(true);
      const res = await request(t.url)
        .post('/v1/auth/sign-in')
        .send({ email: m.email, password: DEMO_PASSWORD })
        .expect(200);
      expect(res.body).toMatchObject({
        role: m.role,
        organization: { id: DEMO_ORG_ID, name: 'Kestrelmoor Evening Portraits' },
      });
    }
  });
});
