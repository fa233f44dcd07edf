// Token buckets behind @nestjs/throttler's ThrottlerStorage interface, constant cost per call.
// `limit` is the bucket size (the burst) and the bucket refills `limit` tokens every `ttl` ms,
// so a plan of R calls/s with burst B is (limit B, ttl 1000·B/R). Returned times are seconds.
import type { ThrottlerStorage } from '@nestjs/throttler';
import type { Redis } from 'ioredis';
import type pg from 'pg';
import { databaseUnavailable, dependencyUnavailable } from './plans.service.js';

type ThrottlerStorageRecord = Awaited<ReturnType<ThrottlerStorage['increment']>>;

export const RATE_LIMIT_STORAGE = Symbol('RATE_LIMIT_STORAGE');

function record(
  limit: number,
  ttl: number,
  tokens: number,
  allowed: boolean,
): ThrottlerStorageRecord {
  const perMs = limit / ttl;
  const secsToOne = Math.max(1, Math.ceil((1 - tokens) / perMs / 1000));
  return {
    totalHits: Math.ceil(limit - tokens),
    timeToExpire: Math.max(0, Math.ceil((limit - tokens) / perMs / 1000)),
    isBlocked: !allowed,
    timeToBlockExpire: allowed ? 0 : secsToOne,
  };
}

/** One instance: buckets in a Map, idle ones swept every minute. */
export class MemoryRateLimitStorage implements ThrottlerStorage {
  private readonly buckets = new Map<string, { tokens: number; at: number; fullAt: number }>();
  private readonly sweeper: NodeJS.Timeout;

  constructor(private readonly now: () => number = Date.now) {
    this.sweeper = setInterval(() => this.sweep(), 60_000);
    this.sweeper.unref();
  }

  async increment(key: string, ttl: number, limit: number): Promise<ThrottlerStorageRecord> {
    return this.take(key, ttl, limit);
  }

  /** Synchronous core (the guard's fast path). */
  take(key: string, ttl: number, limit: number): ThrottlerStorageRecord {
    const now = this.now();
    const perMs = limit / ttl;
    const b = this.buckets.get(key);
    let tokens = b ? Math.min(limit, b.tokens + (now - b.at) * perMs) : limit;
    const allowed = tokens >= 1;
    if (allowed) tokens -= 1;
    const fullAt = now + (limit - tokens) / perMs;
    if (b) {
      b.tokens = tokens;
      b.at = now;
      b.fullAt = fullAt;
    } else {
      this.buckets.set(key, { tokens, at: now, fullAt });
    }
    return record(limit, ttl, tokens, allowed);
  }

  private sweep() {
    const now = this.now();
    for (const [k, b] of this.buckets) if (b.fullAt <= now) this.buckets.delete(k);
  }

  close() {
    clearInterval(this.sweeper);
  }
}

const TAKE_SQL = `
  WITH prev AS (SELECT tokens, updated_ms FROM rate_limit_buckets WHERE key = $1 FOR UPDATE),
  refilled AS (
    SELECT COALESCE((SELECT LEAST($2::float8, tokens + ($3::bigint - updated_ms) * $4::float8) FROM prev), $2::float8) AS t
  )
  INSERT INTO rate_limit_buckets AS b (key, tokens, updated_ms)
  SELECT $1, CASE WHEN t >= 1 THEN t - 1 ELSE t END, $3 FROM refilled
  ON CONFLICT (key) DO UPDATE SET tokens = EXCLUDED.tokens, updated_ms = EXCLUDED.updated_ms
  RETURNING tokens, (SELECT t >= 1 FROM refilled) AS allowed`;

/** Several instances: the same bucket arithmetic in one statement on PostgreSQL. */
export class PostgresRateLimitStorage implements ThrottlerStorage {
  constructor(private readonly pool: pg.Pool) {}

  async increment(key: string, ttl: number, limit: number): Promise<ThrottlerStorageRecord> {
    const res = await this.pool
      .query<{ tokens: number; allowed: boolean }>(TAKE_SQL, [key, limit, Date.now(), limit / ttl])
      .catch((err: unknown) => {
        throw databaseUnavailable(err);
      });
    const row = res.rows[0]!;
    return record(limit, ttl, Number(row.tokens), row.allowed);
  }
}

// The same arithmetic again, in one Lua script run atomically by Redis (the memory store is the
// reference; a test runs both on the same takes). Numbers travel as '%.17g' strings, which
// round-trip a double exactly, so both stores compute with the same values. The clock is
// Redis's own (TIME) unless a `now` is passed (tests): one clock for every instance. An idle
// bucket's key expires a second after the bucket would be full again, which is what a missing
// key means.
const TAKE_LUA = `
local limit = tonumber(ARGV[1])
local ttl = tonumber(ARGV[2])
local now = tonumber(ARGV[3])
if not now then
  local t = redis.call('TIME')
  now = tonumber(t[1]) * 1000 + math.floor(tonumber(t[2]) / 1000)
end
local perMs = limit / ttl
local b = redis.call('HMGET', KEYS[1], 'tokens', 'at')
local tokens = limit
if b[1] and b[2] then
  tokens = math.min(limit, tonumber(b[1]) + (now - tonumber(b[2])) * perMs)
end
local allowed = 0
if tokens >= 1 then
  tokens = tokens - 1
  allowed = 1
end
local t = string.format('%.17g', tokens)
redis.call('HSET', KEYS[1], 'tokens', t, 'at', string.format('%.17g', now))
redis.call('PEXPIRE', KEYS[1], math.ceil((limit - tokens) / perMs) + 1000)
return { t, allowed }`;

const redisUnavailable = dependencyUnavailable('The rate-limit store (Redis)');

type TakeCommand = (
  key: string,
  limit: string,
  ttl: string,
  now: string,
) => Promise<[string, number]>;

/** Several instances on one Redis: one EVALSHA per call (ioredis falls back to EVAL once). */
export class RedisRateLimitStorage implements ThrottlerStorage {
  private readonly takeCommand: TakeCommand;

  constructor(
    private readonly redis: Redis,
    private readonly options: { prefix?: string; now?: () => number } = {},
  ) {
    if (!('lwTakeToken' in redis)) {
      redis.defineCommand('lwTakeToken', { numberOfKeys: 1, lua: TAKE_LUA });
    }
    const r = redis as Redis & { lwTakeToken: TakeCommand };
    this.takeCommand = (...args) => r.lwTakeToken(...args);
  }

  /** The Redis key of a bucket. */
  keyOf(key: string): string {
    return (this.options.prefix ?? 'lw:rl:') + key;
  }

  async increment(key: string, ttl: number, limit: number): Promise<ThrottlerStorageRecord> {
    const now = this.options.now ? String(this.options.now()) : '';
    const [tokens, allowed] = await this.takeCommand(
      this.keyOf(key),
      String(limit),
      String(ttl),
      now,
    ).catch((err: unknown) => {
      throw redisUnavailable(err);
    });
    return record(limit, ttl, Number(tokens), allowed === 1);
  }
}
