// The Redis-backed rate-limit store (RATE_LIMIT_STORE=redis) on a real redis-server of our own:
// its Lua bucket against the in-memory store (the reference) on the same takes, key prefix and
// TTL, the configuration rules, two BUILT server processes sharing one Redis (as behind a load
// balancer: separate processes, see scale.e2e-spec.ts for why), and, last, that Redis stopped
// under load and started again on the same port. Chosen behaviour (server/OPERATIONS.md,
// "Faults"): while the rate-limit store is unreachable, compute answers 503 problem+json with
// Retry-After (a call that can't be limited is not served), health names Redis, the process
// stays up, and calls are served again within 5 s of Redis returning.
import { spawnSync } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { Redis } from 'ioredis';
import type { DataSource } from 'typeorm';
import { ConfigError, loadConfig } from '../../src/config/config.js';
import {
  MemoryRateLimitStorage,
  RedisRateLimitStorage,
} from '../../src/plans/rate-limit.storage.js';
import { REDIS } from '../../src/redis/redis.module.js';
import { signUp } from '../factories/accounts.js';
import { createKey, DEMO_BODIES } from '../factories/compute.js';
import {
  assertBuilt,
  call,
  health,
  load,
  ROOT,
  SERVER_MAIN,
  sleep,
  startServer,
  tally,
  throwawayRedis,
  until,
  type ServerProcess,
  type ThrowawayRedis,
} from '../factories/ops.js';
import { bootApp } from '../setup/app.js';
import { migrate, openDataSource, testDatabaseUrl } from '../setup/db.js';

let server: ThrowawayRedis;
let client: Redis;

beforeAll(async () => {
  server = await throwawayRedis();
  server.start();
  client = new Redis(server.url, { maxRetriesPerRequest: 0 });
  client.on('error', () => undefined); // the fault test stops Redis under it
}, 300_000);

afterAll(async () => {
  await client?.quit();
  server?.remove();
});

