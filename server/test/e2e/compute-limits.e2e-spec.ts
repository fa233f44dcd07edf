// Rate limits, quotas and metering under load, end to end with real keys.
import { DataSource } from 'typeorm';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { createKey, DEMO_BODIES, keyedOrg } from '../factories/compute.js';
import { signUp } from '../factories/accounts.js';

async function burst(url: string, secret: string, n: number, endpoint = 'balance') {
  return Promise.all(
    Array.from({ length: n }, () =>
      fetch(`${url}/v1/${endpoint}`, {
        method: 'POST',
        headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
        body: JSON.stringify(DEMO_BODIES[endpoint]),
      }).then(async (r) => ({
        status: r.status,
        headers: r.headers,
        body: (await r.json()) as Record<string, unknown>,
      })),
    ),
  );
}

describe('compute limits and metering', () => {
  let t: TestApp;
  let ds: DataSource;
  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
  });
  afterAll(async () => {
    await ds.destroy();
    await t.close();
  });

  it('a burst of 300 concurrent calls on the free plan meets 429 problems with Retry-After and RateLimit fields', async () => {
    const org = await keyedOrg(t.url);
    const res = await burst(t.url, org.live.secret, 300);
    const ok = res.filter((r) => r.status === 200);
    const limited = res.filter((r) => r.status === 429);
    expect(ok.length).toBeGreaterThan(0);
    expect(limited.length).toBeGreaterThan(200);
    expect(ok.length + limited.length).toBe(300);
    const r = limited[0]!;
    expect(r.headers.get('content-type')).toMatch(/problem\+json/);
    expect(r.body.type).toBe('https://lumenwright.test/problems/rate-limited');
    expect(Number(r.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    expect(r.headers.get('ratelimit-policy')).toBe('"key";q=10;w=2');
    expect(r.headers.get('ratelimit')).toMatch(/^"key";r=0;t=\d+$/);
  });

  it('test keys are limited more tightly than live keys on a paid plan', async () => {
    const org = await keyedOrg(t.url);
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      org.owner.organizationId,
    ]);
    const live = await burst(t.url, org.live.secret, 60);
    const test = await burst(t.url, org.test.secret, 60);
    expect(live.filter((r) => r.status === 200).length).toBe(60); // studio burst is 100
    expect(test.filter((r) => r.status === 429).length).toBeGreaterThan(30); // test burst is 20
  });

  it('answers quota exhaustion with a distinct 429 problem and the reset time', async () => {
    const owner = await signUp(t.url);
    const key = await createKey(owner, 'live');
    const now = new Date();
    const period = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1))
      .toISOString()
      .slice(0, 10);
    // Someone (another instance) has already reserved the free plan's whole month.
    await ds.query(
      `INSERT INTO quota_counters (organization_id, period_start, mode, reserved)
       SELECT $1, $2, 'live', included_calls_per_month FROM plans WHERE code = 'free'`,
      [owner.organizationId, period],
    );
    const [r] = await burst(t.url, key.secret, 1);
    expect(r!.status).toBe(429);
    expect(r!.body.type).toBe('https://lumenwright.test/problems/quota-exceeded');
    const reset = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() + 1, 1));
    expect(r!.body.resetAt).toBe(reset.toISOString());
    expect(Number(r!.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('never lets the counter pass the quota, however many calls race for the last ones', async () => {
    const owner = await signUp(t.url);
    const key = await createKey(owner, 'live');
    const now = new Date();
    const period = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1))
      .toISOString()
      .slice(0, 10);
    const [{ limit }] = await ds.query(
      `SELECT included_calls_per_month AS limit FROM plans WHERE code = 'free'`,
    );
    await ds.query(
      `INSERT INTO quota_counters (organization_id, period_start, mode, reserved) VALUES ($1, $2, 'live', $3)`,
      [owner.organizationId, period, limit - 5],
    );
    const res = await burst(t.url, key.secret, 8);
    expect(res.filter((r) => r.status === 200).length).toBe(5);
    expect(
      res.filter((r) => r.body.type === 'https://lumenwright.test/problems/quota-exceeded').length,
    ).toBe(3);
    const [row] = await ds.query(
      `SELECT reserved::int FROM quota_counters WHERE organization_id = $1 AND mode = 'live'`,
      [owner.organizationId],
    );
    expect(row.reserved).toBe(limit);
  });

  it('gives the quota back for calls that fail', async () => {
    const owner = await signUp(t.url);
    const key = await createKey(owner, 'live');
    const now = new Date();
    const period = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1))
      .toISOString()
      .slice(0, 10);
    const [{ limit }] = await ds.query(
      `SELECT included_calls_per_month AS limit FROM plans WHERE code = 'free'`,
    );
    await ds.query(
      `INSERT INTO quota_counters (organization_id, period_start, mode, reserved) VALUES ($1, $2, 'live', $3)`,
      [owner.organizationId, period, limit - 2],
    );
    const bad = await fetch(`${t.url}/v1/balance`, {
      method: 'POST',
      headers: { authorization: `Bearer ${key.secret}`, 'content-type': 'application/json' },
      body: JSON.stringify({ cameraKelvin: -1 }),
    });
    expect(bad.status).toBe(422);
    const res = await burst(t.url, key.secret, 3);
    expect(res.map((r) => r.status).sort()).toEqual([200, 200, 429]);
  });

  it('loses no usage event under load: rows written equal 2xx responses', async () => {
    const app2 = await bootApp({ USAGE_FLUSH_MS: '50', USAGE_BATCH_SIZE: '200' });
    const org = await keyedOrg(app2.url);
    await ds.query(`UPDATE organizations SET plan_code = 'platform' WHERE id = $1`, [
      org.owner.organizationId,
    ]);
    let ok = 0;
    const total = 3000;
    const concurrency = 50;
    let next = 0;
    await Promise.all(
      Array.from({ length: concurrency }, async () => {
        while (next < total) {
          next++;
          const r = await fetch(`${app2.url}/v1/balance`, {
            method: 'POST',
            headers: {
              authorization: `Bearer ${org.live.secret}`,
              'content-type': 'application/json',
            },
            body: JSON.stringify(DEMO_BODIES.balance),
          });
          await r.arrayBuffer();
          if (r.status >= 200 && r.status < 300) ok++;
        }
      }),
    );
    await app2.close(); // flushes what is still buffered
    const [{ n }] = await ds.query(
      `SELECT count(*)::int AS n FROM usage_events WHERE key_id = $1 AND status BETWEEN 200 AND 299`,
      [org.live.id],
    );
    const [{ d }] = await ds.query(
      `SELECT COALESCE(SUM(calls), 0)::int AS d FROM usage_daily WHERE key_id = $1 AND status BETWEEN 200 AND 299`,
      [org.live.id],
    );
    console.log(`load: ${ok} 2xx responses, ${n} usage rows, ${d} in daily roll-ups`);
    expect(ok).toBe(total);
    expect(n).toBe(ok);
    expect(d).toBe(ok);
  }, 60_000);
  it('limits the same way with the PostgreSQL-backed bucket store (several instances)', async () => {
    const a = await bootApp({ RATE_LIMIT_STORE: 'postgres' });
    const b = await bootApp({ RATE_LIMIT_STORE: 'postgres' });
    try {
      const org = await keyedOrg(a.url);
      // Two instances share one bucket: 40 calls split across both still meet the burst of 10.
      const res = [
        ...(await burst(a.url, org.live.secret, 20)),
        ...(await burst(b.url, org.live.secret, 20)),
      ];
      const ok = res.filter((r) => r.status === 200).length;
      expect(ok).toBeGreaterThanOrEqual(10);
      expect(ok).toBeLessThan(20);
      expect(res.filter((r) => r.status === 429).length).toBe(40 - ok);
    } finally {
      await a.close();
      await b.close();
    }
  });

  it('lets a key read its plan and this month’s counted calls (GET /v1/plans/current)', async () => {
    const org = await keyedOrg(t.url);
    const read = async () => {
      const r = await fetch(`${t.url}/v1/plans/current`, {
        headers: { authorization: `Bearer ${org.live.secret}` },
      });
      expect(r.status).toBe(200);
      expect(r.headers.get('ratelimit-policy')).toBe('"key";q=10;w=2');
      return (await r.json()) as {
        plan: { code: string; includedCalls: number };
        usage: { liveCallsCounted: number; testCallsCounted: number };
      };
    };
    const before = await read();
    expect(before.plan.code).toBe('free');
    expect(before.usage.liveCallsCounted).toBe(0);
    const calls = await burst(t.url, org.live.secret, 3);
    expect(calls.map((c) => c.status)).toEqual([200, 200, 200]);
    // Usage rows are written in batches: wait for them to land in the daily roll-up.
    let after = await read();
    for (let i = 0; i < 50 && after.usage.liveCallsCounted < 3; i++) {
      await new Promise((r) => setTimeout(r, 100));
      after = await read();
    }
    expect(after.usage.liveCallsCounted).toBe(3);
    expect(after.usage.testCallsCounted).toBe(0);
  });

  it('checks keys with its own strategy after other apps in the process have started and stopped', async () => {
    // Each app holds its own bearer strategy; none is taken from a process-wide registry that a
    // later app (now closed, its database handle gone) would have overwritten.
    const org = await keyedOrg(t.url);
    const res = await burst(t.url, org.live.secret, 1);
    expect(res[0]!.status).toBe(200);
    const bad = await fetch(`${t.url}/v1/balance`, {
      method: 'POST',
      headers: { authorization: 'Bearer lw_live_nothing', 'content-type': 'application/json' },
      body: JSON.stringify(DEMO_BODIES.balance),
    });
    expect(bad.status).toBe(401);
    expect(bad.headers.get('www-authenticate')).toMatch(/^Bearer/);
  });
});
