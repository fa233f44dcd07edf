// Demo scenario: three weeks of invented calls from the demo studio's keys (see demo-traffic.ts),
// with their daily roll-up and this month's quota use, so the usage pages have a history to
// show. Only while the studio has no API-key usage yet; one transaction under an advisory lock.
import type { DataSource, EntityManager } from 'typeorm';
import { DEMO_ORG_ID, DEMO_KEY_IDS } from '../auth/accounts.seeder.js';
import type { Seeder } from '../database/seeds/index.js';
import { monthBounds } from '../plans/quota.service.js';
import { demoTraffic, type DemoKey } from './demo-traffic.js';
import { monthPartitions, partitionDdl } from './usage-partitions.service.js';
import { EventBatch, UPSERT_DAILY } from './usage-writer.service.js';

/** Days of history (the demo keys are seeded 20 days old; calls stay inside each key's life). */
const DAYS = 19;
export const DEMO_TRAFFIC_KEYS: DemoKey[] = [
  // Booking site (production): a small studio's site, under even the free plan's 2,000 calls.
  {
    id: DEMO_KEY_IDS.bookingSite,
    environment: 'live',
    perWeekday: 45,
    invalidShare: 0.02,
  },
  // Shot-list app (staging): a developer trying things, more invalid input.
  {
    id: DEMO_KEY_IDS.shotListStaging,
    environment: 'test',
    perWeekday: 18,
    invalidShare: 0.08,
  },
  // Old prototype: a few calls until it was revoked.
  {
    id: DEMO_KEY_IDS.oldPrototype,
    environment: 'test',
    perWeekday: 4,
    invalidShare: 0.15,
  },
];

export async function seedDemoUsage(m: EntityManager, now = new Date()): Promise<number> {
  const org: unknown[] = await m.query(`SELECT 1 FROM organizations WHERE id = $1`, [DEMO_ORG_ID]);
  const keys: { id: string; created_at: Date; revoked_at: Date | null }[] = await m.query(
    `SELECT id, created_at, revoked_at FROM api_keys WHERE id = ANY($1)`,
    [DEMO_TRAFFIC_KEYS.map((k) => k.id)],
  );
  if (!org.length || keys.length !== DEMO_TRAFFIC_KEYS.length) return 0;
  const [row] = (await m.query(
    `SELECT count(*)::int AS n FROM usage_events WHERE organization_id = $1 AND source <> 'console'`,
    [DEMO_ORG_ID],
  )) as { n: number }[];
  if ((row?.n ?? 0) > 0) return 0;

  // Calls only while each key existed and was not revoked, whenever the keys were seeded.
  const lives = new Map(keys.map((k) => [k.id, k]));
  const traffic = DEMO_TRAFFIC_KEYS.map((k) => {
    const life = lives.get(k.id)!;
    return { ...k, activeFrom: life.created_at, activeUntil: life.revoked_at };
  });
  const events = demoTraffic(DEMO_ORG_ID, traffic, now, DAYS);
  if (!events.length) return 0;
  // The months the history covers, and the next two, get their partitions first (rows in the
  // default partition would stop a month's partition from being made later).
  const first = events[0]!.occurredAt;
  const months =
    (now.getUTCFullYear() - first.getUTCFullYear()) * 12 + now.getUTCMonth() - first.getUTCMonth();
  for (const p of monthPartitions(first, months + 2)) await m.query(partitionDdl(p));

  await m.query(
    `INSERT INTO usage_events (occurred_at, organization_id, key_id, user_id, source, endpoint,
       status, latency_ms, billable_units, request_id)
     SELECT t.at, $1, t.key_id, NULL, t.source, t.endpoint, t.status, t.ms, t.units, t.rid
       FROM unnest($2::timestamptz[], $3::uuid[], $4::text[], $5::text[], $6::smallint[],
                   $7::real[], $8::int[], $9::text[])
         AS t(at, key_id, source, endpoint, status, ms, units, rid)`,
    [
      DEMO_ORG_ID,
      events.map((e) => e.occurredAt.toISOString()),
      events.map((e) => e.keyId),
      events.map((e) => e.source),
      events.map((e) => e.endpoint),
      events.map((e) => e.status),
      events.map((e) => e.latencyMs),
      events.map((e) => e.billableUnits),
      events.map((e) => e.requestId),
    ],
  );
  // The same roll-up the batch writer keeps.
  const batch = new EventBatch();
  for (const e of events) batch.add(e);
  await m.query(UPSERT_DAILY, batch.dailyColumns());

  // Each key's last use is its latest call.
  await m.query(
    `UPDATE api_keys k SET last_used_at = u.at
       FROM (SELECT key_id, max(occurred_at) AS at FROM usage_events
              WHERE organization_id = $1 AND key_id IS NOT NULL GROUP BY key_id) u
      WHERE k.id = u.key_id`,
    [DEMO_ORG_ID],
  );
  // This month's successful key calls are already taken from the monthly quota.
  const { start } = monthBounds(now);
  for (const mode of ['live', 'test'] as const) {
    const taken = events.filter(
      (e) =>
        e.source === mode && e.status < 300 && e.occurredAt.toISOString().slice(0, 10) >= start,
    ).length;
    if (!taken) continue;
    await m.query(
      `INSERT INTO quota_counters AS q (organization_id, period_start, mode, reserved, last_grant)
       VALUES ($1, $2, $3, $4, 0)
       ON CONFLICT (organization_id, period_start, mode)
         DO UPDATE SET reserved = q.reserved + EXCLUDED.reserved, updated_at = now()`,
      [DEMO_ORG_ID, start, mode, taken],
    );
  }
  return events.length;
}

export const usageSeeder: Seeder = {
  name: 'usage history',
  run: (ds: DataSource) =>
    ds.transaction(async (m) => {
      await m.query(`SELECT pg_advisory_xact_lock(hashtext('lumenwright:usage-seed'))`);
      await seedDemoUsage(m);
    }),
};
