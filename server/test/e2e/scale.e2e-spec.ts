// §3 scale: two instances of the BUILT server (separate processes, as behind a load balancer) on
// one database, with the PostgreSQL-backed rate limiter (RATE_LIMIT_STORE=postgres). Separate
// processes matter: each has its own key cache, plan cache and usage buffer, and no shared memory.
import { randomBytes } from 'node:crypto';
import pg from 'pg';
import type { DataSource } from 'typeorm';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { createKey, DEMO_BODIES } from '../factories/compute.js';
import { call, startServer, until, type ServerProcess } from '../factories/ops.js';
import { UsagePartitions, monthPartitions } from '../../src/usage/usage-partitions.service.js';
import { migrate, openDataSource, testDatabaseUrl } from '../setup/db.js';

describe('scale: two instances on one database', () => {
  let a: ServerProcess;
  let b: ServerProcess;
  let ds: DataSource;
  let owner: SignedInAgent;

  beforeAll(async () => {
    await migrate();
    const env = {
      DATABASE_URL: testDatabaseUrl(),
      RATE_LIMIT_STORE: 'postgres',
      SESSION_SECRET: randomBytes(32).toString('hex'), // one secret: sessions work on both
    };
    [a, b] = await Promise.all([startServer(env), startServer(env)]);
    ds = await openDataSource();
    owner = await signUp(a.url, { organizationName: 'Twin Harbour Scale Studio' });
  }, 60_000);

  afterAll(async () => {
    await Promise.all([a?.stop(), b?.stop()]);
    await ds?.destroy();
  });

  const burst = (n: number, secret: string) =>
    Promise.all(
      Array.from({ length: n }, (_, i) =>
        call(i % 2 ? b.url : a.url, secret, 'balance', DEMO_BODIES.balance),
      ),
    );

  it('rate limits hold across both instances (one shared bucket per key)', async () => {
    const key = await createKey(owner, 'live');
    // Free plan: burst 10, 5 calls/s. 40 calls at once, alternating between the instances.
    const t0 = Date.now();
    const res = await burst(40, key.secret);
    const secs = (Date.now() - t0) / 1000;
    const ok = res.filter((r) => r.status === 200).length;
    const limited = res.filter((r) => r.status === 429);
    console.log(`rate limit across 2 instances: ${ok} × 200, ${limited.length} × 429 in ${secs} s`);
    // One bucket: the burst, plus what refills at 5/s while the calls run. Two separate buckets
    // would let about 20 through.
    expect(ok).toBeGreaterThanOrEqual(10);
    expect(ok).toBeLessThanOrEqual(10 + Math.ceil(5 * secs));
    expect(ok).toBeLessThan(20);
    expect(ok + limited.length).toBe(40);
    expect(limited.every((r) => r.body.includes('/problems/rate-limited'))).toBe(true);
    // Both instances refused some: neither kept its own bucket.
    const refusedBy = new Set(
      res.map((r, i) => (r.status === 429 ? i % 2 : -1)).filter((x) => x >= 0),
    );
    expect(refusedBy.size).toBe(2);
  });

  it('the monthly quota holds across both instances: exactly what is left is served', async () => {
    // A fresh organisation: no instance holds a block of its quota yet.
    const org = await signUp(b.url, { organizationName: 'Twin Harbour Quota Studio' });
    const key = await createKey(org, 'live');
    const period = new Date().toISOString().slice(0, 8) + '01';
    // Free plan: 2,000 live calls a month. Leave 5 and let 8 calls race over both instances.
    await ds.query(
      `INSERT INTO quota_counters (organization_id, period_start, mode, reserved, last_grant)
       VALUES ($1, $2, 'live', 1995, 0)
       ON CONFLICT (organization_id, period_start, mode) DO UPDATE SET reserved = 1995`,
      [org.organizationId, period],
    );
    const res = await burst(8, key.secret);
    const statuses = res.map((r) => r.status);
    const quota = res.filter((r) => r.body.includes('/problems/quota-exceeded'));
    expect(statuses.filter((s) => s === 200)).toHaveLength(5);
    expect(quota).toHaveLength(3);
    const [row] = await ds.query(
      `SELECT reserved::int AS reserved FROM quota_counters
        WHERE organization_id = $1 AND period_start = $2 AND mode = 'live'`,
      [org.organizationId, period],
    );
    expect(row.reserved).toBe(2000);
  });

  it('a revoked key stops working on both instances within 1 s', async () => {
    const key = await createKey(owner, 'live');
    // Warm both instances' key caches.
    await new Promise((r) => setTimeout(r, 2200));
    for (const s of [a, b]) {
      const r = await call(s.url, key.secret, 'balance', DEMO_BODIES.balance);
      expect(r.status).not.toBe(401);
    }
    const revokedAt = Date.now();
    await owner.agent.delete(`/v1/keys/${key.id}`).expect(200);
    const times = await Promise.all(
      [a, b].map((s) =>
        until(
          'key refused',
          async () => {
            const r = await fetch(`${s.url}/v1/whoami`, {
              headers: { authorization: `Bearer ${key.secret}` },
            });
            return r.status === 401 ? Date.now() - revokedAt : null;
          },
          1_000,
        ),
      ),
    );
    console.log(`revocation seen after ${times.join(' ms and ')} ms (instance A, B)`);
    for (const ms of times) expect(ms).toBeLessThanOrEqual(1_000);
  });
});

