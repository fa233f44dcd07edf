// The demo studio's invented call history: idempotent, its roll-up and quota use consistent with
// its events, nothing outside the keys' lives, and every month in its own partition.
import type { DataSource } from 'typeorm';
import { accountsSeeder, DEMO_ORG_ID } from '../../src/auth/accounts.seeder.js';
import { plansSeeder } from '../../src/plans/plans.seeder.js';
import { monthBounds } from '../../src/plans/quota.service.js';
import { demoTraffic } from '../../src/usage/demo-traffic.js';
import { DEMO_TRAFFIC_KEYS, usageSeeder } from '../../src/usage/usage.seeder.js';
import { migrate, openDataSource } from '../setup/db.js';

describe('usage: demo seed', () => {
  let db: DataSource;
  beforeAll(async () => {
    await migrate();
    db = await openDataSource();
    await plansSeeder.run(db);
    await accountsSeeder.run(db);
  }, 60000);
  afterAll(async () => {
    await db?.destroy();
  });

  const one = async <T>(sql: string, args: unknown[] = [DEMO_ORG_ID]) =>
    ((await db.query(sql, args)) as T[])[0]!;

  it('seeds once: a second run adds nothing', async () => {
    await usageSeeder.run(db);
    const first = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM usage_events WHERE organization_id = $1`,
    );
    expect(first.n).toBeGreaterThan(300);
    await usageSeeder.run(db);
    const second = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM usage_events WHERE organization_id = $1`,
    );
    expect(second.n).toBe(first.n);
  });

  it('keeps the daily roll-up equal to its events, group by group', async () => {
    const diff = await one<{ n: number }>(
      `WITH e AS (
         SELECT (occurred_at AT TIME ZONE 'UTC')::date AS day, key_id, source, endpoint, status,
                count(*)::bigint AS calls, sum(billable_units)::bigint AS units
           FROM usage_events WHERE organization_id = $1 GROUP BY 1, 2, 3, 4, 5),
       d AS (
         SELECT day, key_id, source, endpoint, status, calls, billable_units AS units
           FROM usage_daily WHERE organization_id = $1)
       SELECT count(*)::int AS n FROM ((SELECT * FROM e EXCEPT SELECT * FROM d)
                                  UNION ALL (SELECT * FROM d EXCEPT SELECT * FROM e)) x`,
    );
    expect(diff.n).toBe(0);
  });

  it('takes this month’s successful key calls from the quota, and stays inside even the free plan', async () => {
    const { start } = monthBounds(new Date());
    for (const mode of ['live', 'test']) {
      const { calls } = await one<{ calls: number }>(
        `SELECT count(*)::int AS calls FROM usage_events
          WHERE organization_id = $1 AND source = $2 AND status < 300 AND occurred_at >= $3::date`,
        [DEMO_ORG_ID, mode, start],
      );
      const q = (await db.query(
        `SELECT reserved FROM quota_counters
          WHERE organization_id = $1 AND period_start = $2::date AND mode = $3`,
        [DEMO_ORG_ID, start, mode],
      )) as { reserved: string }[];
      expect(Number(q[0]?.reserved ?? 0)).toBe(calls);
    }
    const { live, included } = await one<{ live: number; included: number }>(
      `SELECT (SELECT count(*)::int FROM usage_events e WHERE e.organization_id = o.id
                 AND e.source = 'live' AND e.occurred_at >= $2::date) AS live,
              p.included_calls_per_month AS included
         FROM organizations o JOIN plans p ON p.code = 'free' WHERE o.id = $1`,
      [DEMO_ORG_ID, start],
    );
    expect(live).toBeLessThan(included);
  });

  it('has no call before a key existed or after it was revoked, and no row in the default partition', async () => {
    const outside = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM usage_events e JOIN api_keys k ON k.id = e.key_id
        WHERE e.organization_id = $1
          AND (e.occurred_at < k.created_at OR (k.revoked_at IS NOT NULL AND e.occurred_at > k.revoked_at))`,
    );
    expect(outside.n).toBe(0);
    const inDefault = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM ONLY usage_events_default WHERE organization_id = $1`,
    );
    expect(inDefault.n).toBe(0);
    const lastUse = await one<{ n: number }>(
      `SELECT count(*)::int AS n FROM api_keys k
        WHERE k.organization_id = $1 AND k.last_used_at IS DISTINCT FROM
              (SELECT max(occurred_at) FROM usage_events e WHERE e.key_id = k.id)`,
    );
    expect(lastUse.n).toBe(0);
  });

  it('is the same history for the same moment, and never after it', () => {
    const now = new Date('2026-11-20T18:30:00Z');
    const a = demoTraffic(DEMO_ORG_ID, DEMO_TRAFFIC_KEYS, now, 19);
    const b = demoTraffic(DEMO_ORG_ID, DEMO_TRAFFIC_KEYS, now, 19);
    expect(b).toEqual(a);
    expect(a.every((e) => e.occurredAt <= now)).toBe(true);
    expect(new Set(a.map((e) => e.requestId)).size).toBe(a.length);
    expect(a.filter((e) => e.billableUnits === 1).every((e) => e.source === 'live')).toBe(true);
  });
});
