#!/usr/bin/env node
// A local stand-in for the payments service: only the calls the product makes (customers,
// checkout sessions, subscriptions, invoice items, invoices, webhook endpoints), a hosted
// checkout page, and signed webhooks with retries. State is in memory, and also kept in the JSON
// file PAYMENTS_STATE_FILE names, when set (written after every change: a temporary file, fsync,
// then rename, so a crash leaves the old state or the new one, never half of one). Loopback only.
// Env: PORT (0 = any), PAYMENTS_SECRET_KEY, PAYMENTS_WEBHOOK_SECRET, WEBHOOK_RETRY_BASE_MS,
// PAYMENTS_STATE_FILE.
// Test controls live under /_fake/ (same bearer key): renew a subscription (period end), make a
// customer's card decline, set a customer's clock, resend an event, list events.
import fs from 'node:fs';
import http from 'node:http';
import { randomBytes } from 'node:crypto';
import { checkoutPage } from './checkout-page.mjs';
import { parseForm, readBody } from './form.mjs';
import { Deliveries } from './webhooks.mjs';

const SECRET_KEY = process.env.PAYMENTS_SECRET_KEY ?? '';
const WEBHOOK_SECRET = process.env.PAYMENTS_WEBHOOK_SECRET ?? '';
const STATE_FILE = process.env.PAYMENTS_STATE_FILE || null;
const MONTH = 30 * 24 * 3600;
const log = (m) => process.stderr.write(`[payments-fake] ${m}\n`);
const newId = (prefix) => `${prefix}_${randomBytes(12).toString('base64url')}`;

const db = {
  customers: new Map(),
  sessions: new Map(),
  subscriptions: new Map(),
  invoices: new Map(),
  pendingItems: [],
  endpoints: [],
  events: [],
  idempotency: new Map(),
  /** customer id → the unix time its clock is held at (objects and events of that customer). */
  clocks: new Map(),
};
/** The time as the customer's objects see it: its held clock, else the real one. */
const now = (customer) => (customer && db.clocks.get(customer)) ?? Math.floor(Date.now() / 1000);
const deliveries = new Deliveries({
  retryBaseMs: Number(process.env.WEBHOOK_RETRY_BASE_MS ?? 500),
  log,
});
let base = '';

const MAPS = ['customers', 'sessions', 'subscriptions', 'invoices', 'idempotency', 'clocks'];
const LISTS = ['pendingItems', 'endpoints', 'events'];

function save() {
  if (!STATE_FILE) return;
  const state = { format: 1, savedAt: new Date().toISOString() };
  for (const k of MAPS) state[k] = [...db[k].entries()];
  for (const k of LISTS) state[k] = db[k];
  const tmp = `${STATE_FILE}.${process.pid}.tmp`;
  const fd = fs.openSync(tmp, 'w', 0o600);
  try {
    fs.writeFileSync(fd, JSON.stringify(state));
    fs.fsyncSync(fd);
  } finally {
    fs.closeSync(fd);
  }
  fs.renameSync(tmp, STATE_FILE);
}

function load() {
  if (!STATE_FILE || !fs.existsSync(STATE_FILE)) {
    if (STATE_FILE) log(`no state in ${STATE_FILE} yet: starting empty`);
    return;
  }
  let state;
  try {
    state = JSON.parse(fs.readFileSync(STATE_FILE, 'utf8'));
    if (state?.format !== 1) throw new Error(`unknown format ${state?.format}`);
  } catch (e) {
    const aside = `${STATE_FILE}.unreadable-${Date.now()}`;
    fs.renameSync(STATE_FILE, aside);
    log(`state file unreadable (${e.message}): moved to ${aside}, starting empty`);
    return;
  }
  for (const k of MAPS) db[k] = new Map(state[k] ?? []);
  for (const k of LISTS) db[k] = state[k] ?? [];
  // Every endpoint shares the secret given at this start (the server is configured with it).
  for (const e of db.endpoints) e.secret = WEBHOOK_SECRET;
  log(
    `state from ${STATE_FILE}: ${db.customers.size} customers, ${db.subscriptions.size} subscriptions, ${db.invoices.size} invoices`,
  );
}
load();

