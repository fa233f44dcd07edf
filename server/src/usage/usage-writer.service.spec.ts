import { Writable } from 'node:stream';
import fc from 'fast-check';
import type pg from 'pg';
import type { AppConfig } from '../config/config.js';
import { isoTimestamp, type UsageEvent } from './usage-event.js';
import { copyLine, EventBatch, UsageWriter } from './usage-writer.service.js';

/**
 * A pool whose writes fail while `down` is true and that counts the rows of each COPY otherwise
 * (a unit test of the batching; test/e2e/usage*.ts write to the real database).
 */
function fakePool() {
  const state = { down: false, rows: 0, statements: 0 };
  const client = {
    query: (sql: unknown) => {
      if (typeof sql !== 'string') {
        // pg-copy-streams: the driver returns the COPY as a writable stream.
        let text = '';
        return new Writable({
          write(chunk: Buffer, _enc, cb) {
            if (state.down) return cb(new Error('connection refused'));
            text += chunk.toString();
            cb();
          },
          final(cb) {
            state.statements++;
            state.rows += text.split('\n').filter(Boolean).length;
            cb();
          },
        });
      }
      if (state.down && sql !== 'ROLLBACK') return Promise.reject(new Error('connection refused'));
      return Promise.resolve({ rows: [] });
    },
    release: () => undefined,
  };
  const pool = { connect: async () => client, end: async () => undefined } as unknown as pg.Pool;
  return { pool, state };
}

const cfg = { usageFlushMs: 10_000, usageBatchSize: 100, usageMaxBuffer: 250 } as AppConfig;
const ev = (i: number): UsageEvent => ({
  occurredAt: new Date(),
  organizationId: '00000000-0000-0000-0000-000000000001',
  keyId: null,
  userId: null,
  source: 'live',
  endpoint: 'balance',
  status: 200,
  latencyMs: 1,
  billableUnits: 1,
  requestId: `r${i}`,
});

describe('usage batch writer', () => {
  it('writes in multi-row batches of at most the batch size', async () => {
    const { pool, state } = fakePool();
    const w = new UsageWriter(cfg, pool);
    for (let i = 0; i < 230; i++) w.record(ev(i));
    await w.flush();
    await w.flush();
    expect(state.rows).toBe(230);
    expect(state.statements).toBe(3);
    expect(w.pending).toBe(0);
  });

  it('keeps every event while the database is down and writes them when it returns', async () => {
    const { pool, state } = fakePool();
    const w = new UsageWriter(cfg, pool);
    state.down = true;
    for (let i = 0; i < 180; i++) w.record(ev(i));
    await w.flush();
    expect(w.pending).toBe(180);
    state.down = false;
    await w.flush();
    expect(state.rows).toBe(180);
  });

  it('applies back-pressure when full instead of dropping, and gives up with a 503 in time', async () => {
    const { pool, state } = fakePool();
    const w = new UsageWriter(cfg, pool);
    state.down = true;
    for (let i = 0; i < 260; i++) w.record(ev(i));
    const blocked = w.waitForRoom(50);
    expect(blocked).not.toBeNull();
    await expect(blocked).rejects.toMatchObject({ code: 'unavailable' });
    expect(w.pending).toBe(260); // nothing dropped
    const waiting = w.waitForRoom(5000)!;
    state.down = false;
    await w.flush();
    await expect(waiting).resolves.toBeUndefined();
    expect(state.rows).toBe(260);
  });

  it('flushes everything on shutdown', async () => {
    const { pool, state } = fakePool();
    const w = new UsageWriter(cfg, pool);
    for (let i = 0; i < 42; i++) w.record(ev(i));
    await w.onApplicationShutdown();
    expect(state.rows).toBe(42);
  });

  it('keeps each batch as the exact COPY text of its events across buffer chunks, with its roll-up', () => {
    const b = new EventBatch();
    const events: UsageEvent[] = [];
    // ~1,200 rows of ~190 bytes: several 64 KB chunks, so rows meet chunk edges.
    for (let i = 0; i < 1200; i++) {
      const e = {
        ...ev(i),
        requestId: `req-${i}-${'x'.repeat(i % 97)}`,
        status: i % 3 ? 200 : 429,
      };
      e.billableUnits = e.status === 200 ? 1 : 0;
      e.latencyMs = (i % 7) + 0.5;
      events.push(e);
      b.add(e);
    }
    b.seal();
    expect(b.chunks.length).toBeGreaterThan(2);
    expect(b.count).toBe(1200);
    expect(Buffer.concat(b.chunks).toString('utf8')).toBe(events.map(copyLine).join(''));
    const cols = b.dailyColumns();
    // Two groups (status 200 and 429); calls, units and latency sums add up over the events.
    expect(cols[5]).toEqual(expect.arrayContaining([200, 429]));
    const calls = (cols[6] as number[]).reduce((a, c) => a + c, 0);
    const units = (cols[7] as number[]).reduce((a, c) => a + c, 0);
    const ms = (cols[8] as number[]).reduce((a, c) => a + c, 0);
    expect(calls).toBe(1200);
    expect(units).toBe(events.filter((e) => e.status === 200).length);
    expect(ms).toBeCloseTo(
      events.reduce((a, e) => a + e.latencyMs, 0),
      6,
    );
  });

  it('escapes COPY text specials in an event row', () => {
    // PostgreSQL documentation, COPY, "Text Format": backslash, newline, CR and tab are escaped.
    const line = copyLine({ ...ev(1), requestId: 'a\tb\\c\nd' });
    expect(line.endsWith('\ta\\tb\\\\c\\nd\n')).toBe(true);
    expect(line.split('\t')).toHaveLength(10);
  });

  it('formats event timestamps exactly as Date#toISOString does', () => {
    // ECMA-262, Date.prototype.toISOString (YYYY-MM-DDTHH:mm:ss.sssZ, UTC): Node's own
    // implementation is the reference. Consecutive calls share the cached second, so a sequence
    // of nearby instants (in and out of order) is checked as well as scattered ones.
    const edges = [
      0, 1, 999, 1000, 86_399_999, 951_782_400_000, 4_102_444_799_999, 253_402_300_799_999,
    ];
    for (const ms of edges) expect(isoTimestamp(new Date(ms))).toBe(new Date(ms).toISOString());
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 253_402_300_799_999 }),
        fc.array(fc.integer({ min: -2500, max: 2500 }), { maxLength: 20 }),
        (base, steps) => {
          for (const ms of [base, ...steps.map((s) => Math.max(0, base + s))]) {
            if (isoTimestamp(new Date(ms)) !== new Date(ms).toISOString()) return false;
          }
          return true;
        },
      ),
      { numRuns: 2000 },
    );
    // Outside 1970–9999 it defers to Date#toISOString (including its RangeError when invalid).
    expect(isoTimestamp(new Date(-1))).toBe('1969-12-31T23:59:59.999Z');
    expect(() => isoTimestamp(new Date(NaN))).toThrow(RangeError);
  });
});
