// The demo studio's billing seed against a real PostgreSQL and the payments fake with a state file:
// a demo from before billing was seeded (Studio plan, no subscription) gets a Studio subscription
// made through checkout, approval and a renewal at the fake and recorded by the webhook code; a
// second seed, and one after the fake restarts from its file, add nothing; with the fake's state
// lost the seed changes nothing, says so, and the Billing API still answers. Amounts come from our
// plan catalogue.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import {
  accountsSeeder,
  DEMO_MEMBERS,
  DEMO_ORG_ID,
  DEMO_PASSWORD,
} from '../../src/auth/accounts.seeder.js';
import { seedDemoBilling } from '../../src/billing/billing.seeder.js';
import type { AppConfig } from '../../src/config/config.js';
import { PLAN_CATALOGUE } from '../../src/plans/plan-catalogue.js';
import { plansSeeder } from '../../src/plans/plans.seeder.js';
import { fakeApi } from '../factories/billing.js';
import { startFake, type RunningFake } from '../factories/frames.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const studio = PLAN_CATALOGUE.find((p) => p.code === 'studio')!;
const owner = DEMO_MEMBERS.find((m) => m.role === 'owner')!;
/** The fake's billing period (scripts/fakes/payments/server.mjs: MONTH), by which the seed backdates. */
const PERIOD_MS = 30 * 24 * 3600 * 1000;