class ApiError extends Error {
  constructor(status, message, param) {
    super(message);
    this.status = status;
    this.param = param;
  }
}

async function emit(type, object) {
  const event = {
    id: newId('evt'),
    object: 'event',
    api_version: '2025-01-01',
    created: now(object.customer),
    livemode: false,
    pending_webhooks: db.endpoints.length,
    type,
    data: { object: structuredClone(object) },
  };
  db.events.push(event);
  await deliveries.send(event, db.endpoints);
  return event;
}

const list = (data, url) => ({ object: 'list', data, has_more: false, url });

function invoiceTotals(inv) {
  inv.subtotal = inv.lines.data.reduce((s, l) => s + l.amount, 0);
  inv.total = inv.subtotal;
  inv.amount_due = inv.status === 'paid' ? 0 : inv.total;
}

function newInvoice(sub, reason, period) {
  const price = sub.items.data[0].price;
  const inv = {
    id: newId('in'),
    object: 'invoice',
    customer: sub.customer,
    subscription: sub.id,
    parent: {
      type: 'subscription_details',
      subscription_details: { subscription: sub.id, metadata: sub.metadata },
    },
    status: 'draft',
    billing_reason: reason,
    currency: price.currency,
    created: now(sub.customer),
    period_start: period.start,
    period_end: period.end,
    attempt_count: 0,
    amount_paid: 0,
    hosted_invoice_url: null,
    metadata: {},
    lines: {
      object: 'list',
      has_more: false,
      data: [
        {
          id: newId('il'),
          object: 'line_item',
          description: `${price.product_name} (monthly plan)`,
          amount: price.unit_amount,
          currency: price.currency,
          quantity: 1,
          period: { start: sub.current_period_start, end: sub.current_period_end },
          metadata: { kind: 'plan', plan_code: sub.metadata.plan_code ?? '' },
        },
      ],
    },
  };
  invoiceTotals(inv);
  db.invoices.set(inv.id, inv);
  return inv;
}

/** Charge the customer's card; returns true when paid. */
async function collect(inv) {
  const customer = db.customers.get(inv.customer);
  inv.status = 'open';
  inv.attempt_count++;
  invoiceTotals(inv);
  await emit('invoice.finalized', inv);
  if (customer?.card === 'decline') {
    await emit('invoice.payment_failed', inv);
    return false;
  }
  inv.status = 'paid';
  inv.amount_paid = inv.total;
  invoiceTotals(inv);
  inv.status_transitions = { paid_at: now(inv.customer) };
  await emit('invoice.paid', inv);
  return true;
}

function setPeriod(sub, start) {
  sub.current_period_start = start;
  sub.current_period_end = start + MONTH;
  for (const item of sub.items.data) {
    item.current_period_start = sub.current_period_start;
    item.current_period_end = sub.current_period_end;
  }
}

