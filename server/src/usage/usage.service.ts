// Reads usage: summaries from the daily roll-ups, event pages from the partitioned event table.
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';

export interface EventFilters {
  keyId?: string;
  endpoint?: string;
  status?: number;
  /** 'error': status 400 and above; 'ok': below 400. */
  outcome?: 'ok' | 'error';
  from?: Date;
  to?: Date;
}

export interface UsageEventDto {
  id: string;
  occurredAt: string;
  keyId: string | null;
  userId: string | null;
  source: string;
  endpoint: string;
  status: number;
  latencyMs: number;
  billableUnits: number;
  requestId: string;
}

interface EventRow {
  id: string;
  occurred_at: Date;
  micros: string;
  key_id: string | null;
  user_id: string | null;
  source: string;
  endpoint: string;
  status: number;
  latency_ms: number;
  billable_units: number;
  request_id: string;
}

const toDto = (r: EventRow): UsageEventDto => ({
  id: r.id,
  occurredAt: r.occurred_at.toISOString(),
  keyId: r.key_id,
  userId: r.user_id,
  source: r.source,
  endpoint: r.endpoint,
  status: r.status,
  latencyMs: Math.round(r.latency_ms * 100) / 100,
  billableUnits: r.billable_units,
  requestId: r.request_id,
});

const encodeCursor = (r: EventRow) => Buffer.from(`${r.micros}.${r.id}`).toString('base64url');

function decodeCursor(cursor: string): { micros: string; id: string } {
  const m = /^(\d{1,20})\.([0-9a-f-]{36})$/.exec(Buffer.from(cursor, 'base64url').toString());
  if (!m)
    throw new DomainError('invalid_input', 'The cursor is not valid.', [
      { field: 'cursor', reason: 'is not a cursor from this API' },
    ]);
  return { micros: m[1]!, id: m[2]! };
}

@Injectable()
export class UsageService {
  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  /** Roll-ups over UTC days `from`..`to` (inclusive), optionally for one key, endpoint or status. */
  async summary(
    orgId: string,
    from: string,
    to: string,
    only: { keyId?: string; endpoint?: string; status?: number; outcome?: 'ok' | 'error' } = {},
  ) {
    const args: unknown[] = [orgId, from, to];
    let where = `organization_id = $1 AND day BETWEEN $2::date AND $3::date`;
    for (const [column, value] of [
      ['key_id', only.keyId],
      ['endpoint', only.endpoint],
      ['status', only.status],
    ] as const) {
      if (value === undefined) continue;
      args.push(value);
      where += ` AND ${column} = $${args.length}`;
    }
    if (only.outcome)
      where += only.outcome === 'error' ? ' AND status >= 400' : ' AND status < 400';
    const agg = `SUM(calls)::int AS calls, SUM(billable_units)::int AS "billableUnits",
      (SUM(calls) FILTER (WHERE status >= 400))::int AS errors,
      ROUND((SUM(latency_ms_sum) / NULLIF(SUM(calls), 0))::numeric, 2)::float8 AS "meanLatencyMs"`;
    const q = (select: string, group: string) =>
      this.ds.query(
        `SELECT ${select}${select ? ',' : ''} ${agg} FROM usage_daily WHERE ${where}
        ${group ? `GROUP BY ${group} ORDER BY ${group}` : ''}`,
        args,
      );
    const [totals, byDay, byEndpoint, byKey, byStatus, bySource] = await Promise.all([
      q('', ''),
      q(`to_char(day, 'YYYY-MM-DD') AS day`, 'day'),
      q('endpoint', 'endpoint'),
      q(`key_id AS "keyId"`, 'key_id'),
      q('status', 'status'),
      q('source', 'source'),
    ]);
    const clean = <T extends Record<string, unknown>>(rows: T[]) =>
      rows.map((r) => ({ ...r, errors: r.errors ?? 0 }));
    const t = totals[0] ?? {};
    return {
      from,
      to,
      totals: {
        calls: t.calls ?? 0,
        billableUnits: t.billableUnits ?? 0,
        errors: t.errors ?? 0,
        meanLatencyMs: t.meanLatencyMs ?? null,
      },
      byDay: clean(byDay),
      byEndpoint: clean(byEndpoint),
      byKey: clean(byKey),
      byStatus: clean(byStatus),
      bySource: clean(bySource),
    };
  }

  async monthTotals(orgId: string, periodStart: string) {
    const rows: { source: string; calls: number; ok: number; units: number }[] =
      await this.ds.query(
        `SELECT source, SUM(calls)::int AS calls, SUM(billable_units)::int AS units,
              (SUM(calls) FILTER (WHERE status BETWEEN 200 AND 299))::int AS ok FROM usage_daily
       WHERE organization_id = $1 AND day >= $2::date
         AND day < ($2::date + interval '1 month') GROUP BY source`,
        [orgId, periodStart],
      );
    const by = (s: string) => rows.find((r) => r.source === s)?.calls ?? 0;
    // The monthly limits count successful calls only (a failed call gives its quota back).
    const ok = (s: string) => rows.find((r) => r.source === s)?.ok ?? 0;
    return {
      liveCalls: by('live'),
      testCalls: by('test'),
      liveCallsCounted: ok('live'),
      testCallsCounted: ok('test'),
      consoleCalls: by('console'),
      billableUnits: rows.reduce((a, r) => a + (r.units ?? 0), 0),
    };
  }

  async events(orgId: string, f: EventFilters, limit: number, cursor?: string) {
    const args: unknown[] = [orgId];
    const cond = ['organization_id = $1'];
    const add = (sql: string, v: unknown) => {
      args.push(v);
      cond.push(sql.replace('?', `$${args.length}`));
    };
    if (f.keyId) add('key_id = ?', f.keyId);
    if (f.endpoint) add('endpoint = ?', f.endpoint);
    if (f.status !== undefined) add('status = ?', f.status);
    if (f.outcome) cond.push(f.outcome === 'error' ? 'status >= 400' : 'status < 400');
    if (f.from) add('occurred_at >= ?', f.from);
    if (f.to) add('occurred_at < ?', f.to);
    if (cursor) {
      const c = decodeCursor(cursor);
      args.push(c.micros, c.id);
      cond.push(
        `(occurred_at, id) < ('epoch'::timestamptz + $${args.length - 1}::bigint * interval '1 microsecond', $${args.length}::uuid)`,
      );
    }
    args.push(limit + 1);
    const rows: EventRow[] = await this.ds.query(
      `SELECT id, occurred_at, (extract(epoch FROM occurred_at) * 1000000)::bigint::text AS micros,
         key_id, user_id, source, endpoint, status, latency_ms, billable_units, request_id
       FROM usage_events WHERE ${cond.join(' AND ')}
       ORDER BY occurred_at DESC, id DESC LIMIT $${args.length}`,
      args,
    );
    const page = rows.slice(0, limit);
    const last = page[page.length - 1];
    return {
      data: page.map(toDto),
      nextCursor: rows.length > limit && last ? encodeCursor(last) : null,
    };
  }
}
