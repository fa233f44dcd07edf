// The payments fake's state file (PAYMENTS_STATE_FILE, set by `npm start`): a restart from it keeps
// customers, subscriptions, invoices and replayed idempotency keys; without one nothing is written;
// an unreadable file is moved aside. Amounts are the Studio plan's, from our plan catalogue.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PLAN_CATALOGUE } from '../../src/plans/plan-catalogue.js';
import { buyer, fakeApi } from '../factories/billing.js';
import { startFake, type RunningFake } from '../factories/frames.js';

const studio = PLAN_CATALOGUE.find((p) => p.code === 'studio')!;

/** Starts the fake with these start() options (a state file, or a directory but no `persist`). */
const startWith = (opts: { port: number; stateFile?: string; dir?: string }) =>
  startFake('payments-fake', opts);

async function post(fake: RunningFake, p: string, form: Record<string, string>, key?: string) {
  const res = await fetch(`${fake.env.PAYMENTS_API_URL}${p}`, {
    method: 'POST',
    headers: {
      Authorization: `Bearer ${fake.env.PAYMENTS_SECRET_KEY}`,
      'Content-Type': 'application/x-www-form-urlencoded',
      ...(key ? { 'Idempotency-Key': key } : {}),
    },
    body: new URLSearchParams(form).toString(),
  });
  return {
    status: res.status,
    replayed: res.headers.get('idempotent-replayed'),
    body: (await res.json()) as { id: string; url: string; error?: { param?: string } },
  };
}

/** A customer with a Studio subscription: checkout approved, then one renewal. */
async function subscribe(fake: RunningFake, customerKey: string) {
  const customer = await post(
    fake,
    '/v1/customers',
    {
      email: 'owner@duskfield.test',
      name: 'Duskfield Portraits',
      'metadata[organization_id]': 'o-1',
    },
    customerKey,
  );
  expect(customer.status).toBe(200);
  const session = await post(fake, '/v1/checkout/sessions', {
    mode: 'subscription',
    customer: customer.body.id,
    'line_items[0][quantity]': '1',
    'line_items[0][price_data][currency]': 'usd',
    'line_items[0][price_data][unit_amount]': String(studio.monthlyPriceCents),
    'line_items[0][price_data][recurring][interval]': 'month',
    'line_items[0][price_data][product_data][name]': `Lumenwright ${studio.name}`,
    'subscription_data[metadata][plan_code]': 'studio',
    success_url: 'http://127.0.0.1:9/billing?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:9/billing',
  });
  expect(session.status).toBe(200);
  expect((await buyer(session.body.url, 'approve')).status).toBe(303);
  const done = await fakeApi(fake, 'GET', `/v1/checkout/sessions/${session.body.id}`);
  const subscriptionId = done.subscription as string;
  await fakeApi(fake, 'POST', `/_fake/subscriptions/${subscriptionId}/renew`);
  return { customerId: customer.body.id as string, subscriptionId };
}

async function snapshot(fake: RunningFake, customerId: string, subscriptionId: string) {
  return {
    customer: await fakeApi(fake, 'GET', `/v1/customers/${customerId}`),
    subscription: await fakeApi(fake, 'GET', `/v1/subscriptions/${subscriptionId}`),
    invoices: (await fakeApi(fake, 'GET', `/v1/invoices?customer=${customerId}`)).data as {
      id: string;
      status: string;
      total: number;
      billing_reason: string;
    }[],
  };
}