const api = {
  'POST /v1/customers': (b) => {
    const c = {
      id: newId('cus'),
      object: 'customer',
      created: now(),
      email: b.email ?? null,
      name: b.name ?? null,
      metadata: b.metadata ?? {},
      card: 'approve',
    };
    db.customers.set(c.id, c);
    return c;
  },
  'GET /v1/customers/:id': (_b, id) => found(db.customers, id, 'customer'),
  'POST /v1/checkout/sessions': (b) => {
    if (b.mode !== 'subscription')
      throw new ApiError(400, 'Only mode=subscription is supported here.', 'mode');
    if (!b.customer || !db.customers.has(b.customer))
      throw new ApiError(400, 'No such customer.', 'customer');
    const li = b.line_items?.[0];
    const pd = li?.price_data;
    if (!pd?.unit_amount || !pd.currency || !pd.product_data?.name) {
      throw new ApiError(
        400,
        'line_items[0][price_data] needs unit_amount, currency, product_data[name].',
        'line_items',
      );
    }
    if (!b.success_url || !b.cancel_url)
      throw new ApiError(400, 'success_url and cancel_url are required.', 'success_url');
    const s = {
      id: newId('cs_test'),
      object: 'checkout.session',
      mode: 'subscription',
      status: 'open',
      payment_status: 'unpaid',
      customer: b.customer,
      client_reference_id: b.client_reference_id ?? null,
      metadata: b.metadata ?? {},
      subscription: null,
      success_url: b.success_url,
      cancel_url: b.cancel_url,
      created: now(),
      expires_at: now() + 24 * 3600,
      amount_total: Number(pd.unit_amount) * Number(li.quantity ?? 1),
      currency: pd.currency,
      url: null,
      line_items: [
        {
          name: pd.product_data.name,
          unit_amount: Number(pd.unit_amount),
          currency: pd.currency,
          interval: pd.recurring?.interval ?? 'month',
        },
      ],
      subscription_metadata: b.subscription_data?.metadata ?? {},
    };
    s.url = `${base}/checkout/${s.id}`;
    db.sessions.set(s.id, s);
    return publicSession(s);
  },
  'GET /v1/checkout/sessions/:id': (_b, id) =>
    publicSession(found(db.sessions, id, 'checkout session')),
  'GET /v1/subscriptions/:id': (_b, id) => found(db.subscriptions, id, 'subscription'),
  'DELETE /v1/subscriptions/:id': async (_b, id) => {
    const sub = found(db.subscriptions, id, 'subscription');
    if (sub.status !== 'canceled') {
      sub.status = 'canceled';
      sub.canceled_at = now(sub.customer);
      sub.ended_at = now(sub.customer);
      await emit('customer.subscription.deleted', sub);
    }
    return sub;
  },
  'POST /v1/invoiceitems': (b) => {
    if (!b.customer || !db.customers.has(b.customer))
      throw new ApiError(400, 'No such customer.', 'customer');
    const amount = Number(b.amount);
    if (!Number.isInteger(amount))
      throw new ApiError(400, 'amount must be an integer (cents).', 'amount');
    const item = {
      id: newId('ii'),
      object: 'invoiceitem',
      customer: b.customer,
      amount,
      currency: b.currency ?? 'usd',
      description: b.description ?? null,
      metadata: b.metadata ?? {},
      invoice: b.invoice ?? null,
      quantity: 1,
    };
    if (b.invoice) {
      const inv = found(db.invoices, b.invoice, 'invoice');
      if (inv.status !== 'draft')
        throw new ApiError(400, 'Items can only be added to a draft invoice.', 'invoice');
      inv.lines.data.push({
        id: newId('il'),
        object: 'line_item',
        description: item.description,
        amount,
        currency: item.currency,
        quantity: 1,
        period: { start: inv.period_start, end: inv.period_end },
        metadata: item.metadata,
      });
      invoiceTotals(inv);
    } else db.pendingItems.push(item);
    return item;
  },
  'GET /v1/invoices': (_b, _id, query) =>
    list(
      [...db.invoices.values()]
        .filter((i) => !query.get('customer') || i.customer === query.get('customer'))
        .reverse(),
      '/v1/invoices',
    ),
  'GET /v1/invoices/:id': (_b, id) => found(db.invoices, id, 'invoice'),
  'POST /v1/webhook_endpoints': (b) => {
    if (!/^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?\//.test(b.url ?? '')) {
      throw new ApiError(400, 'This local service only delivers to http://127.0.0.1.', 'url');
    }
    const events = Array.isArray(b.enabled_events) ? b.enabled_events : ['*'];
    let e = db.endpoints.find((x) => x.url === b.url);
    if (!e) {
      // Every endpoint shares the secret given at start, so the server can be configured with it.
      e = {
        id: newId('we'),
        object: 'webhook_endpoint',
        url: b.url,
        enabled_events: events,
        status: 'enabled',
        secret: WEBHOOK_SECRET,
        created: now(),
      };
      db.endpoints.push(e);
    }
    return e;
  },
  'DELETE /v1/webhook_endpoints/:id': (_b, id) => {
    const i = db.endpoints.findIndex((e) => e.id === id);
    if (i < 0) throw new ApiError(404, `No such webhook endpoint: '${id}'`, 'id');
    db.endpoints.splice(i, 1);
    return { id, object: 'webhook_endpoint', deleted: true };
  },
  // ---- test controls ----
  'POST /_fake/subscriptions/:id/renew': async (_b, id) => {
    const sub = found(db.subscriptions, id, 'subscription');
    if (sub.status === 'canceled') throw new ApiError(400, 'The subscription is canceled.', 'id');
    const ended = { start: sub.current_period_start, end: sub.current_period_end };
    setPeriod(sub, ended.end);
    // A draft at period end: endpoints add metered items on invoice.created before it is final.
    const inv = newInvoice(sub, 'subscription_cycle', ended);
    const created = await emit('invoice.created', inv);
    // Endpoints that answer get to add their items first; one nobody listens at holds nothing up.
    await deliveries.delivered(created.id, { skipUnreachable: true });
    sub.latest_invoice = inv.id;
    const paid = await collect(inv);
    sub.status = paid ? 'active' : 'past_due';
    // The new period (and any change of status): without it the receiver keeps the old period.
    await emit('customer.subscription.updated', sub);
    return inv;
  },
  'POST /_fake/customers/:id/card': (b, id) => {
    const c = found(db.customers, id, 'customer');
    if (!['approve', 'decline'].includes(b.behaviour))
      throw new ApiError(400, 'behaviour: approve or decline', 'behaviour');
    c.card = b.behaviour;
    return c;
  },
  // Holds the customer's clock at `frozen_time` (unix seconds): its subscriptions, invoices and
  // events are dated by it (e.g. a subscription started a month ago). Empty = the real clock.
  'POST /_fake/customers/:id/clock': (b, id) => {
    found(db.customers, id, 'customer');
    if (b.frozen_time === undefined || b.frozen_time === '') db.clocks.delete(id);
    else {
      const t = Number(b.frozen_time);
      if (!Number.isInteger(t) || t <= 0)
        throw new ApiError(400, 'frozen_time must be unix seconds (an integer).', 'frozen_time');
      db.clocks.set(id, t);
    }
    return { customer: id, frozen_time: db.clocks.get(id) ?? null };
  },
  'POST /_fake/events/:id/resend': async (_b, id) => {
    const event = db.events.find((e) => e.id === id);
    if (!event) throw new ApiError(404, 'No such event.', 'id');
    await deliveries.send(event, db.endpoints);
    await deliveries.delivered(event.id);
    return { resent: event.id };
  },
  'GET /_fake/events': () =>
    list(
      db.events.map((e) => ({ ...e, deliveries: deliveries.status.get(e.id) ?? [] })),
      '/_fake/events',
    ),
};

