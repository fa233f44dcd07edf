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
import { isoTimestamp, UsageEvent } from './usage-event.js';

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

/** One event as a COPY text row, in COPY_EVENTS' column order. */
export function copyLine(e: UsageEvent): string {
  return copyRow(e, isoTimestamp(e.occurredAt));
}

/** copyLine with the event's timestamp already formatted (`at`). */
function copyRow(e: UsageEvent, at: string): string {
  return (
    at +
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
    '\n'
  );
}

const CHUNK_BYTES = 64 * 1024;

interface DailyRow {
  row: unknown[];
  calls: number;
  units: number;
  ms: number;
}

/**
 * Events waiting to be written, already in COPY text and outside the JavaScript heap: each event
 * is encoded into a Buffer as it is recorded, and its daily roll-up counted beside it, so a
 * buffered event is not a set of live objects the garbage collector copies again at every young
 * collection until the flush (that was most of what survived them under load; see the README's
 * performance section).
 */
export class EventBatch {
  readonly chunks: Buffer[] = [];
  readonly daily = new Map<string, DailyRow>();
  count = 0;
  private chunk: Buffer | null = null;
  private used = 0;

  add(e: UsageEvent): void {
    const at = isoTimestamp(e.occurredAt);
    const line = copyRow(e, at);
    // At most 3 bytes per UTF-16 unit, so a line this short always fits a fresh chunk.
    if (!this.chunk || this.chunk.length - this.used < line.length * 3) {
      this.seal();
      this.chunk = Buffer.allocUnsafe(Math.max(CHUNK_BYTES, line.length * 3));
      this.used = 0;
    }
    this.used += this.chunk.write(line, this.used, 'utf8');
    this.count++;
    const day = at.slice(0, 10); // the UTC day
    const k = `${e.organizationId}|${day}|${e.keyId}|${e.source}|${e.endpoint}|${e.status}`;
    const agg = this.daily.get(k);
    if (agg) {
      agg.calls++;
      agg.units += e.billableUnits;
      agg.ms += e.latencyMs;
    } else {
      this.daily.set(k, {
        row: [e.organizationId, day, e.keyId, e.source, e.endpoint, e.status],
        calls: 1,
        units: e.billableUnits,
        ms: e.latencyMs,
      });
    }
  }

  /** Ends the chunk being filled; the batch takes no more events after its last seal. */
  seal(): void {
    if (this.chunk && this.used) this.chunks.push(this.chunk.subarray(0, this.used));
    this.chunk = null;
    this.used = 0;
  }

  /** The roll-up as the UPSERT's nine column arrays. */
  dailyColumns(): unknown[][] {
    const cols: unknown[][] = Array.from({ length: 9 }, () => []);
    for (const a of this.daily.values()) {
      [...a.row, a.calls, a.units, a.ms].forEach((v, i) => cols[i]!.push(v));
    }
    return cols;
  }
}

export const UPSERT_DAILY = `
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
  /** Full batches waiting for the database, oldest first; `open` takes new events. */
  private readonly queue: EventBatch[] = [];
  private open = new EventBatch();
  private queued = 0;
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
    return this.queued + this.open.count;
  }

  /** Accepts an event; never drops it. */
  record(event: UsageEvent): void {
    this.open.add(event);
    if (this.open.count >= this.config.usageBatchSize) {
      this.sealOpen();
      if (!this.flushing) void this.flush();
    }
  }

  private sealOpen(): void {
    if (!this.open.count) return;
    this.open.seal();
    this.queue.push(this.open);
    this.queued += this.open.count;
    this.open = new EventBatch();
  }

  /** Resolves at once while there is room; otherwise waits for a flush (back-pressure). */
  waitForRoom(timeoutMs = 5000): Promise<void> | null {
    if (this.pending < this.config.usageMaxBuffer) return null;
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
    if (!this.pending) return Promise.resolve();
    this.flushing = this.drain().finally(() => {
      this.flushing = null;
    });
    return this.flushing;
  }

  private async drain(): Promise<void> {
    // Also takes what arrives while it writes, like a flush called at the end would.
    for (this.sealOpen(); this.queue.length; this.sealOpen()) {
      const batch = this.queue[0]!;
      try {
        await this.write(batch);
      } catch (err) {
        this.failures++;
        if (this.failures === 1 || this.failures % 50 === 0) {
          this.logger.warn(
            `usage flush failed (${this.failures}x), keeping ${this.pending} events: ${String(err)}`,
          );
        }
        return;
      }
      this.failures = 0;
      this.queue.shift();
      this.queued -= batch.count;
      this.written += batch.count;
      this.wakeWaiters();
    }
  }

  private wakeWaiters() {
    while (this.waiters.length && this.pending < this.config.usageMaxBuffer) {
      this.waiters.shift()!();
    }
  }

  private async write(batch: EventBatch): Promise<void> {
    const client = await this.pool.connect();
    try {
      await client.query('BEGIN');
      await pipeline(Readable.from(batch.chunks), client.query(copyFrom(COPY_EVENTS)));
      await client.query(UPSERT_DAILY, batch.dailyColumns());
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
    while (this.pending && Date.now() < deadline) {
      await this.flush();
      if (this.pending) await new Promise((r) => setTimeout(r, 200));
    }
    if (this.pending) {
      this.logger.error(`shutting down with ${this.pending} usage events unwritten`);
    }
    await this.pool.end().catch(() => undefined);
  }
}