describe('payments fake: state file', () => {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'lw-payments-state-'));
  const running: RunningFake[] = [];
  const start = async (opts: Parameters<typeof startWith>[0]) => {
    const f = await startWith(opts);
    running.push(f);
    return f;
  };
  afterAll(async () => {
    for (const f of running) await f.stop();
    fs.rmSync(tmp, { recursive: true, force: true });
  });

  it('keeps customers, subscriptions, invoices and idempotency keys across a restart', async () => {
    const stateFile = path.join(tmp, 'kept', 'state.json');
    fs.mkdirSync(path.dirname(stateFile));
    const first = await start({ port: 0, stateFile });
    const { customerId, subscriptionId } = await subscribe(first, 'customer-o-1');
    const before = await snapshot(first, customerId, subscriptionId);
    // Checkout (subscription_create) and one renewal (subscription_cycle), both paid.
    expect(before.invoices.map((i) => [i.billing_reason, i.status, i.total])).toEqual([
      ['subscription_cycle', 'paid', studio.monthlyPriceCents],
      ['subscription_create', 'paid', studio.monthlyPriceCents],
    ]);
    // Written by rename: the file parses, and no temporary file is left beside it.
    const saved = JSON.parse(fs.readFileSync(stateFile, 'utf8')) as { subscriptions: unknown[] };
    expect(saved.subscriptions).toHaveLength(1);
    expect(fs.readdirSync(path.dirname(stateFile))).toEqual(['state.json']);
    await first.stop();

    // A new process with new keys, from the same file.
    const second = await start({ port: 0, stateFile });
    expect(second.env.PAYMENTS_SECRET_KEY).not.toBe(first.env.PAYMENTS_SECRET_KEY);
    expect(await snapshot(second, customerId, subscriptionId)).toEqual(before);
    const again = await post(
      second,
      '/v1/customers',
      { email: 'other@duskfield.test' },
      'customer-o-1',
    );
    expect(again).toMatchObject({ status: 200, replayed: 'true', body: { id: customerId } });
    // It goes on from there: the next renewal is the third invoice.
    await fakeApi(second, 'POST', `/_fake/subscriptions/${subscriptionId}/renew`);
    await second.stop();
    const third = await start({ port: 0, stateFile });
    expect((await snapshot(third, customerId, subscriptionId)).invoices).toHaveLength(3);
  });

  it('writes nothing without a state file, even when given a directory', async () => {
    const dir = path.join(tmp, 'memory');
    fs.mkdirSync(dir);
    const fake = await start({ port: 0, dir });
    await subscribe(fake, 'customer-o-2');
    await fake.stop();
    expect(fs.readdirSync(dir)).toEqual([]);
  });

  it('dates a customer’s objects by its held clock, and goes back to the real one', async () => {
    const fake = await start({ port: 0 });
    const customer = await post(fake, '/v1/customers', { email: 'clock@duskfield.test' });
    const held = Math.floor(Date.now() / 1000) - 30 * 24 * 3600;
    await fakeApi(fake, 'POST', `/_fake/customers/${customer.body.id}/clock`, {
      frozen_time: String(held),
    });
    const session = await post(fake, '/v1/checkout/sessions', {
      mode: 'subscription',
      customer: customer.body.id,
      'line_items[0][price_data][currency]': 'usd',
      'line_items[0][price_data][unit_amount]': String(studio.monthlyPriceCents),
      'line_items[0][price_data][product_data][name]': 'Lumenwright Studio',
      success_url: 'http://127.0.0.1:9/ok',
      cancel_url: 'http://127.0.0.1:9/no',
    });
    await buyer(session.body.url, 'approve');
    const sub = await fakeApi(
      fake,
      'GET',
      `/v1/subscriptions/${(await fakeApi(fake, 'GET', `/v1/checkout/sessions/${session.body.id}`)).subscription as string}`,
    );
    expect(sub.created).toBe(held);
    expect(sub.current_period_start).toBe(held);
    const cleared = await fakeApi(fake, 'POST', `/_fake/customers/${customer.body.id}/clock`, {
      frozen_time: '',
    });
    expect(cleared.frozen_time).toBeNull();
    const bad = await post(fake, `/_fake/customers/${customer.body.id}/clock`, {
      frozen_time: 'soon',
    });
    expect(bad).toMatchObject({ status: 400, body: { error: { param: 'frozen_time' } } });
  });

  it('moves an unreadable state file aside and starts empty', async () => {
    const stateFile = path.join(tmp, 'broken', 'state.json');
    fs.mkdirSync(path.dirname(stateFile));
    fs.writeFileSync(stateFile, '{"format": 1, "customers": [');
    const fake = await start({ port: 0, stateFile });
    const list = await fakeApi(fake, 'GET', '/v1/invoices');
    expect(list.data).toEqual([]);
    const names = fs.readdirSync(path.dirname(stateFile));
    expect(names.some((n) => n.startsWith('state.json.unreadable-'))).toBe(true);
  });
});
