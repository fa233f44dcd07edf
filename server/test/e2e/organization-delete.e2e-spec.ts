// Deleting a studio: the owner types its exact name; a subscription the payments service would go on
// charging must be cancelled first (409, nothing deleted); once it has ended the studio and what
// hangs off it go, and its members' sessions no longer reach it.
import type { DataSource } from 'typeorm';
import { signUp } from '../factories/accounts.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

describe('deleting a studio', () => {
  let t: TestApp;
  let db: DataSource;

  beforeAll(async () => {
    t = await bootApp();
    db = await openDataSource();
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
  });

  const orgCount = async (id: string) =>
    (
      (await db.query(`SELECT count(*)::int AS n FROM organizations WHERE id = $1`, [id])) as {
        n: number;
      }[]
    )[0]!.n;

  it('refuses while a subscription runs, then deletes once it has ended', async () => {
    const owner = await signUp(t.url, { organizationName: 'Gullwing Terrace Portraits' });
    // An invented subscription row as the payments webhook would have stored it.
    await db.query(
      `INSERT INTO billing_subscriptions (id, organization_id, customer_id, plan_code, status,
         started_at, current_period_start, current_period_end, state_as_of)
       VALUES ($1, $2, 'cus_test_gullwing', 'studio', 'active', now(), now(),
         now() + interval '1 month', now())`,
      [`sub_test_${owner.organizationId.slice(0, 8)}`, owner.organizationId],
    );
    const refused = await owner.agent
      .delete('/v1/organization')
      .send({ confirmName: 'Gullwing Terrace Portraits' })
      .expect(409);
    expect(refused.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(refused.body.errors).toEqual([
      { field: 'subscription', reason: 'is active: cancel it first' },
    ]);
    expect(refused.body.detail).toMatch(/Cancel it on the Billing page first/);
    expect(await orgCount(owner.organizationId)).toBe(1);

    await db.query(
      `UPDATE billing_subscriptions SET status = 'canceled' WHERE organization_id = $1`,
      [owner.organizationId],
    );
    const wrong = await owner.agent
      .delete('/v1/organization')
      .send({ confirmName: 'Gullwing Terrace' })
      .expect(422);
    expect(wrong.body.errors[0].field).toBe('confirmName');
    await owner.agent
      .delete('/v1/organization')
      .send({ confirmName: 'Gullwing Terrace Portraits' })
      .expect((res) => expect([200, 204]).toContain(res.status));
    expect(await orgCount(owner.organizationId)).toBe(0);
    const after = await owner.agent.get('/v1/organization');
    expect(after.status).toBeGreaterThanOrEqual(400);
    expect(after.status).toBeLessThan(500);
  });
});