describe('billing: demo seed', () => {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'lw-billing-seed-'));
  const stateFile = path.join(tmp, 'state.json');
  let fake: RunningFake;
  let t: TestApp;
  let db: DataSource;
  const others: { stop(): Promise<void> }[] = [];

  const startPayments = (file: string) => {
    const opts = { port: 0, stateFile: file }; // start() options of scripts/lib/payments-fake.mjs
    return startFake('payments-fake', opts);
  };
  /** The server's configuration, pointed at another start of the fake (new port and keys). */
  const configFor = (f: RunningFake): AppConfig => ({
    ...t.config,
    paymentsApiUrl: f.env.PAYMENTS_API_URL!,
    paymentsSecretKey: f.env.PAYMENTS_SECRET_KEY!,
    paymentsWebhookSecret: f.env.PAYMENTS_WEBHOOK_SECRET!,
  });
  const signInOwner = async (url: string) => {
    const agent = request.agent(url);
    await agent
      .post('/v1/auth/sign-in')
      .send({ email: owner.email, password: DEMO_PASSWORD })
      .expect(200);
    return agent;
  };
  /** What our database holds for the demo studio's billing, row counts by table. */
  const counts = async () =>
    (
      await db.query(
        `SELECT (SELECT count(*)::int FROM billing_accounts WHERE organization_id = $1) AS accounts,
                (SELECT count(*)::int FROM billing_checkouts WHERE organization_id = $1) AS checkouts,
                (SELECT count(*)::int FROM billing_subscriptions WHERE organization_id = $1) AS subscriptions,
                (SELECT count(*)::int FROM billing_invoices WHERE organization_id = $1) AS invoices,
                (SELECT plan_code FROM organizations WHERE id = $1) AS plan`,
        [DEMO_ORG_ID],
      )
    )[0] as Record<string, number | string>;
  const customerId = async () =>
    (
      (await db.query(`SELECT customer_id FROM billing_accounts WHERE organization_id = $1`, [
        DEMO_ORG_ID,
      ])) as { customer_id: string }[]
    )[0]!.customer_id;
  /** The invoices the fake holds for the demo studio's customer. */
  const fakeInvoices = async (f: RunningFake) =>
    (await fakeApi(f, 'GET', `/v1/invoices?customer=${await customerId()}`)).data as {
      status: string;
      total: number;
    }[];

  beforeAll(async () => {
    fake = await startPayments(stateFile);
    t = await bootApp(fake.env);
    db = await openDataSource();
    await plansSeeder.run(db);
    await accountsSeeder.run(db);
  }, 60000);

  afterAll(async () => {
    await t?.close();
    await db?.destroy();
    for (const o of others.reverse()) await o.stop();
    await fake?.stop();
    fs.rmSync(tmp, { recursive: true, force: true });
  });

  it('gives a demo seeded before billing (Studio plan, no subscription) a real Studio subscription', async () => {
    expect(await counts()).toEqual({
      accounts: 0,
      checkouts: 0,
      subscriptions: 0,
      invoices: 0,
      plan: 'studio',
    });
    const r = await seedDemoBilling(db, t.config);
    expect(r.outcome).toBe('created');
    // Every event went through the webhook code, in order, and none was refused.
    expect(r.events).toEqual(
      expect.arrayContaining([
        'customer.subscription.created: subscription active; organisation on studio',
        'checkout.session.completed: checkout complete',
        'invoice.paid: invoice paid',
      ]),
    );
    expect(r.events.filter((e) => e === 'invoice.paid: invoice paid')).toHaveLength(2);
    expect(r.events.some((e) => e.startsWith('refused'))).toBe(false);
    expect(await counts()).toEqual({
      accounts: 1,
      checkouts: 1,
      subscriptions: 1,
      invoices: 2,
      plan: 'studio',
    });
    // The fake holds the same two invoices, paid, at the catalogue's Studio price.
    expect(await fakeInvoices(fake)).toEqual([
      expect.objectContaining({ status: 'paid', total: studio.monthlyPriceCents }),
      expect.objectContaining({ status: 'paid', total: studio.monthlyPriceCents }),
    ]);
    // The payment e-mails the webhook code queues: one per paid invoice to the one owner.
    const mails: { n: number }[] = await db.query(
      `SELECT count(*)::int AS n FROM pgboss.job
        WHERE name = 'mail' AND data->>'to' = $1 AND data->>'template' = 'payment-succeeded'`,
      [owner.email],
    );
    expect(mails[0]!.n).toBe(2);
  });

  it('shows the subscription and its invoices on the Billing API', async () => {
    const agent = await signInOwner(t.url);
    const now = Date.now();
    const billing = (await agent.get('/v1/billing').expect(200)).body;
    expect(billing.plan.code).toBe('studio');
    expect(billing.openCheckout).toBeNull();
    expect(billing.subscription).toMatchObject({ planCode: 'studio', status: 'active' });
    const start = Date.parse(billing.subscription.currentPeriodStart);
    const end = Date.parse(billing.subscription.currentPeriodEnd);
    expect(start).toBeLessThanOrEqual(now);
    expect(end).toBeGreaterThan(now);
    expect(end - start).toBe(PERIOD_MS);

    const invoices = (await agent.get('/v1/billing/invoices').expect(200)).body.data as {
      id: string;
      status: string;
      billingReason: string;
      totalCents: number;
      amountPaidCents: number;
      issuedAt: string;
      periodStart: string;
      periodEnd: string;
      lines: { kind: string; amountCents: number }[];
    }[];
    // Newest first: this period's renewal, then last period's checkout invoice.
    expect(invoices.map((i) => [i.billingReason, i.status])).toEqual([
      ['subscription_cycle', 'paid'],
      ['subscription_create', 'paid'],
    ]);
    for (const i of invoices) {
      expect(i.totalCents).toBe(studio.monthlyPriceCents);
      expect(i.amountPaidCents).toBe(studio.monthlyPriceCents);
      expect(i.lines).toEqual([
        expect.objectContaining({ kind: 'plan', amountCents: studio.monthlyPriceCents }),
      ]);
    }
    const [current, last] = invoices;
    // Last period's invoice was issued when it began, one period before this period's.
    expect(Date.parse(current!.issuedAt) - Date.parse(last!.issuedAt)).toBe(PERIOD_MS);
    expect(Date.parse(current!.issuedAt)).toBe(start);
    // The renewal invoice covers the period that ended (for its metered use) as it starts this one.
    expect(Date.parse(current!.periodEnd)).toBe(start);
    const one = await agent.get(`/v1/billing/invoices/${current!.id}`).expect(200);
    expect(one.body.id).toBe(current!.id);
  });

  it('adds nothing on a second seed, nor after the fake restarts from its state file', async () => {
    const before = await counts();
    const again = await seedDemoBilling(db, t.config);
    expect(again.outcome).toBe('current');
    expect(await counts()).toEqual(before);
    expect(await fakeInvoices(fake)).toHaveLength(2);

    await fake.stop();
    const restarted = await startPayments(stateFile);
    others.push(restarted);
    const third = await seedDemoBilling(db, configFor(restarted));
    expect(third).toMatchObject({ outcome: 'current', subscriptionId: again.subscriptionId });
    expect(await counts()).toEqual(before);
    expect(await fakeInvoices(restarted)).toHaveLength(2);
  });

  it('changes nothing and says so when the fake lost its state; the Billing API still answers', async () => {
    const before = await counts();
    const empty = await startPayments(path.join(tmp, 'lost', 'state.json'));
    others.push(empty);
    const r = await seedDemoBilling(db, configFor(empty));
    expect(r.outcome).toBe('unknown to the payments service');
    expect(r.message).toContain('WARNING');
    expect(r.message).toContain(r.subscriptionId!);
    expect(r.message).toContain('Nothing was changed');
    expect(await counts()).toEqual(before);

    const app = await bootApp(empty.env);
    others.push({ stop: () => app.close() });
    const agent = await signInOwner(app.url);
    const billing = await agent.get('/v1/billing').expect(200);
    expect(billing.body.subscription).toMatchObject({ id: r.subscriptionId, status: 'active' });
    expect((await agent.get('/v1/billing/invoices').expect(200)).body.data).toHaveLength(2);
    // A plan change is refused by the payments service (it knows no such customer). That is our
    // records and the service disagreeing, not the caller's request: a 500 problem with the
    // request id to quote, never a 400 that blames the body. The server keeps answering.
    const change = await agent.post('/v1/billing/checkout').send({ planCode: 'platform' });
    expect(change.status).toBe(500);
    expect(change.headers['content-type']).toContain('application/problem+json');
    expect(change.body).toMatchObject({
      type: 'https://lumenwright.test/problems/internal',
      requestId: expect.any(String),
    });
    expect(change.body.errors).toBeUndefined();
    await agent.get('/v1/billing').expect(200);
  });
});