describe('Redis token bucket (Lua) against the in-memory store', () => {
  type Take = { key: string; gapMs: number };
  const replay = async (takes: Take[], rate: number, burst: number) => {
    let now = 1_700_000_000_000;
    const clock = () => now;
    const memory = new MemoryRateLimitStorage(clock);
    const prefix = `lw:test:${randomUUID()}:`;
    const redis = new RedisRateLimitStorage(client, { prefix, now: clock });
    const ttl = (1000 * burst) / rate; // the guard's mapping
    let blocked = 0;
    try {
      for (const t of takes) {
        now += t.gapMs;
        const want = memory.take(t.key, ttl, burst);
        const got = await redis.increment(t.key, ttl, burst);
        // The whole record, not only the decision: same tokens, same headers, same Retry-After.
        expect(got).toEqual(want);
        if (want.isBlocked) blocked++;
      }
    } finally {
      memory.close();
    }
    return blocked;
  };

  it('makes the same decisions and returns the same records on random sequences of takes', async () => {
    // Token bucket per RFC 2697 §3 (bucket of size CBS filled at CIR): both stores implement it;
    // the memory store, checked in rate-limit.storage.spec.ts, is the reference here.
    let takes = 0;
    let blocked = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 1, max: 50 }), // rate per second
        fc.integer({ min: 1, max: 40 }), // burst
        fc.array(
          fc.record({
            key: fc.constantFrom('k:a', 'k:b', 'u:c'),
            // Mostly bursts (refusals and fractional refills), sometimes long idle gaps.
            gapMs: fc.oneof(
              { arbitrary: fc.constant(0), weight: 4 },
              { arbitrary: fc.integer({ min: 1, max: 250 }), weight: 4 },
              { arbitrary: fc.nat(20_000), weight: 1 },
            ),
          }),
          { minLength: 20, maxLength: 200 },
        ),
        async (rate, burst, seq) => {
          blocked += await replay(seq, rate, burst);
          takes += seq.length;
        },
      ),
      { numRuns: 60 },
    );
    console.log(
      `Lua vs memory: ${takes} random takes matched record for record (${blocked} refused)`,
    );
    // The runs exercised refusals, not only admissions.
    expect(blocked).toBeGreaterThan(0);
  });

  it('a long steady sequence: same admissions as the memory store, burst + rate × time', async () => {
    // 10 s of a call every 10 ms at 5/s with burst 10: 10 + 5 × 10 admitted (the same figure
    // rate-limit.storage.spec.ts checks for the memory store).
    let now = 5_000_000;
    const prefix = `lw:test:${randomUUID()}:`;
    const redis = new RedisRateLimitStorage(client, { prefix, now: () => now });
    let admitted = 0;
    for (let ms = 0; ms <= 10_000; ms += 10) {
      now = 5_000_000 + ms;
      if (!(await redis.increment('k:steady', 2000, 10)).isBlocked) admitted++;
    }
    expect(admitted).toBe(10 + 5 * 10);
  });

  it('keeps buckets under a prefix with a TTL (idle buckets expire); survives a flushed script cache', async () => {
    const prefix = `lw:test:${randomUUID()}:`;
    const now = Date.now();
    const redis = new RedisRateLimitStorage(client, { prefix, now: () => now });
    // Burst 4 refilled in 200 ms: 3 takes at one instant leave 1 token, 150 ms from full; the
    // key lives a second longer than that.
    for (let i = 0; i < 3; i++) await redis.increment('k:idle', 200, 4);
    expect(await client.hget(`${prefix}k:idle`, 'tokens')).toBe('1');
    const pttl = await client.pttl(`${prefix}k:idle`);
    expect(pttl).toBeGreaterThan(1000);
    expect(pttl).toBeLessThanOrEqual(150 + 1000);

    // A Redis restarted without persistence has no scripts: EVALSHA falls back to EVAL.
    await client.script('FLUSH');
    expect((await redis.increment('k:other', 200, 4)).isBlocked).toBe(false);
  });

  it('uses Redis’s own clock by default: a full burst passes at once, then refusals', async () => {
    const redis = new RedisRateLimitStorage(client, { prefix: `lw:test:${randomUUID()}:` });
    const results = await Promise.all(
      Array.from({ length: 15 }, () => redis.increment('k:burst', 60_000, 10)),
    );
    expect(results.filter((r) => !r.isBlocked)).toHaveLength(10);
    expect(results.filter((r) => r.isBlocked).every((r) => r.timeToBlockExpire >= 1)).toBe(true);
  });
});

describe('Redis store configuration', () => {
  const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db' };

  it('RATE_LIMIT_STORE=redis needs a redis:// REDIS_URL', () => {
    expect(() => loadConfig({ ...base, RATE_LIMIT_STORE: 'redis' })).toThrow(/needs REDIS_URL/);
    expect(() =>
      loadConfig({ ...base, RATE_LIMIT_STORE: 'redis', REDIS_URL: 'http://127.0.0.1:6379' }),
    ).toThrow(ConfigError);
    expect(() => loadConfig({ ...base, RATE_LIMIT_STORE: 'valkey' })).toThrow(
      /memory, postgres or redis/,
    );
    const c = loadConfig({ ...base, RATE_LIMIT_STORE: 'redis', REDIS_URL: server.url });
    expect(c).toMatchObject({ rateLimitStore: 'redis', redisUrl: server.url });
  });

  it('the built server refuses to start without REDIS_URL: a clear message, exit code 2', () => {
    assertBuilt();
    const r = spawnSync(process.execPath, [SERVER_MAIN], {
      cwd: ROOT,
      encoding: 'utf8',
      timeout: 30_000,
      env: {
        PATH: process.env.PATH,
        NODE_ENV: 'production',
        DATABASE_URL: testDatabaseUrl(),
        SESSION_SECRET: randomBytes(32).toString('hex'),
        RATE_LIMIT_STORE: 'redis',
      },
    });
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/Configuration error: RATE_LIMIT_STORE=redis needs REDIS_URL/);
  });
});

