// The usage API: summaries from the roll-ups, filtered event pages, CSV, role and tenant checks.
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import pg from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import request from 'supertest';
import { DataSource } from 'typeorm';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource, testDatabaseUrl } from '../setup/db.js';
import { DEMO_BODIES, keyedOrg, KeyedOrg, post } from '../factories/compute.js';
import { monthPartitions } from '../../src/usage/usage-partitions.service.js';
import { copyText } from '../../src/usage/usage-writer.service.js';

describe('usage API', () => {
  let t: TestApp;
  let ds: DataSource;
  let org: KeyedOrg;
  let other: KeyedOrg;
  beforeAll(async () => {
    t = await bootApp({ USAGE_FLUSH_MS: '20' });
    ds = await openDataSource();
    org = await keyedOrg(t.url);
    other = await keyedOrg(t.url);
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = ANY($1)`, [
      [org.owner.organizationId, other.owner.organizationId],
    ]);
    for (let i = 0; i < 7; i++)
      await post(t.url, 'balance', org.live.secret, DEMO_BODIES.balance).expect(200);
    for (let i = 0; i < 3; i++)
      await post(t.url, 'flash', org.test.secret, DEMO_BODIES.flash).expect(200);
    await post(t.url, 'flash', org.live.secret, { guideNumber: 'big' }).expect(422);
    await post(t.url, 'exposure', other.live.secret, DEMO_BODIES.exposure).expect(200);
    // Wait until the writer has flushed all 12 events.
    for (let i = 0; i < 100; i++) {
      const [{ n }] = await ds.query(
        `SELECT count(*)::int AS n FROM usage_events WHERE organization_id = ANY($1)`,
        [[org.owner.organizationId, other.owner.organizationId]],
      );
      if (n === 12) break;
      await new Promise((r) => setTimeout(r, 50));
    }
  });
  afterAll(async () => {
    await ds.destroy();
    await t.close();
  });

  it('summarises calls by day, endpoint, key, status and source from the roll-ups', async () => {
    const res = await org.owner.agent.get('/v1/usage/summary').expect(200);
    expect(res.body.totals).toMatchObject({ calls: 11, billableUnits: 7, errors: 1 });
    const by = (rows: Record<string, unknown>[], k: string) =>
      Object.fromEntries(rows.map((r) => [String(r[k]), r.calls]));
    expect(by(res.body.byEndpoint, 'endpoint')).toEqual({ balance: 7, flash: 4 });
    expect(by(res.body.byKey, 'keyId')).toEqual({ [org.live.id]: 8, [org.test.id]: 3 });
    expect(by(res.body.byStatus, 'status')).toEqual({ 200: 10, 422: 1 });
    expect(by(res.body.bySource, 'source')).toEqual({ live: 8, test: 3 });
    // Near midnight UTC the calls may straddle two days.
    expect(res.body.byDay.reduce((a: number, d: { calls: number }) => a + d.calls, 0)).toBe(11);
  });

  it('summarises only the calls a key, endpoint or status filter picks, as the event list does', async () => {
    const summary = async (q: Record<string, string>) =>
      (await org.owner.agent.get('/v1/usage/summary').query(q).expect(200)).body;
    const events = async (q: Record<string, string>) =>
      (
        await org.owner.agent
          .get('/v1/usage/events')
          .query({ ...q, limit: '200' })
          .expect(200)
      ).body.data as unknown[];
    const filters: Record<string, string>[] = [
      { keyId: org.test.id },
      { endpoint: 'flash' },
      { status: '422' },
      { endpoint: 'balance', keyId: org.live.id },
      { outcome: 'error' },
      { outcome: 'ok', endpoint: 'flash' },
    ];
    for (const q of filters) {
      const s = await summary(q);
      expect(s.totals.calls).toBe((await events(q)).length);
      expect(s.byDay.reduce((a: number, d: { calls: number }) => a + d.calls, 0)).toBe(
        s.totals.calls,
      );
    }
    expect((await summary({ keyId: org.test.id })).totals.calls).toBe(3);
    expect((await summary({ status: '422' })).totals).toMatchObject({ calls: 1, errors: 1 });
    // outcome=error lists only 4xx/5xx, newest first: the overview's "Recent errors".
    const failed = (await events({ outcome: 'error' })) as { status: number }[];
    expect(failed.map((e) => e.status)).toEqual([422]);
    expect((await summary({ outcome: 'ok' })).totals).toMatchObject({ calls: 10, errors: 0 });
    const bad = await org.owner.agent
      .get('/v1/usage/summary')
      .query({ from: '2026-12-10', to: '2026-12-01' })
      .expect(422);
    expect(bad.body.errors[0]).toEqual({
      field: 'from',
      reason: 'must be on or before 2026-12-01',
    });
    const badStatus = await org.owner.agent
      .get('/v1/usage/summary')
      .query({ status: 'teapot' })
      .expect(422);
    expect(badStatus.body.errors[0].field).toBe('status');
  });

  it('lists events newest first with filters and cursor pagination, each with keyId', async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const q: Record<string, string> = { endpoint: 'balance', limit: '3' };
      if (cursor) q.cursor = cursor;
      const res = await org.owner.agent.get('/v1/usage/events').query(q).expect(200);
      for (const e of res.body.data) {
        expect(e).toMatchObject({
          endpoint: 'balance',
          keyId: org.live.id,
          status: 200,
          billableUnits: 1,
        });
        seen.push(e.id);
      }
      cursor = res.body.nextCursor;
    } while (cursor);
    expect(seen).toHaveLength(7);
    expect(new Set(seen).size).toBe(7);
    const failed = await org.owner.agent
      .get('/v1/usage/events')
      .query({ status: '422' })
      .expect(200);
    expect(failed.body.data).toHaveLength(1);
    expect(failed.body.data[0]).toMatchObject({
      endpoint: 'flash',
      keyId: org.live.id,
      billableUnits: 0,
    });
    const byKey = await org.owner.agent
      .get('/v1/usage/events')
      .query({ keyId: org.test.id })
      .expect(200);
    expect(byKey.body.data).toHaveLength(3);
  });

  it('exports CSV with a header row and one line per event', async () => {
    const res = await org.owner.agent.get('/v1/usage/events.csv').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.text.trim().split('\r\n');
    expect(lines[0]).toBe(
      'occurredAt,id,keyId,userId,source,endpoint,status,latencyMs,billableUnits,requestId',
    );
    expect(lines).toHaveLength(12);
  });

  it('never shows another organisation’s usage', async () => {
    const res = await other.owner.agent.get('/v1/usage/events').expect(200);
    expect(res.body.data).toHaveLength(1);
    expect(res.body.data[0].endpoint).toBe('exposure');
  });

  it('rejects bad filters with 422 naming the field, and API keys with 401', async () => {
    const bad = await org.owner.agent
      .get('/v1/usage/events')
      .query({ status: 'teapot' })
      .expect(422);
    expect(bad.body.errors[0].field).toBe('status');
    const badCursor = await org.owner.agent
      .get('/v1/usage/events')
      .query({ cursor: 'zzz' })
      .expect(422);
    expect(badCursor.body.errors[0].field).toBe('cursor');
    await request(t.url)
      .get('/v1/usage/summary')
      .set('Authorization', `Bearer ${org.live.secret}`)
      .expect(401);
  });

  it('shows the plan and this month’s calls against it', async () => {
    const res = await org.owner.agent.get('/v1/plans/current').expect(200);
    expect(res.body.plan.code).toBe('studio');
    expect(res.body.usage).toMatchObject({ liveCalls: 8, testCalls: 3, billableUnits: 7 });
    // The monthly limits count successful calls: the same number as the 2xx events listed.
    const events = (await org.owner.agent.get('/v1/usage/events').query({ limit: 100 }).expect(200))
      .body.data as { source: string; status: number }[];
    const ok = (source: string) =>
      events.filter((e) => e.source === source && e.status >= 200 && e.status < 300).length;
    expect(res.body.usage.liveCallsCounted).toBe(ok('live'));
    expect(res.body.usage.liveCallsCounted).toBe(7);
    expect(res.body.usage.testCallsCounted).toBe(ok('test'));
    const plans = await request(t.url).get('/v1/plans').expect(200);
    expect(plans.body.data.map((p: { code: string }) => p.code)).toEqual([
      'free',
      'studio',
      'platform',
    ]);
  });

  it('keeps events in monthly partitions of usage_events', async () => {
    const [p] = monthPartitions(new Date());
    const rows = await ds.query(
      `SELECT tableoid::regclass::text AS part FROM usage_events WHERE organization_id = $1 LIMIT 1`,
      [org.owner.organizationId],
    );
    expect(rows[0].part).toBe(p!.name);
    const parts = await ds.query(
      `SELECT c.relname FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid
       WHERE i.inhparent = 'usage_events'::regclass ORDER BY 1`,
    );
    expect(parts.map((r: { relname: string }) => r.relname)).toEqual(
      expect.arrayContaining([
        'usage_events_default',
        ...monthPartitions(new Date()).map((m) => m.name),
      ]),
    );
  });
});

describe('usage events as COPY text', () => {
  // PostgreSQL 15 documentation, COPY, "Text Format": \N is null; backslash, tab, newline and
  // carriage return are written as \\, \t, \n and \r. The real server is the reference here.
  it('round-trips awkward text and nulls through PostgreSQL COPY exactly', async () => {
    const client = new pg.Client({ connectionString: testDatabaseUrl() });
    await client.connect();
    try {
      await client.query(`CREATE TEMP TABLE copy_check (a text, b text, n int, x real)`);
      const values: [string | null, string | null, number, number][] = [
        ['plain', null, 1, 0.25],
        ['tab\there', 'back\\slash', 2, 12.5],
        ['new\nline', 'carriage\rreturn', 3, 1e-3],
        ['\\N', '', 4, 0],
      ];
      const text = values.map((v) => v.map((c) => copyText(c)).join('\t') + '\n').join('');
      await pipeline(
        Readable.from([text]),
        client.query(copyFrom('COPY copy_check (a, b, n, x) FROM STDIN')),
      );
      const { rows } = await client.query(`SELECT a, b, n, x FROM copy_check ORDER BY n`);
      expect(rows.map((r) => [r.a, r.b, r.n, r.x])).toEqual(values);
    } finally {
      await client.end();
    }
  });
});
