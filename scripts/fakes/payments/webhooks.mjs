// Event delivery: each event is POSTed to every registered endpoint, signed the way the payments
// service documents it — header `Stripe-Signature: t=<unix seconds>,v1=<hex HMAC-SHA256 of
// "<t>.<payload>" with the endpoint secret>` — and retried with exponential back-off until the
// endpoint answers 2xx or the attempts run out.
import { createHmac } from 'node:crypto';

export function signature(payload, secret, t = Math.floor(Date.now() / 1000)) {
  const v1 = createHmac('sha256', secret).update(`${t}.${payload}`, 'utf8').digest('hex');
  return `t=${t},v1=${v1}`;
}

export class Deliveries {
  constructor({ retryBaseMs = 500, maxAttempts = 8, log = () => undefined } = {}) {
    this.retryBaseMs = retryBaseMs;
    this.maxAttempts = maxAttempts;
    this.log = log;
    /** event id → [{endpoint, attempts, delivered, lastStatus}] */
    this.status = new Map();
    this.timers = new Set();
  }

  /** Sends `event` to the endpoints; resolves after the first attempt at each (retries go on). */
  async send(event, endpoints) {
    const payload = JSON.stringify(event, null, 2);
    const rows = [];
    this.status.set(event.id, rows);
    await Promise.all(
      endpoints
        .filter((e) => e.enabled_events.includes('*') || e.enabled_events.includes(event.type))
        .map((endpoint) => {
          const row = {
            endpoint: endpoint.url,
            attempts: 0,
            delivered: false,
            unreachable: false,
            lastStatus: null,
          };
          rows.push(row);
          return this.attempt(endpoint, payload, row);
        }),
    );
  }

  async attempt(endpoint, payload, row) {
    row.attempts++;
    try {
      const res = await fetch(endpoint.url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'User-Agent': 'lumenwright-payments-fake',
          'Stripe-Signature': signature(payload, endpoint.secret),
        },
        body: payload,
        signal: AbortSignal.timeout(10_000),
      });
      row.lastStatus = res.status;
      await res.arrayBuffer().catch(() => undefined);
      if (res.ok) {
        row.delivered = true;
        return;
      }
      row.unreachable = false;
    } catch (e) {
      row.lastStatus = `error: ${e.message}`;
      row.unreachable = e.cause?.code === 'ECONNREFUSED';
    }
    if (row.attempts >= this.maxAttempts) {
      this.log(`webhook to ${endpoint.url} gave up after ${row.attempts} attempts`);
      return;
    }
    const delay = this.retryBaseMs * 2 ** (row.attempts - 1);
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      void this.attempt(endpoint, payload, row);
    }, delay);
    this.timers.add(timer);
  }

  /**
   * Resolves when every endpoint has the event (or rejects after `timeoutMs`); with
   * `skipUnreachable`, an endpoint whose last attempt found nobody listening is not waited for.
   */
  async delivered(eventId, { timeoutMs = 15_000, skipUnreachable = false } = {}) {
    const until = Date.now() + timeoutMs;
    for (;;) {
      const rows = this.status.get(eventId) ?? [];
      if (rows.every((r) => r.delivered || (skipUnreachable && r.unreachable))) return;
      if (Date.now() > until) throw new Error(`event ${eventId} not delivered`);
      await new Promise((r) => setTimeout(r, 50));
    }
  }

  stop() {
    for (const t of this.timers) clearTimeout(t);
    this.timers.clear();
  }
}
