// Buffers usage events in process and writes them in batches: one COPY of the events plus the
// daily roll-up UPSERT, in one transaction on its own small pool. (COPY rather than a multi-row
// INSERT of column arrays: one text block is cheaper to build here than the driver's array
// encoding, and cheaper for PostgreSQL to load.) Flushes by size and by time, and on shutdown after
// the HTTP server has drained. When the buffer is full (the database is slow or down) new compute
// calls wait for room (back-pressure) and give up with a 503 after a while; events already
// accepted are kept and retried, never dropped.
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { Inject, Injectable, Logger, OnApplicationShutdown, OnModuleInit } from '@nestjs/common';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import { DomainError } from '../common/errors/domain-error.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { UsageEvent, utcDay } from './usage-event.js';

export const USAGE_POOL = Symbol('USAGE_POOL');

const COPY_EVENTS = `COPY usage_events (occurred_at, organization_id, key_id, user_id, source,
  endpoint, status, latency_ms, billable_units, request_id) FROM STDIN`;

/** A value in COPY's text format: \N for null; backslash, tab, newline and CR escaped. */
export function copyText(v: string | number | null): string {
  if (v === null) return '\\N';
  const s = String(v);
  return /[\\\t\n\r]/.test(s)
    ? s.replace(/[\\\t\n\r]/g, (c) => ({ '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' })[c]!)
    : s;
}

/** The batch as COPY text rows, in COPY_EVENTS' column order. */
export function copyRows(batch: readonly UsageEvent[]): string {
  let out = '';
  for (const e of batch) {
    out +=
      e.occurredAt.toISOString() +
      '\t' +
      copyText(e.organizationId) +
      '\t' +
      copyText(e.keyId) +
      '\t' +
      copyText(e.userId) +
      '\t' +
      copyText(e.source) +
      '\t' +
      copyText(e.endpoint) +
      '\t' +
      e.status +
      '\t' +
      e.latencyMs +
      '\t' +
      e.billableUnits +
      '\t' +
      copyText(e.requestId) +
      '\n';
  }
  return out;
}

const UPSERT_DAILY = `
  INSERT INTO usage_daily AS d (organization_id, day, key_id, source, endpoint, status, calls,
    billable_units, latency_ms_sum)
  SELECT * FROM unnest($1::uuid[], $2::date[], $3::uuid[], $4::text[], $5::text[], $6::smallint[],
    $7::bigint[], $8::bigint[], $9::float8[])
  ON CONFLICT ON CONSTRAINT uq_usage_daily DO UPDATE SET
    calls = d.calls + EXCLUDED.calls,
    billable_units = d.billable_units + EXCLUDED.billable_units,
    latency_ms_sum = d.latency_ms_sum + EXCLUDED.latency_ms_sum`;

@Injectable()
export class UsageWriter implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger('UsageWriter');
  private buffer: UsageEvent[] = [];
  private flushing: Promise<void> | null = null;
  private timer: NodeJS.Timeout | null = null;
  private failures = 0;
  private waiters: (() => void)[] = [];
  /** Events written since boot (for tests and the benchmark's bookkeeping). */
  written = 0;

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(USAGE_POOL) private readonly pool: pg.Pool,
  ) {}

  onModuleInit(): void {
    this.timer = setInterval(() => void this.flush(), this.config.usageFlushMs);
    this.timer.unref();
  }

  get pending(): number {
    return this.buffer.length;
  }

  /** Accepts an event; never drops it. */
  record(event: UsageEvent): void {
    this.buffer.push(event);
    if (this.buffer.length >= this.config.usageBatchSize && !this.flushing) void this.flush();
  }

  /** Resolves at once while there is room; otherwise waits for a flush (back-pressure). */
  waitForRoom(timeoutMs = 5000): Promise<void> | null {
    if (this.buffer.length < this.config.usageMaxBuffer) return null;
    return new Promise<void>((resolve, reject) => {
      const timeout = setTimeout(() => {
        this.waiters = this.waiters.filter((w) => w !== wake);
        reject(
          new DomainError('unavailable', 'Usage metering is backed up; try again shortly.', [], {
            'Retry-After': '2',
          }),
        );
      }, timeoutMs);
      const wake = () => {
        clearTimeout(timeout);
        resolve();
      };
      this.waiters.push(wake);
      void this.flush();
    });
  }

  /** Writes everything buffered so far (one flush at a time). */
  flush(): Promise<void> {
    if (this.flushing) return this.flushing;
    if (!this.buffer.length) return Promise.resolve();
    this.flushing = this.drain().finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async drain(): Promise<void> {
    while (this.buffer.length) {
      const batch = this.buffer.slice(0, this.config.usageBatchSize);
      try {
        await this.write(batch);
      } catch (err) {
        this.failures++;
        if (this.failures === 1 || this.failures % 50 === 0) {
          this.logger.warn(
            `usage flush failed (${this.failures}x), keeping ${this.buffer.length} events: ${String(err)}`,
          );
        }
        return;
      }
      this.failures = 0;
      this.buffer.splice(0, batch.length);
      this.written += batch.length;
      this.wakeWaiters();
    }
  }

  private wakeWaiters() {
    while (this.waiters.length && this.buffer.length < this.config.usageMaxBuffer) {
      this.waiters.shift()!();
    }
  }

  private async write(batch: UsageEvent[]): Promise<void> {
    const daily = new Map<string, { row: unknown[]; calls: number; units: number; ms: number }>();
    for (const e of batch) {
      const day = utcDay(e.occurredAt);
      const k = `${e.organizationId}|${day}|${e.keyId}|${e.source}|${e.endpoint}|${e.status}`;
      const agg = daily.get(k);
      if (agg) {
        agg.calls++;
        agg.units += e.billableUnits;
        agg.ms += e.latencyMs;
      } else {
        daily.set(k, {
          row: [e.organizationId, day, e.keyId, e.source, e.endpoint, e.status],
          calls: 1,
          units: e.billableUnits,
          ms: e.latencyMs,
        });
      }
    }
    const dcols: unknown[][] = Array.from({ length: 9 }, () => []);
    for (const a of daily.values()) {
      [...a.row, a.calls, a.units, a.ms].forEach((v, i) => dcols[i]!.push(v));
    }
    const client = await this.pool.connect();
    try {
      await client.query('BEGIN');
      await pipeline(Readable.from([copyRows(batch)]), client.query(copyFrom(COPY_EVENTS)));
      await client.query(UPSERT_DAILY, dcols);
      await client.query('COMMIT');
    } catch (err) {
      await client.query('ROLLBACK').catch(() => undefined);
      throw err;
    } finally {
      client.release();
    }
  }

  async onApplicationShutdown(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    // The HTTP server has closed by now, so every response's event is in the buffer.
    const deadline = Date.now() + 10_000;
    while (this.buffer.length && Date.now() < deadline) {
      await this.flush();
      if (this.buffer.length) await new Promise((r) => setTimeout(r, 200));
    }
    if (this.buffer.length) {
      this.logger.error(`shutting down with ${this.buffer.length} usage events unwritten`);
    }
    await this.pool.end().catch(() => undefined);
  }
}