function found(map, id, what) {
  const v = map.get(id);
  if (!v) throw new ApiError(404, `No such ${what}: '${id}'`, 'id');
  return v;
}

function publicSession(s) {
  // The page's address follows this start's port (a session may come from an earlier start).
  const rest = { ...s, url: `${base}/checkout/${s.id}` };
  delete rest.line_items;
  delete rest.subscription_metadata;
  return rest;
}

async function approve(s) {
  const customer = db.customers.get(s.customer);
  if (customer?.card === 'decline') return decline(s);
  const item = s.line_items[0];
  const sub = {
    id: newId('sub'),
    object: 'subscription',
    customer: s.customer,
    status: 'active',
    created: now(s.customer),
    metadata: s.subscription_metadata,
    cancel_at_period_end: false,
    canceled_at: null,
    ended_at: null,
    latest_invoice: null,
    items: {
      object: 'list',
      data: [
        {
          id: newId('si'),
          object: 'subscription_item',
          quantity: 1,
          price: {
            id: newId('price'),
            object: 'price',
            unit_amount: item.unit_amount,
            currency: item.currency,
            recurring: { interval: item.interval },
            product_name: item.name,
          },
        },
      ],
    },
  };
  setPeriod(sub, now(s.customer));
  db.subscriptions.set(sub.id, sub);
  const inv = newInvoice(sub, 'subscription_create', {
    start: sub.current_period_start,
    end: sub.current_period_start,
  });
  sub.latest_invoice = inv.id;
  s.status = 'complete';
  s.payment_status = 'paid';
  s.subscription = sub.id;
  await emit('customer.subscription.created', sub);
  await collect(inv);
  await emit('checkout.session.completed', publicSession(s));
  return s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id);
}

