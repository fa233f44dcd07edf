// The idempotency_keys table: claim a key for a request, store the answer it got, or let go of
// it. Every step is one statement, so two instances (or two requests on one) racing for the
// same key always agree on which of them holds it.
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import { databaseUnavailable } from '../plans/plans.service.js';

/** How long a key (and the answer stored for it) lasts after its first request. */
export const IDEMPOTENCY_TTL_MS = 24 * 3600_000;
/**
 * A key still marked in flight this long after its request started belongs to a request that
 * will never finish (its instance stopped mid-request): a retry with the same body may take it
 * over. Far longer than any upload takes. For routes that store something (uploads).
 */
export const IDEMPOTENCY_STALE_MS = 10 * 60_000;
/**
 * The same for computations (routes marked `idempotent: 'compute'`): they change nothing but the
 * usage count, so running one twice costs at most one more counted call, never a second stored
 * thing. A computation answers in milliseconds (the benchmark's p99 is tens of ms), so a key in
 * flight for 30 s is one whose answer was never stored (instance stopped, or the answer's write
 * failed and so did letting the key go): a retry then runs again instead of getting 409 for ten
 * minutes.
 */
export const COMPUTE_IDEMPOTENCY_STALE_MS = 30_000;

/** A key this request holds until its answer is stored (or let go). */
export interface HeldKey {
  caller: string;
  key: string;
  /**
   * When this request claimed the key, as PostgreSQL wrote it (text: a JS Date would drop the
   * microseconds). A later takeover changes it, so this request's writes then match nothing.
   */
  claimedAt: string;
}

export interface StoredAnswer {
  status: number;
  headers: Record<string, string>;
  body: Buffer;
}

export type Claim =
  | { kind: 'held'; held: HeldKey }
  | { kind: 'replay'; answer: StoredAnswer }
  | { kind: 'in-flight' }
  | { kind: 'mismatch' };

// Takes the key when nobody holds it, when it has expired, or when the request holding it is
// stale and this one is the same request.
const CLAIM = `
  INSERT INTO idempotency_keys AS k
    (caller, key, organization_id, fingerprint, state, created_at, expires_at)
  VALUES ($1, $2, $3, $4, 'in_flight', now(), now() + $5 * interval '1 millisecond')
  ON CONFLICT (caller, key) DO UPDATE SET
    organization_id = EXCLUDED.organization_id,
    fingerprint = EXCLUDED.fingerprint,
    state = 'in_flight',
    status = NULL,
    headers = NULL,
    body = NULL,
    created_at = EXCLUDED.created_at,
    expires_at = EXCLUDED.expires_at
  WHERE k.expires_at <= now()
     OR (k.state = 'in_flight' AND k.fingerprint = EXCLUDED.fingerprint
         AND k.created_at <= now() - $6 * interval '1 millisecond')
  RETURNING created_at::text AS claimed_at`;

const EXISTING = `
  SELECT fingerprint, state, status, headers, body FROM idempotency_keys
   WHERE caller = $1 AND key = $2 AND expires_at > now()`;

@Injectable()
export class IdempotencyService {
  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  private async query<T>(sql: string, params: unknown[]): Promise<T[]> {
    return this.ds.query(sql, params).catch((err: unknown) => {
      throw databaseUnavailable(err);
    }) as Promise<T[]>;
  }

  /**
   * What a request carrying `key` may do: run (it holds the key now), replay, or be refused.
   * `staleMs`: how long a key in flight for the same request blocks it (the route's kind; the
   * fingerprint includes the route, so a takeover is always by the same route).
   */
  async claim(
    caller: string,
    key: string,
    orgId: string,
    fingerprint: string,
    staleMs = IDEMPOTENCY_STALE_MS,
  ): Promise<Claim> {
    // Twice at most: a key let go (or expired) between the two statements is free again.
    for (let attempt = 0; attempt < 3; attempt++) {
      const claimed = await this.query<{ claimed_at: string }>(CLAIM, [
        caller,
        key,
        orgId,
        fingerprint,
        IDEMPOTENCY_TTL_MS,
        staleMs,
      ]);
      if (claimed[0])
        return { kind: 'held', held: { caller, key, claimedAt: claimed[0].claimed_at } };
      const [row] = await this.query<{
        fingerprint: string;
        state: 'in_flight' | 'done';
        status: number | null;
        headers: Record<string, string> | null;
        body: Buffer | null;
      }>(EXISTING, [caller, key]);
      if (!row) continue;
      if (row.fingerprint !== fingerprint) return { kind: 'mismatch' };
      if (row.state === 'in_flight') return { kind: 'in-flight' };
      return {
        kind: 'replay',
        answer: {
          status: row.status ?? 200,
          headers: row.headers ?? {},
          body: row.body ?? Buffer.alloc(0),
        },
      };
    }
    return { kind: 'in-flight' };
  }

  /**
   * Stores the answer a held key's request got, for replays until the key expires. Inside a
   * transaction (`within`) it commits or rolls back with the work the answer describes: a route
   * that stores something writes its answer with it, so no crash between the two can leave the
   * thing stored and the key free for a second run. The later write as the answer is sent then
   * matches nothing (the key is no longer in flight).
   */
  async complete(held: HeldKey, answer: StoredAnswer, within?: EntityManager): Promise<void> {
    const run = within
      ? <T>(sql: string, params: unknown[]) => within.query(sql, params) as Promise<T[]>
      : <T>(sql: string, params: unknown[]) => this.query<T>(sql, params);
    await run(
      `UPDATE idempotency_keys SET state = 'done', status = $4, headers = $5, body = $6
        WHERE caller = $1 AND key = $2 AND created_at = $3::timestamptz AND state = 'in_flight'`,
      [held.caller, held.key, held.claimedAt, answer.status, answer.headers, answer.body],
    );
  }

  /** Lets go of a held key without storing anything: the next request with it runs afresh. */
  async release(held: HeldKey): Promise<void> {
    await this.query(
      `DELETE FROM idempotency_keys
        WHERE caller = $1 AND key = $2 AND created_at = $3::timestamptz AND state = 'in_flight'`,
      [held.caller, held.key, held.claimedAt],
    );
  }

  /** Deletes expired keys, a batch at a time; returns how many. */
  async sweep(batch = 10_000): Promise<number> {
    let total = 0;
    for (;;) {
      const rows = await this.query<{ n: number }>(
        `WITH gone AS (
           DELETE FROM idempotency_keys WHERE ctid IN (
             SELECT ctid FROM idempotency_keys WHERE expires_at <= now() LIMIT $1)
           RETURNING 1)
         SELECT count(*)::int AS n FROM gone`,
        [batch],
      );
      const n = rows[0]?.n ?? 0;
      total += n;
      if (n < batch) return total;
    }
  }
}
