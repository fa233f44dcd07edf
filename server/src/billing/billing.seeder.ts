// The demo studio's billing, made the way any studio gets it: the owner's checkout for the Studio
// plan (BillingService.startCheckout: customer, hosted checkout), approved on the payments
// service's checkout page, then one period's renewal there; every state change reaches our
// database as a signed webhook event, verified and handled by WebhookService, the code behind
// POST /v1/billing/webhooks. The seed receives those events itself, on a loopback address it
// registers with the payments service for the duration (the server is not listening yet).
// The subscription is backdated one period with the payments service's per-customer clock (a
// test control of the local fake), so the studio has last period's paid invoice and is in its
// current period with that period's invoice paid.
// Idempotent: a studio with any subscription (even one it cancelled) gets nothing new. When the
// payments service no longer knows the recorded subscription (the fake's state file was lost),
// the seed changes nothing and says so.
// Skipped when the server has no payments service (PAYMENTS_API_URL unset).
import http from 'node:http';
import { HttpException } from '@nestjs/common';
import { HttpAdapterHost } from '@nestjs/core';
import type { DataSource } from 'typeorm';
import { DEMO_MEMBERS, DEMO_ORG_ID, DEMO_PLAN } from '../auth/accounts.seeder.js';
import type { Principal } from '../common/guards/access.guard.js';
import type { AppConfig } from '../config/config.js';
import type { Seeder } from '../database/seeds/index.js';
import { MailService } from '../mail/mail.service.js';
import { PlansService } from '../plans/plans.service.js';
import { BillingMailer } from './billing-mailer.js';
import { BillingService } from './billing.service.js';
import { paymentsClient, type Payments } from './payments.client.js';
import { WebhookService } from './webhook.service.js';

const owner = DEMO_MEMBERS.find((m) => m.role === 'owner')!;
const DAY = 24 * 3600;

export type DemoBillingOutcome =
  'created' | 'current' | 'unknown to the payments service' | 'left' | 'skipped';

export interface DemoBillingResult {
  outcome: DemoBillingOutcome;
  subscriptionId: string | null;
  /** One line (or a few) for the seed's log. */
  message: string;
  /** What each webhook event did, in order (created only). */
  events: string[];
}

interface RecordedSubscription {
  id: string;
  status: string;
  invoices: number;
}

async function recorded(ds: DataSource, orgId: string): Promise<RecordedSubscription | null> {
  const rows: RecordedSubscription[] = await ds.query(
    `SELECT s.id, s.status,
            (SELECT count(*)::int FROM billing_invoices i WHERE i.subscription_id = s.id) AS invoices
       FROM billing_subscriptions s WHERE s.organization_id = $1
      ORDER BY (s.status NOT IN ('canceled', 'incomplete_expired')) DESC, s.started_at DESC
      LIMIT 1`,
    [orgId],
  );
  return rows[0] ?? null;
}

/** Seeds the demo studio's Studio-plan subscription through the payments service, once. */
export async function seedDemoBilling(
  ds: DataSource,
  config: AppConfig | undefined,
): Promise<DemoBillingResult> {
  const none = (outcome: DemoBillingOutcome, message: string, id: string | null = null) => ({
    outcome,
    subscriptionId: id,
    message,
    events: [],
  });
  if (!config?.paymentsApiUrl)
    return none('skipped', 'skipped: no payments service (PAYMENTS_API_URL unset)');
  const org: unknown[] = await ds.query(`SELECT 1 FROM organizations WHERE id = $1`, [DEMO_ORG_ID]);
  if (org.length === 0) return none('skipped', 'skipped: the demo studio is not seeded');
  const payments = paymentsClient(config)!;
  // One seed at a time (two starts on one database): the second then sees the first's result.
  const lock = ds.createQueryRunner();
  await lock.connect();
  try {
    await lock.query(`SELECT pg_advisory_lock(hashtext('lumenwright:billing-seed'))`);
    const held = await recorded(ds, DEMO_ORG_ID);
    if (held && ['canceled', 'incomplete_expired'].includes(held.status)) {
      return none('left', `left alone: the studio's subscription ${held.id} is ${held.status}`);
    }
    if (held) return await check(payments, held);
    return await create(ds, config, payments);
  } finally {
    await lock.query(`SELECT pg_advisory_unlock(hashtext('lumenwright:billing-seed'))`);
    await lock.release();
  }
}

/** A recorded subscription: still known to the payments service, or say what happens now. */
async function check(payments: Stripe, held: RecordedSubscription): Promise<DemoBillingResult> {
  try {
    await payments.subscriptions.retrieve(held.id);
    return {
      outcome: 'current',
      subscriptionId: held.id,
      message: `already there: subscription ${held.id} (${held.status}, ${held.invoices} invoices)`,
      events: [],
    };
  } catch (e) {
    const err = e as { type?: string; statusCode?: number };
    if (err.type !== 'StripeInvalidRequestError' || err.statusCode !== 404) throw e;
  }
  return {
    outcome: 'unknown to the payments service',
    subscriptionId: held.id,
    message: [
      `WARNING: the payments service has no record of the demo studio's subscription ${held.id}`,
      `  (with the local fake: .data/payments-fake/state.json was deleted or reset). Nothing was changed:`,
      `  the server runs, and the Billing page shows the subscription and its ${held.invoices} invoices as our`,
      `  database recorded them, but the payments service will refuse plan changes and cancellation for`,
      `  the demo studio. To start the demo's billing afresh, stop, delete .data and run npm start again.`,
    ].join('\n'),
    events: [],
  };
}

type Stripe = NonNullable<Payments>;