describe('scale: monthly partitions of usage_events', () => {
  let pool: pg.Pool;
  const created: string[] = [];

  beforeAll(async () => {
    await migrate();
    pool = new pg.Pool({ connectionString: testDatabaseUrl(), max: 2 });
  });

  afterAll(async () => {
    for (const name of created) await pool.query(`DROP TABLE IF EXISTS ${name}`);
    await pool.end();
  });

  const partOf = async (occurredAt: string) => {
    const r = await pool.query(
      `INSERT INTO usage_events (occurred_at, organization_id, source, endpoint, status, latency_ms, request_id)
       VALUES ($1, gen_random_uuid(), 'test', 'balance', 200, 1, 'partition-test')
       RETURNING tableoid::regclass::text AS part`,
      [occurredAt],
    );
    return r.rows[0].part as string;
  };

  it('rows land in their month’s partition; months without one land in the default partition', async () => {
    const months = monthPartitions(new Date());
    for (const m of months) {
      expect(await partOf(`${m.from}T00:00:00Z`)).toBe(m.name); // first instant of the month
      const last = new Date(new Date(`${m.to}T00:00:00Z`).getTime() - 1).toISOString();
      expect(await partOf(last)).toBe(m.name); // last millisecond of the month
    }
    expect(await partOf('2099-03-15T12:00:00Z')).toBe('usage_events_default');
    await pool.query(`DELETE FROM usage_events WHERE request_id = 'partition-test'`);
  });

  it('creates the partitions of a new month ahead of time (idempotently)', async () => {
    const service = new UsagePartitions(pool);
    const future = new Date(Date.UTC(2031, 4, 15)); // May 2031: no partition yet
    const expected = monthPartitions(future).map((p) => p.name);
    expect(expected).toEqual([
      'usage_events_2031_05',
      'usage_events_2031_06',
      'usage_events_2031_07',
    ]);
    created.push(...expected);
    await service.ensure(future);
    await service.ensure(future); // a second instance doing the same at the same time is harmless
    const r = await pool.query(
      `SELECT c.relname, pg_get_expr(c.relpartbound, c.oid) AS bound
         FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid
        WHERE i.inhparent = 'usage_events'::regclass AND c.relname = ANY($1) ORDER BY 1`,
      [expected],
    );
    expect(r.rows).toEqual([
      {
        relname: 'usage_events_2031_05',
        bound: "FOR VALUES FROM ('2031-05-01 00:00:00+00') TO ('2031-06-01 00:00:00+00')",
      },
      {
        relname: 'usage_events_2031_06',
        bound: "FOR VALUES FROM ('2031-06-01 00:00:00+00') TO ('2031-07-01 00:00:00+00')",
      },
      {
        relname: 'usage_events_2031_07',
        bound: "FOR VALUES FROM ('2031-07-01 00:00:00+00') TO ('2031-08-01 00:00:00+00')",
      },
    ]);
    expect(await partOf('2031-06-30T23:59:59Z')).toBe('usage_events_2031_06');
    await pool.query(`DELETE FROM usage_events WHERE request_id = 'partition-test'`);
  });

  it('a query over one month scans only that month’s partition (pruning), by the org index', async () => {
    const [m] = monthPartitions(new Date());
    const c = await pool.connect();
    try {
      // Small tables would otherwise be read sequentially; this asks for the plan at scale.
      await c.query('SET enable_seqscan = off');
      const r = await c.query(
        `EXPLAIN (FORMAT JSON)
         SELECT id, occurred_at FROM usage_events
          WHERE organization_id = $1 AND occurred_at >= $2 AND occurred_at < $3
          ORDER BY occurred_at DESC, id DESC LIMIT 50`,
        ['00000000-0000-4000-8000-000000000000', `${m!.from}T00:00:00Z`, `${m!.to}T00:00:00Z`],
      );
      const plan = JSON.stringify(r.rows[0]['QUERY PLAN']);
      const scanned = [...plan.matchAll(/"Relation Name":"(usage_events[a-z0-9_]*)"/g)].map(
        (x) => x[1],
      );
      expect([...new Set(scanned)]).toEqual([m!.name]);
      expect(plan).toMatch(/Index (Only )?Scan/);
    } finally {
      await c.query('RESET enable_seqscan').catch(() => undefined);
      c.release();
    }
  });
});
