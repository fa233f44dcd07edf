// Monthly quotas, exact across instances: the counter lives in PostgreSQL and only grows through
// one atomic UPSERT that never passes the limit. To keep a database round trip off most calls,
// an instance reserves a small block of calls at a time (at most 1/8 of what is left, so near
// the limit it reserves one call at a time) and spends it locally. Failed calls go back to the
// local block; unused blocks go back to the counter at shutdown.
import { BeforeApplicationShutdown, Inject, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal } from '../common/guards/access.guard.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import type { PlanEntity } from './plan.entity.js';
import { databaseUnavailable } from './plans.service.js';

interface Lease {
  orgId: string;
  period: string;
  /** The period as epoch milliseconds: [startMs, resetMs). */
  startMs: number;
  resetMs: number;
  reset: Date;
  mode: 'live' | 'test';
  remaining: number;
  exhaustedUntil: number;
  acquiring: Promise<void> | null;
  /** Gives one call back to this lease (a lease never changes period: a new month gets a new one). */
  refund: () => void;
}

const RESERVE = `
  INSERT INTO quota_counters AS q (organization_id, period_start, mode, reserved, last_grant)
  VALUES ($1, $2, $3, LEAST($4::int, CEIL($5::int / 8.0)::int, $5::int),
    LEAST($4::int, CEIL($5::int / 8.0)::int, $5::int))
  ON CONFLICT (organization_id, period_start, mode) DO UPDATE SET
    last_grant = GREATEST(0, LEAST($4::int, CEIL(($5::bigint - q.reserved) / 8.0)::int, $5::bigint - q.reserved)),
    reserved = q.reserved + GREATEST(0, LEAST($4::int, CEIL(($5::bigint - q.reserved) / 8.0)::int, $5::bigint - q.reserved)),
    updated_at = now()
  RETURNING last_grant`;

/** First day of the UTC month containing `d`, and the first day of the next one. */
export function monthBounds(d: Date): { start: string; reset: Date } {
  const start = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth(), 1));
  const reset = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1));
  return { start: start.toISOString().slice(0, 10), reset };
}

/** Which monthly limit applies to a call, or null when the plan bills overage instead. */
export function quotaFor(
  plan: PlanEntity,
  p: Principal,
): { mode: 'live' | 'test'; limit: number } | null {
  if (p.kind !== 'api-key') return null; // console calls are not counted against the quota
  if (p.keyMode === 'test') return { mode: 'test', limit: plan.testCallsPerMonth };
  if (plan.overagePricePer1000Cents === null) {
    return { mode: 'live', limit: plan.includedCallsPerMonth };
  }
  return null;
}

@Injectable()
export class QuotaService implements BeforeApplicationShutdown {
  private readonly leases = new Map<string, Lease>();
  private closing = false;

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** Takes one call from the quota, or throws quota_exceeded. Returns a refund function. */
  async take(plan: PlanEntity, p: Principal, now = new Date()): Promise<(() => void) | null> {
    const q = quotaFor(plan, p);
    if (!q) return null;
    const key = `${p.organizationId}|${q.mode}`;
    let lease = this.leases.get(key);
    // The month's bounds are worked out once per lease, not per call (formatting them is slow).
    const t = now.getTime();
    if (!lease || t < lease.startMs || t >= lease.resetMs) {
      const { start, reset } = monthBounds(now);
      if (!lease || lease.period !== start) {
        const created: Lease = {
          orgId: p.organizationId,
          period: start,
          startMs: Date.parse(start),
          resetMs: reset.getTime(),
          reset,
          mode: q.mode,
          remaining: 0,
          exhaustedUntil: 0,
          acquiring: null,
          refund: () => void created.remaining++,
        };
        lease = created;
        this.leases.set(key, lease);
      }
    }
    const l = lease;
    while (l.remaining <= 0) {
      if (l.exhaustedUntil > Date.now()) this.exceeded(q.limit, q.mode, l.reset);
      l.acquiring ??= this.acquire(l, q.limit).finally(() => {
        l.acquiring = null;
      });
      await l.acquiring;
    }
    l.remaining--;
    return l.refund;
  }

  private async acquire(lease: Lease, limit: number): Promise<void> {
    const block = this.closing ? 1 : this.config.quotaLeaseSize;
    const rows: { last_grant: number }[] = await this.ds
      .query(RESERVE, [lease.orgId, lease.period, lease.mode, block, limit])
      .catch((err: unknown) => {
        throw databaseUnavailable(err);
      });
    const granted = Number(rows[0]?.last_grant ?? 0);
    lease.remaining += granted;
    // Nothing left: say so for a second without asking the database again.
    if (granted === 0) lease.exhaustedUntil = Date.now() + 1000;
  }

  private exceeded(limit: number, mode: 'live' | 'test', reset: Date): never {
    const retryAfter = Math.max(1, Math.ceil((reset.getTime() - Date.now()) / 1000));
    throw new DomainError(
      'quota_exceeded',
      `This month's ${mode === 'test' ? 'test-key ' : ''}quota of ${limit} calls is used up; it resets at ${reset.toISOString()}.`,
      [],
      { 'Retry-After': String(retryAfter) },
      { limit, resetAt: reset.toISOString(), mode },
    );
  }

  /** Give back calls reserved but not spent, so other instances can use them. */
  async beforeApplicationShutdown(): Promise<void> {
    this.closing = true;
    for (const lease of this.leases.values()) {
      const unused = lease.remaining;
      if (unused <= 0) continue;
      lease.remaining = 0;
      await this.ds
        .query(
          `UPDATE quota_counters SET reserved = GREATEST(0, reserved - $4), updated_at = now()
           WHERE organization_id = $1 AND period_start = $2 AND mode = $3`,
          [lease.orgId, lease.period, lease.mode, unused],
        )
        .catch(() => undefined);
    }
  }
}