async function decline(s) {
  s.status = 'expired';
  await emit('checkout.session.expired', publicSession(s));
  return s.cancel_url;
}

function match(method, path) {
  for (const [route, fn] of Object.entries(api)) {
    const [m, pattern] = route.split(' ');
    if (m !== method) continue;
    const re = new RegExp(`^${pattern.replace(':id', '([^/]+)')}$`);
    const hit = re.exec(path);
    if (hit) return { fn, id: hit[1] ? decodeURIComponent(hit[1]) : undefined };
  }
  return null;
}

function send(res, status, body, headers = {}) {
  res.writeHead(status, { 'Content-Type': 'application/json', ...headers });
  res.end(JSON.stringify(body));
}

const server = http.createServer(async (req, res) => {
  if (req.method !== 'GET') {
    // Saved before the answer leaves: whoever sees the answer can rely on the file.
    const end = res.end.bind(res);
    res.end = (...args) => {
      persist();
      return end(...args);
    };
  }
  try {
    const url = new URL(req.url, base);
    const page = /^\/checkout\/([^/]+)(?:\/(approve|decline))?$/.exec(url.pathname);
    if (page) {
      const s = db.sessions.get(page[1]);
      if (!s) return send(res, 404, { error: { message: 'No such checkout.' } });
      if (req.method === 'GET' && !page[2]) {
        res.writeHead(200, { 'Content-Type': 'text/html; charset=utf-8' });
        return res.end(checkoutPage(s, db.customers.get(s.customer)));
      }
      if (req.method === 'POST' && page[2] && s.status === 'open') {
        await readBody(req);
        const to = page[2] === 'approve' ? await approve(s) : await decline(s);
        res.writeHead(303, { Location: to });
        return res.end();
      }
      return send(res, 409, { error: { message: `The checkout is ${s.status}.` } });
    }
    if (req.headers.authorization !== `Bearer ${SECRET_KEY}`) {
      return send(res, 401, {
        error: { type: 'invalid_request_error', message: 'Invalid API key provided.' },
      });
    }
    const route = match(req.method, url.pathname);
    if (!route)
      return send(res, 404, {
        error: {
          type: 'invalid_request_error',
          message: `Unrecognized request URL (${req.method} ${url.pathname}).`,
        },
      });
    const text = await readBody(req);
    const body = req.headers['content-type']?.includes('json')
      ? JSON.parse(text || '{}')
      : parseForm(text);
    const key = req.method === 'POST' ? req.headers['idempotency-key'] : undefined;
    if (key && db.idempotency.has(key))
      return send(res, 200, db.idempotency.get(key), { 'Idempotent-Replayed': 'true' });
    const out = await route.fn(body, route.id, url.searchParams);
    if (key) db.idempotency.set(key, out);
    return send(res, 200, out, { 'Request-Id': newId('req') });
  } catch (e) {
    return failed(res, e);
  }
});

function persist() {
  try {
    save();
  } catch (e) {
    log(`could not write ${STATE_FILE}: ${e.message}`);
  }
}

function failed(res, e) {
  if (e instanceof ApiError) {
    return send(res, e.status, {
      error: { type: 'invalid_request_error', message: e.message, param: e.param },
    });
  }
  log(e.stack);
  return send(res, 500, { error: { type: 'api_error', message: e.message } });
}

server.listen(Number(process.env.PORT ?? 0), '127.0.0.1', () => {
  const { port } = server.address();
  base = `http://127.0.0.1:${port}`;
  process.stdout.write(`${JSON.stringify({ port })}\n`);
});

for (const sig of ['SIGTERM', 'SIGINT']) {
  process.on(sig, () => {
    deliveries.stop();
    persist();
    server.close(() => process.exit(0));
    server.closeAllConnections();
  });
}