async function create(
  ds: DataSource,
  config: AppConfig,
  payments: Stripe,
): Promise<DemoBillingResult> {
  const plans = new PlansService(ds);
  const mail = new MailService(config);
  await mail.onApplicationBootstrap();
  const webhooks = new WebhookService(ds, config, payments, plans, new BillingMailer(ds, mail));
  // The seed registers its own receiver below, never the server's address.
  const billing = new BillingService(
    ds,
    { ...config, paymentsRegisterWebhook: false },
    payments,
    plans,
    new HttpAdapterHost(),
  );
  const receiver = await receive(webhooks);
  let endpointId: string | null = null;
  let customerId: string | null = null;
  try {
    endpointId = (
      await payments.webhookEndpoints.create({ url: receiver.url, enabled_events: ['*'] })
    ).id;
    const p: Principal = {
      kind: 'session',
      userId: owner.id,
      organizationId: DEMO_ORG_ID,
      role: 'owner',
      keyId: null,
      keyMode: null,
    };
    const checkout =
      (await openCheckout(ds, payments)) ?? (await billing.startCheckout(p, DEMO_PLAN));
    customerId = await customerOf(ds);
    const started = Math.floor(Date.now() / 1000) - 30 * DAY;
    await control(config, `/_fake/customers/${customerId}/clock`, { frozen_time: started });
    // The owner approves on the hosted checkout page.
    const approved = await fetch(`${checkout.url}/approve`, { method: 'POST', redirect: 'manual' });
    await approved.arrayBuffer();
    if (approved.status !== 303) throw new Error(`checkout approval answered ${approved.status}`);
    const sub = await recorded(ds, DEMO_ORG_ID);
    if (!sub) throw new Error(`no subscription recorded; webhooks: ${receiver.log.join('; ')}`);
    // The first period ends: the payments service renews at its end (its clock held there).
    const remote = (await payments.subscriptions.retrieve(sub.id)) as unknown as {
      current_period_end: number;
    };
    await control(config, `/_fake/customers/${customerId}/clock`, {
      frozen_time: remote.current_period_end,
    });
    await control(config, `/_fake/subscriptions/${sub.id}/renew`);
    const done = (await recorded(ds, DEMO_ORG_ID))!;
    return {
      outcome: 'created',
      subscriptionId: done.id,
      message: `created: subscription ${done.id} (${done.status}, ${done.invoices} invoices) at the payments service`,
      events: receiver.log,
    };
  } finally {
    if (customerId)
      await control(config, `/_fake/customers/${customerId}/clock`, { frozen_time: '' });
    if (endpointId) await payments.webhookEndpoints.del(endpointId);
    await receiver.close();
    await mail.onApplicationShutdown();
  }
}

/** An open Studio checkout left by an interrupted seed, while the payments service has it open. */
async function openCheckout(ds: DataSource, payments: Stripe): Promise<{ url: string } | null> {
  const rows: { id: string }[] = await ds.query(
    `SELECT id FROM billing_checkouts WHERE organization_id = $1 AND plan_code = $2 AND status = 'open'
      ORDER BY created_at DESC LIMIT 1`,
    [DEMO_ORG_ID, DEMO_PLAN],
  );
  if (!rows[0]) return null;
  const s = await payments.checkout.sessions.retrieve(rows[0].id).catch(() => null);
  return s?.status === 'open' && s.url ? { url: s.url } : null;
}

async function customerOf(ds: DataSource): Promise<string> {
  const rows: { customer_id: string }[] = await ds.query(
    `SELECT customer_id FROM billing_accounts WHERE organization_id = $1`,
    [DEMO_ORG_ID],
  );
  if (!rows[0]) throw new Error('the checkout recorded no customer');
  return rows[0].customer_id;
}

/** A test control of the local payments fake (`/_fake/...`), with the server's API key. */
async function control(
  config: AppConfig,
  path: string,
  form: Record<string, string | number> = {},
) {
  const body = new URLSearchParams(
    Object.entries(form).map(([k, v]): [string, string] => [k, String(v)]),
  );
  const res = await fetch(`${config.paymentsApiUrl}${path}`, {
    method: 'POST',
    headers: {
      Authorization: `Bearer ${config.paymentsSecretKey}`,
      'Content-Type': 'application/x-www-form-urlencoded',
    },
    body: body.toString(),
  });
  const text = await res.text();
  if (!res.ok) throw new Error(`payments service ${path}: ${res.status} ${text.slice(0, 300)}`);
}

/**
 * A loopback webhook receiver for the seed: each delivery is verified and handled by
 * WebhookService (signature, once per event id, stale events ignored), as the route does.
 */
async function receive(webhooks: WebhookService) {
  const log: string[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const reply = (status: number, body: unknown) => {
        res.writeHead(status, { 'Content-Type': 'application/json' });
        res.end(JSON.stringify(body));
      };
      const signature = req.headers['stripe-signature'];
      Promise.resolve()
        .then(() =>
          webhooks.verify(
            Buffer.concat(chunks),
            typeof signature === 'string' ? signature : undefined,
          ),
        )
        .then(async (event) => {
          const r = await webhooks.handle(event);
          log.push(`${event.type}: ${r.outcome}`);
          reply(200, r);
        })
        .catch((e: Error) => {
          log.push(`refused: ${e.message}`);
          reply(e instanceof HttpException ? e.getStatus() : 500, { error: e.message });
        });
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  return {
    url: `http://127.0.0.1:${port}/v1/billing/webhooks`,
    log,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

export const billingSeeder: Seeder = {
  name: 'billing: the demo studio on the Studio plan',
  run: async (ds, config) => {
    const r = await seedDemoBilling(ds, config);
    console.log(`  billing ${r.message}`);
  },
};
