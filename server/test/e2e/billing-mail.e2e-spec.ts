// Billing e-mails end to end, against the payments fake (scripts/fakes/payments) and maildev: a
// failed renewal that drops a studio to Free while it has more members than Free's seats is ONE
// e-mail per owner saying both things, whichever of the two webhook events (invoice payment failed,
// subscription past due) arrives first; a failed payment alone and a seats drop alone (a
// cancellation) still send their one e-mail each. Free plan: 2 seats; Studio: 10.
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { PLAN_CATALOGUE } from '../../src/plans/plan-catalogue.js';
import {
  addMembersDirectly,
  type MailInbox,
  type MaildevMessage,
  signUp,
  startMaildev,
  waitForMail,
} from '../factories/accounts.js';
import { eventually, fakeApi, planOf, sign, studioByCheckout } from '../factories/billing.js';
import { startFake, type RunningFake } from '../factories/frames.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const PUBLIC_URL = 'http://127.0.0.1:3996';
const seatsOf = (code: string) => PLAN_CATALOGUE.find((p) => p.code === code)!.seats;

describe('billing e-mails', () => {
  let t: TestApp;
  let mail: MailInbox;
  let payments: RunningFake;
  let db: DataSource;

  beforeAll(async () => {
    mail = await startMaildev();
    payments = await startFake('payments-fake');
    t = await bootApp({ ...payments.env, SMTP_URL: mail.smtpUrl, PUBLIC_URL });
    db = await openDataSource();
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
    await payments?.stop();
    await mail?.stop();
  });

  /** A studio on the Studio plan by hosted checkout, with `owners` more owners and `others`. */
  const studio = async (owners: number, others: number) => {
    const o = await signUp(t.url, { name: 'Wren Halloway' });
    await studioByCheckout(o);
    const add = (n: number, role: string) => addMembersDirectly(db, o.organizationId, n, role);
    const ownerEmails = [o.email, ...(await add(owners, 'owner'))];
    const everyone = [...ownerEmails, ...(await add(others, 'photographer'))];
    const [acct] = await db.query(
      `SELECT customer_id FROM billing_accounts WHERE organization_id = $1`,
      [o.organizationId],
    );
    const billing = await o.agent.get('/v1/billing').expect(200);
    return {
      o,
      ownerEmails,
      everyone,
      customerId: acct.customer_id as string,
      subscriptionId: billing.body.subscription.id as string,
    };
  };

  interface FakeEvent {
    id: string;
    type: string;
    deliveries: { delivered: boolean }[];
  }
  const fakeEvents = async () =>
    (await fakeApi(payments, 'GET', '/_fake/events')).data as FakeEvent[];

  /**
   * Waits until the payments fake has delivered every event so far (the checkout's own invoice
   * and its payment-received e-mail included), then notes what exists: the checks below look only
   * at events, mail jobs and messages that came after.
   */
  const mark = async () => {
    const events = await eventually(async () => {
      const all = await fakeEvents();
      return all.every((e) => e.deliveries.length > 0 && e.deliveries.every((d) => d.delivered))
        ? all
        : null;
    });
    const jobs: { id: string }[] = await db.query(`SELECT id FROM pgboss.job WHERE name = 'mail'`);
    // Queued mail reaches maildev within a poll or two (0.5 s in tests).
    await new Promise((r) => setTimeout(r, 1500));
    const mails = (await (await fetch(`${mail.webUrl}/email`)).json()) as MaildevMessage[];
    return {
      events: new Set(events!.map((e) => e.id)),
      jobs: new Set(jobs.map((j) => j.id)),
      mails: new Set(mails.map((m) => m.id)),
    };
  };
  type Mark = Awaited<ReturnType<typeof mark>>;

  /** Mail jobs queued since `m` to these addresses (any template), oldest first. */
  const jobsTo = async (to: string[], m: Mark) => {
    const rows: { id: string; to: string; template: string }[] = await db.query(
      `SELECT id, data->>'to' AS to, data->>'template' AS template FROM pgboss.job
        WHERE name = 'mail' AND data->>'to' = ANY($1) ORDER BY created_on`,
      [to],
    );
    return rows.filter((r) => !m.jobs.has(r.id)).map(({ to, template }) => ({ to, template }));
  };

  /** Messages maildev received since `m` for these addresses, after a pause for any late one. */
  const inboxSince = async (to: string[], m: Mark) => {
    await new Promise((r) => setTimeout(r, 1500)); // the worker polls every 0.5 s in tests
    const all = (await (await fetch(`${mail.webUrl}/email`)).json()) as MaildevMessage[];
    return all.filter((x) => !m.mails.has(x.id) && x.to.some((a) => to.includes(a.address)));
  };

  /** Type and outcome of each webhook event the fake sent since `m`, in the order processed. */
  const outcomesSince = async (m: Mark) => {
    const ids = (await fakeEvents()).filter((e) => !m.events.has(e.id)).map((e) => e.id);
    const rows: { type: string; outcome: string }[] = await db.query(
      `SELECT type, outcome FROM billing_events WHERE id = ANY($1) ORDER BY received_at`,
      [ids],
    );
    return rows;
  };

  it('sends each owner one e-mail saying both when a failed renewal drops them to fewer seats', async () => {
    const s = await studio(1, 2); // 2 owners + 2 photographers = 4 members; Free has 2 seats
    expect(seatsOf('free')).toBe(2); // plan-catalogue.ts
    await fakeApi(payments, 'POST', `/_fake/customers/${s.customerId}/card`, {
      behaviour: 'decline',
    });
    const m = await mark();
    const inv = await fakeApi(payments, 'POST', `/_fake/subscriptions/${s.subscriptionId}/renew`);
    expect(inv.status).toBe('open');
    await eventually(async () => (await planOf(s.o)) === 'free');

    // The fake sends invoice.payment_failed, then customer.subscription.updated (past_due).
    const rows = await outcomesSince(m);
    expect(rows.map((r) => r.type)).toEqual([
      'invoice.created',
      'invoice.finalized',
      'invoice.payment_failed',
      'customer.subscription.updated',
    ]);
    expect(rows[3]!.outcome).toBe(
      'subscription past_due; organisation on free; 4 members over 2 seats (told in the payment-failed e-mail)',
    );

    // Exactly one job per owner, none to the photographers, and no separate seats notice.
    const jobs = await jobsTo(s.everyone, m);
    expect(jobs.map((j) => j.to).sort()).toEqual([...s.ownerEmails].sort());
    expect(jobs.every((j) => j.template === 'payment-failed')).toBe(true);

    const subject = /^Payment failed for .*, which now has more members than seats$/;
    for (const to of s.ownerEmails) {
      const msg = await waitForMail(mail.webUrl, to, subject);
      expect(msg.text).toContain('We could not collect 29.00 USD');
      expect(msg.text).toContain(
        'Until a payment goes through, the organisation is on the Free plan, which has 2 seats. Your studio has 4 members.',
      );
      expect(msg.text).toContain(`remove 2 members on the Team page: ${PUBLIC_URL}/team`);
      expect(msg.html).toContain(`href="${PUBLIC_URL}/billing"`);
    }
    const inbox = await inboxSince(s.everyone, m);
    expect(inbox.map((x) => x.to[0]!.address).sort()).toEqual([...s.ownerEmails].sort());
    expect(inbox.every((x) => subject.test(x.subject))).toBe(true);

    // The next failed attempt (already past due, so no plan change) is again one e-mail per owner,
    // and it still says the seats. Its subscription event only moves the period on.
    const m2 = await mark();
    await fakeApi(payments, 'POST', `/_fake/subscriptions/${s.subscriptionId}/renew`);
    const second = await outcomesSince(m2);
    expect(second.map((r) => r.type)).toEqual([
      'invoice.created',
      'invoice.finalized',
      'invoice.payment_failed',
      'customer.subscription.updated',
    ]);
    expect(second[3]!.outcome).toBe('subscription past_due; organisation on free');
    const again = await eventually(async () => {
      const j = await jobsTo(s.everyone, m2);
      return j.length >= s.ownerEmails.length ? j : null;
    });
    expect(again!.map((j) => j.to).sort()).toEqual([...s.ownerEmails].sort());
    const later = await inboxSince(s.everyone, m2);
    expect(later.map((x) => x.to[0]!.address).sort()).toEqual([...s.ownerEmails].sort());
    expect(later.every((x) => subject.test(x.subject))).toBe(true);
  }, 60000);

  it('still sends one e-mail per owner when the past-due event arrives before the failed payment', async () => {
    const s = await studio(0, 3); // 1 owner + 3 photographers = 4 members
    const secret = payments.env.PAYMENTS_WEBHOOK_SECRET!;
    const send = async (type: string, object: unknown, created: number) => {
      const payload = JSON.stringify({
        id: `evt_${randomUUID()}`,
        object: 'event',
        created,
        type,
        data: { object },
      });
      return (
        await request(t.url)
          .post('/v1/billing/webhooks')
          .set('Content-Type', 'application/json')
          .set('Stripe-Signature', sign(payload, secret))
          .send(payload)
          .expect(200)
      ).body as { outcome: string };
    };
    const m = await mark();
    const sub = await fakeApi(payments, 'GET', `/v1/subscriptions/${s.subscriptionId}`);
    const now = Math.floor(Date.now() / 1000) + 60; // newer than the checkout's events
    const first = await send('customer.subscription.updated', { ...sub, status: 'past_due' }, now);
    expect(first.outcome).toBe(
      'subscription past_due; organisation on free; 4 members over 2 seats (told in the payment-failed e-mail)',
    );
    expect(await jobsTo(s.everyone, m)).toEqual([]);
    const invoice = {
      id: `in_${randomUUID().slice(0, 12)}`,
      object: 'invoice',
      customer: s.customerId,
      subscription: s.subscriptionId,
      status: 'open',
      billing_reason: 'subscription_cycle',
      currency: 'usd',
      total: 2900,
      amount_paid: 0,
      created: now,
      period_start: now - 30 * 86400,
      period_end: now,
      lines: {
        data: [{ description: 'Studio (monthly plan)', amount: 2900, metadata: { kind: 'plan' } }],
      },
    };
    const second = await send('invoice.payment_failed', invoice, now + 1);
    expect(second.outcome).toBe('invoice open');
    expect(await jobsTo(s.everyone, m)).toEqual([{ to: s.o.email, template: 'payment-failed' }]);
    const msg = await waitForMail(mail.webUrl, s.o.email, /which now has more members than seats/);
    expect(msg.text).toContain('which has 2 seats. Your studio has 4 members.');
    expect(msg.text).toContain(`for invoice ${invoice.id}: `);
    expect((await inboxSince(s.everyone, m)).map((x) => x.id)).toEqual([msg.id]);
  }, 60000);

  it('sends the plain payment-failed e-mail, once, when the members fit the plan left', async () => {
    const s = await studio(0, 1); // 2 members: Free's 2 seats
    await fakeApi(payments, 'POST', `/_fake/customers/${s.customerId}/card`, {
      behaviour: 'decline',
    });
    const m = await mark();
    await fakeApi(payments, 'POST', `/_fake/subscriptions/${s.subscriptionId}/renew`);
    await eventually(async () => (await planOf(s.o)) === 'free');
    const rows = await outcomesSince(m);
    expect(rows.at(-1)).toEqual({
      type: 'customer.subscription.updated',
      outcome: 'subscription past_due; organisation on free',
    });
    expect(await jobsTo(s.everyone, m)).toEqual([{ to: s.o.email, template: 'payment-failed' }]);
    const msg = await waitForMail(mail.webUrl, s.o.email, /^Payment failed for /);
    expect(msg.subject).not.toMatch(/seats/);
    expect(msg.text).not.toMatch(/seat/);
    // The plan the studio is on until a payment goes through: Free (its only subscription failed).
    expect(msg.text).toContain('the organisation has the Free plan’s limits');
    expect((await inboxSince(s.everyone, m)).map((x) => x.id)).toEqual([msg.id]);
  }, 60000);

  it('sends the seats notice alone, once per owner, when a cancellation drops them to fewer seats', async () => {
    const s = await studio(1, 2); // 4 members
    const m = await mark();
    await s.o.agent.post('/v1/billing/cancel').expect(202);
    await eventually(async () => (await planOf(s.o)) === 'free');
    const rows = await eventually(async () => {
      const r = await outcomesSince(m);
      return r.some((e) => e.type === 'customer.subscription.deleted') ? r : null;
    });
    expect(rows!.find((e) => e.type === 'customer.subscription.deleted')!.outcome).toBe(
      'subscription canceled; organisation on free; 4 members over 2 seats (owners get an e-mail)',
    );
    const jobs = await jobsTo(s.everyone, m);
    expect(jobs.map((j) => j.to).sort()).toEqual([...s.ownerEmails].sort());
    expect(jobs.every((j) => j.template === 'seats-over-plan')).toBe(true);
    const inbox = await inboxSince(s.everyone, m);
    expect(inbox.map((x) => x.to[0]!.address).sort()).toEqual([...s.ownerEmails].sort());
    expect(inbox.every((x) => /has more members than its plan has seats$/.test(x.subject))).toBe(
      true,
    );
  }, 60000);
});
