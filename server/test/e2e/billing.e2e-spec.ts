// Billing end to end: the official SDK against the payments fake (scripts/lib/payments-fake.mjs),
// its hosted checkout, signed webhooks to this server, invoices with metered overage.
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { PLAN_CATALOGUE } from '../../src/plans/plan-catalogue.js';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { buyer, eventually, fakeApi, sign } from '../factories/billing.js';
import { startFake, type RunningFake } from '../factories/frames.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const studioPlan = PLAN_CATALOGUE.find((p) => p.code === 'studio')!;

describe('billing', () => {
  let t: TestApp;
  let fake: RunningFake;
  let ds: DataSource;
  let owner: SignedInAgent;
  let subscriptionId = '';
  let customerId = '';

  beforeAll(async () => {
    fake = await startFake('payments-fake');
    t = await bootApp(fake.env);
    ds = await openDataSource();
    owner = await signUp(t.url);
  });

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    await fake?.stop();
  });

  const planCode = async () =>
    (await owner.agent.get('/v1/plans/current').expect(200)).body.plan.code as string;
  const webhook = (payload: string, signature?: string) => {
    const r = request(t.url).post('/v1/billing/webhooks').set('Content-Type', 'application/json');
    return (signature ? r.set('Stripe-Signature', signature) : r).send(payload);
  };
  const event = (type: string, object: unknown, created: number) =>
    JSON.stringify(
      { id: `evt_${randomUUID()}`, object: 'event', created, type, data: { object } },
      null,
      2,
    );

  it('leaves the plan alone when the buyer declines on the hosted checkout', async () => {
    const res = await owner.agent
      .post('/v1/billing/checkout')
      .send({ planCode: 'studio' })
      .expect(201);
    expect(res.body).toMatchObject({ planCode: 'studio', status: 'open', change: 'upgrade' });
    const b = await buyer(res.body.url, 'decline');
    expect(b.pageStatus).toBe(200);
    expect(b.html).toContain('29.00 USD');
    expect(b.status).toBe(303);
    expect(b.location).toMatch(/checkout=cancelled/);
    await eventually(async () => {
      const rows = await ds.query(`SELECT status FROM billing_checkouts WHERE id = $1`, [
        res.body.id,
      ]);
      return rows[0]?.status === 'expired';
    });
    expect(await planCode()).toBe('free');
  });

  it('moves the organisation to the studio plan and its quota when the buyer approves', async () => {
    const res = await owner.agent
      .post('/v1/billing/checkout')
      .send({ planCode: 'studio' })
      .expect(201);
    const b = await buyer(res.body.url, 'approve');
    expect(b.status).toBe(303);
    expect(b.location).toContain(`session=${res.body.id}`);
    await eventually(async () => (await planCode()) === 'studio');
    const current = await owner.agent.get('/v1/plans/current').expect(200);
    expect(current.body.plan.includedCallsPerMonth).toBe(studioPlan.includedCallsPerMonth);
    expect(current.body.plan.features.uploads).toBe(true);
    const billing = await owner.agent.get('/v1/billing').expect(200);
    expect(billing.body.subscription).toMatchObject({ planCode: 'studio', status: 'active' });
    subscriptionId = billing.body.subscription.id;
    customerId = (
      await ds.query(`SELECT customer_id FROM billing_accounts WHERE organization_id = $1`, [
        owner.organizationId,
      ])
    )[0].customer_id;
    const invoices = await eventually(async () => {
      const r = await owner.agent.get('/v1/billing/invoices').expect(200);
      return r.body.data.length === 1 && r.body.data[0].status === 'paid' ? r.body.data : null;
    });
    expect(invoices[0]).toMatchObject({
      totalCents: studioPlan.monthlyPriceCents,
      billingReason: 'subscription_create',
    });
    expect(invoices[0].lines).toEqual([
      expect.objectContaining({ kind: 'plan', amountCents: 2900 }),
    ]);
  });

  it('invoices the plan plus metered overage from the usage roll-ups at period end', async () => {
    const today = new Date().toISOString().slice(0, 10);
    // 123,456 billable live calls and 5,000 free test-key calls in this period.
    await ds.query(
      `INSERT INTO usage_daily (organization_id, day, key_id, source, endpoint, status, calls, billable_units)
       VALUES ($1, $2, NULL, 'live', 'balance', 200, 123456, 123456),
              ($1, $2, NULL, 'test', 'balance', 200, 5000, 0)`,
      [owner.organizationId, today],
    );
    const renewed = await fakeApi(fake, 'POST', `/_fake/subscriptions/${subscriptionId}/renew`);
    // Studio: 100,000 calls included, 40 cents per 1,000 over (plan catalogue):
    // 23,456 over → 23,456 × 40 / 1,000 = 938.24 → 939 cents (rounded up); 2,900 + 939 = 3,839.
    const over = 123_456 - studioPlan.includedCallsPerMonth;
    const overageCents = Math.ceil((over * studioPlan.overagePricePer1000Cents!) / 1000);
    expect(overageCents).toBe(939);
    expect(renewed).toMatchObject({ status: 'paid', total: 2900 + overageCents });
    const inv = await eventually(async () => {
      const r = await owner.agent.get(`/v1/billing/invoices/${renewed.id as string}`);
      return r.status === 200 && r.body.status === 'paid' ? r.body : null;
    });
    expect(inv.totalCents).toBe(3839);
    expect(inv.lines).toEqual([
      expect.objectContaining({ kind: 'plan', amountCents: 2900 }),
      expect.objectContaining({ kind: 'overage', amountCents: 939, quantity: over }),
    ]);
  });

  it('drops to free quotas when a renewal payment fails (past due), and queues the e-mail', async () => {
    await fakeApi(fake, 'POST', `/_fake/customers/${customerId}/card`, { behaviour: 'decline' });
    const inv = await fakeApi(fake, 'POST', `/_fake/subscriptions/${subscriptionId}/renew`);
    expect(inv.status).toBe('open');
    await eventually(async () => (await planCode()) === 'free');
    const billing = await owner.agent.get('/v1/billing').expect(200);
    expect(billing.body.subscription.status).toBe('past_due');
    const jobs = await ds.query(
      `SELECT data FROM pgboss.job WHERE name = 'mail' AND data->>'to' = $1 AND data->>'template' = 'payment-failed'`,
      [owner.email],
    );
    expect(jobs.length).toBe(1);
  });

  it('refuses webhooks without a valid signature (400) and changes nothing', async () => {
    const payload = event(
      'customer.subscription.updated',
      { id: subscriptionId },
      Math.floor(Date.now() / 1000),
    );
    const none = await webhook(payload);
    expect(none.status).toBe(400);
    expect(none.body.errors).toEqual([{ field: 'Stripe-Signature', reason: 'is missing' }]);
    const wrong = await webhook(payload, sign(payload, 'whsec_not_the_secret'));
    expect(wrong.status).toBe(400);
    expect(wrong.body.errors[0].field).toBe('Stripe-Signature');
    const tampered = await webhook(
      payload.replace('updated', 'deleted'),
      sign(payload, fake.env.PAYMENTS_WEBHOOK_SECRET!),
    );
    expect(tampered.status).toBe(400);
  });

  it('applies a newer event, answers a replay 200 without change, and ignores an older one', async () => {
    const secret = fake.env.PAYMENTS_WEBHOOK_SECRET!;
    const sub = await fakeApi(fake, 'GET', `/v1/subscriptions/${subscriptionId}`);
    const base = Math.floor(Date.now() / 1000) + 100;
    const active = event('customer.subscription.updated', { ...sub, status: 'active' }, base);
    const ok = await webhook(active, sign(active, secret)).expect(200);
    expect(ok.body).toMatchObject({ received: true, duplicate: false });
    expect(await planCode()).toBe('studio');
    // Replay of the same event: 200, marked duplicate, nothing recorded twice.
    const count = async () =>
      Number((await ds.query(`SELECT count(*) AS n FROM billing_events`))[0].n);
    const before = await count();
    const again = await webhook(active, sign(active, secret)).expect(200);
    expect(again.body).toMatchObject({ duplicate: true });
    expect(await count()).toBe(before);
    // An older event (created earlier) arriving late must not undo the newer state.
    const older = event('customer.subscription.updated', { ...sub, status: 'past_due' }, base - 50);
    const late = await webhook(older, sign(older, secret)).expect(200);
    expect(late.body.outcome).toMatch(/^stale/);
    expect(await planCode()).toBe('studio');
    // A replay through the fake's own resend of a real event is also a no-op.
    const events = (await fakeApi(fake, 'GET', '/_fake/events')).data as {
      id: string;
      type: string;
    }[];
    const created = events.find((e) => e.type === 'customer.subscription.created')!;
    await fakeApi(fake, 'POST', `/_fake/events/${created.id}/resend`);
    expect(await count()).toBe(before + 1);
    expect(await planCode()).toBe('studio');
  });

  it('cancels to free; a late "active" event for the cancelled subscription changes nothing', async () => {
    const sub = await fakeApi(fake, 'GET', `/v1/subscriptions/${subscriptionId}`);
    await owner.agent.post('/v1/billing/cancel').expect(202);
    await eventually(async () => (await planCode()) === 'free');
    const late = event(
      'customer.subscription.updated',
      { ...sub, status: 'active' },
      Math.floor(Date.now() / 1000) + 500,
    );
    const res = await webhook(late, sign(late, fake.env.PAYMENTS_WEBHOOK_SECRET!)).expect(200);
    expect(res.body.outcome).toMatch(/cancelled/);
    expect(await planCode()).toBe('free');
  });

  it('is for owners only, and names the field of a bad plan code', async () => {
    await request(t.url).get('/v1/billing').expect(401);
    await ds.query(`UPDATE memberships SET role = 'photographer' WHERE user_id = $1`, [
      owner.userId,
    ]);
    await owner.agent.get('/v1/billing').expect(403);
    await ds.query(`UPDATE memberships SET role = 'owner' WHERE user_id = $1`, [owner.userId]);
    const bad = await owner.agent
      .post('/v1/billing/checkout')
      .send({ planCode: 'gold' })
      .expect(422);
    expect(bad.body.errors[0].field).toBe('planCode');
  });
});