describe('scale: two instances on one Redis', () => {
  let a: ServerProcess;
  let b: ServerProcess;
  let ds: DataSource;
  const PLAN = 'redis_scale_burst40';

  beforeAll(async () => {
    await migrate();
    ds = await openDataSource();
    // A plan of our own (removed afterwards): burst 40, 4 calls/s, a quota far above the test.
    await ds.query(
      `INSERT INTO plans (code, name, description, monthly_price_cents, included_calls_per_month,
         test_calls_per_month, rate_per_second, burst, overage_price_per_1000_cents, uploads,
         saved_setups, seats, sort_order)
       VALUES ($1, 'Burst 40', 'Test plan', 0, 1000000, 1000, 4, 40, NULL, false, 1, 1, 99)
       ON CONFLICT (code) DO NOTHING`,
      [PLAN],
    );
    const env = {
      DATABASE_URL: testDatabaseUrl(),
      RATE_LIMIT_STORE: 'redis',
      REDIS_URL: server.url,
      SESSION_SECRET: randomBytes(32).toString('hex'),
    };
    [a, b] = await Promise.all([startServer(env), startServer(env)]);
  }, 60_000);

  afterAll(async () => {
    await Promise.all([a?.stop(), b?.stop()]);
    await ds?.query(`UPDATE organizations SET plan_code = 'free' WHERE plan_code = $1`, [PLAN]);
    await ds?.query(`DELETE FROM plans WHERE code = $1`, [PLAN]);
    await ds?.destroy();
  });

  it('a key’s burst holds across both instances: about 40 of 200 concurrent calls pass, not 80', async () => {
    const owner = await signUp(a.url, { organizationName: 'Twin Weir Redis Studio' });
    await ds.query(`UPDATE organizations SET plan_code = $1 WHERE id = $2`, [
      PLAN,
      owner.organizationId,
    ]);
    const key = await createKey(owner, 'live');
    const t0 = Date.now();
    const res = await Promise.all(
      Array.from({ length: 200 }, (_, i) =>
        call(i % 2 ? b.url : a.url, key.secret, 'balance', DEMO_BODIES.balance),
      ),
    );
    const secs = (Date.now() - t0) / 1000;
    const ok = res.filter((r) => r.status === 200).length;
    const limited = res.filter((r) => r.status === 429);
    const byInstance = [0, 1].map(
      (side) => res.filter((r, i) => i % 2 === side && r.status === 200).length,
    );
    console.log(
      `rate limit across 2 instances on one Redis: ${ok} × 200 (A ${byInstance[0]}, B ${byInstance[1]}), ` +
        `${limited.length} × 429 of 200 calls in ${secs} s`,
    );
    // One bucket: the burst of 40 plus what refills at 4/s while the calls run. A bucket per
    // instance would let 80 or more through.
    expect(ok).toBeGreaterThanOrEqual(40);
    expect(ok).toBeLessThanOrEqual(40 + Math.ceil(4 * secs));
    expect(ok).toBeLessThan(80);
    expect(ok + limited.length).toBe(200);
    expect(limited.every((r) => r.body.includes('/problems/rate-limited'))).toBe(true);
    expect(limited.every((r) => Number(r.retryAfter) >= 1)).toBe(true);
    // Both instances served some and refused some: neither kept its own bucket.
    expect(byInstance.every((n) => n > 0)).toBe(true);
    expect(
      new Set(res.map((r, i) => (r.status === 429 ? i % 2 : -1)).filter((x) => x >= 0)).size,
    ).toBe(2);
    // The bucket lives in Redis under the prefix, with a TTL.
    const keys = await client.keys('lw:rl:k:*');
    expect(keys.length).toBeGreaterThan(0);
    expect(await client.pttl(keys[0]!)).toBeGreaterThan(0);
  }, 60_000);

  it('reports Redis in /v1/health, and closes its connection when the app shuts down', async () => {
    const h = await fetch(`${a.url}/v1/health`);
    expect(h.status).toBe(200);
    expect(await h.json()).toMatchObject({
      details: { database: { status: 'up' }, redis: { status: 'up' } },
    });

    const t = await bootApp({ RATE_LIMIT_STORE: 'redis', REDIS_URL: server.url });
    const redis = t.app.get<Redis>(REDIS);
    expect(redis.status).toBe('ready');
    await t.close();
    expect(redis.status).toBe('end');
  }, 60_000);

  it('faults: Redis stopped under load: 503 problem+json with Retry-After, health says so, the process stays up, served again within 5 s', async () => {
    const owner = await signUp(a.url, { organizationName: 'Ferrylight Faults Studio' });
    // The platform plan: a burst far above this load, so every refusal here is the outage's.
    await ds.query(`UPDATE organizations SET plan_code = 'platform' WHERE id = $1`, [
      owner.organizationId,
    ]);
    const key = await createKey(owner, 'live');
    const traffic = load(a.url, key.secret, 'balance', DEMO_BODIES.balance, 8);
    await sleep(800);
    expect(traffic.results.some((r) => r.status === 200)).toBe(true);

    server.stop(); // returns once redis-server has exited
    const downAt = Date.now();
    await sleep(1000);
    const h = await health(a.url);
    const aliveWhileDown = a.alive() && b.alive();
    const t0 = Date.now();
    const during = await call(b.url, key.secret, 'balance', DEMO_BODIES.balance);
    const duringMs = Date.now() - t0;
    await sleep(500);
    const upAt = Date.now();
    server.start(); // returns once Redis accepts connections
    const readyAt = Date.now();
    const back = await Promise.all(
      [a, b].map((s) =>
        until(
          'a 200 after Redis returned',
          async () => {
            const r = await call(s.url, key.secret, 'balance', DEMO_BODIES.balance);
            return r.status === 200 ? Date.now() - readyAt : null;
          },
          5_000,
        ),
      ),
    );
    await sleep(300);
    const results = await traffic.stop();
    const healthAfter = await health(a.url);

    const outage = results.filter((r) => r.at >= downAt + 300 && r.at < upAt);
    console.log(
      `Redis outage: ${results.length} calls under load; during the outage ${JSON.stringify(tally(outage))}; ` +
        `a call while down took ${duringMs} ms: ${during.status} ${during.body}; ` +
        `health while down: ${h.status} ${h.body}; ` +
        `served again ${back.join(' ms and ')} ms after Redis accepted connections (A, B)`,
    );

    // The processes stay up and serve again within 5 s of Redis returning.
    expect(aliveWhileDown).toBe(true);
    expect(a.alive() && b.alive()).toBe(true);
    for (const ms of back) expect(ms).toBeLessThanOrEqual(5_000);
    expect(healthAfter.status).toBe(200);
    expect(JSON.parse(healthAfter.body)).toMatchObject({ details: { redis: { status: 'up' } } });

    // /v1/health answers 503 problem+json and names Redis (the database is still up).
    expect(h.status).toBe(503);
    expect(JSON.parse(h.body)).toMatchObject({
      type: 'https://lumenwright.test/problems/unavailable',
      checks: { database: { status: 'up' }, redis: { status: 'down' } },
    });

    // A call while Redis is down: 503 problem+json with Retry-After at once, never a 500.
    expect(during.status).toBe(503);
    expect(during.contentType).toMatch(/^application\/problem\+json/);
    expect(Number(during.retryAfter)).toBeGreaterThanOrEqual(1);
    expect(JSON.parse(during.body)).toMatchObject({
      status: 503,
      type: 'https://lumenwright.test/problems/unavailable',
      detail: expect.stringMatching(/Redis/),
    });
    expect(duringMs).toBeLessThan(1_500); // fails fast: no queue waiting for a reconnect
    // Under load during the outage: only 503s with Retry-After, no 500, no dropped connection.
    expect(outage.length).toBeGreaterThan(0);
    expect(outage.filter((r) => r.status !== 503)).toEqual([]);
    expect(outage.every((r) => Number(r.retryAfter) >= 1)).toBe(true);
  }, 60_000);
});
