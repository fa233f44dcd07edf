// Billing test helpers: drive the payments fake like a buyer would, sign webhook payloads, and
// wait for asynchronous webhook effects.
import { createHmac } from 'node:crypto';
import type { SignedInAgent } from './accounts.js';
import type { RunningFake } from './frames.js';

/** `t=<unix>,v1=<hex HMAC-SHA256(secret, "<t>.<payload>")>`: the documented signing scheme. */
export function sign(payload: string, secret: string, t = Math.floor(Date.now() / 1000)): string {
  return `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${payload}`).digest('hex')}`;
}

/** Calls a fake-only control or API route with the fake's key. */
export async function fakeApi(
  fake: RunningFake,
  method: string,
  path: string,
  form?: Record<string, string>,
) {
  const res = await fetch(`${fake.env.PAYMENTS_API_URL}${path}`, {
    method,
    headers: {
      Authorization: `Bearer ${fake.env.PAYMENTS_SECRET_KEY}`,
      'Content-Type': 'application/x-www-form-urlencoded',
    },
    body: form ? new URLSearchParams(form).toString() : undefined,
  });
  const body = (await res.json()) as Record<string, unknown>;
  if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(body)}`);
  return body;
}

/** Polls `check` until it returns a truthy value (webhooks arrive asynchronously). */
export async function eventually<T>(check: () => Promise<T>, timeoutMs = 10_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v) return v;
    if (Date.now() > until) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** The buyer on the hosted checkout page: opens it, then approves or declines. */
export async function buyer(url: string, choice: 'approve' | 'decline') {
  const page = await fetch(url);
  const html = await page.text();
  const res = await fetch(`${url}/${choice}`, { method: 'POST', redirect: 'manual' });
  return {
    pageStatus: page.status,
    html,
    status: res.status,
    location: res.headers.get('location'),
  };
}

/** The organisation's current plan code, as its owner sees it. */
export async function planOf(o: SignedInAgent): Promise<string> {
  return (await o.agent.get('/v1/plans/current').expect(200)).body.plan.code as string;
}

/** Puts the owner's organisation on the Studio plan through the fake's hosted checkout. */
export async function studioByCheckout(o: SignedInAgent): Promise<void> {
  const checkout = await o.agent
    .post('/v1/billing/checkout')
    .send({ planCode: 'studio' })
    .expect(201);
  await buyer(checkout.body.url, 'approve');
  await eventually(async () => (await planOf(o)) === 'studio');
}
