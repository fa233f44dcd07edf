// Idempotency-Key on the metered POSTs, end to end: real PostgreSQL, the local S3 fake, real keys
// and sessions. Behaviour from the IETF httpapi draft "The Idempotency-Key HTTP Header Field"
// (retry after completion: the first answer again; key reused with another payload: 422; retry
// while the first is in progress: 409).
import http from 'node:http';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { createKey, DEMO_BODIES } from '../factories/compute.js';
import { renderFrame, startFake, type RunningFake } from '../factories/frames.js';
import { IdempotencySweeper } from '../../src/idempotency/idempotency-sweeper.service.js';
import { IdempotencyService } from '../../src/idempotency/idempotency.service.js';
import { UsageWriter } from '../../src/usage/usage-writer.service.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const PROBLEMS = 'https://lumenwright.test/problems/';
const CONSOLE_ORIGIN = 'http://127.0.0.1:5173';
// CIE 15:2004, Table T.3: chromaticity of illuminant D65, x = 0.31271, y = 0.32902 (a neutral
// patch; the colour read from it is not what these tests check).
const D65 = { cx: 0.31271, cy: 0.32902 };
const PATCH = { x: 160, y: 100, width: 160, height: 120 };

type Key = { id: string; secret: string };

describe('Idempotency-Key', () => {
  let t: TestApp;
  let s3fake: RunningFake;
  let s3: S3Client;
  let ds: DataSource;
  let studio: SignedInAgent;
  let live: Key;
  let n = 0;
  const newKey = () => `retry-${Date.now().toString(36)}-${++n}`;

  beforeAll(async () => {
    s3fake = await startFake('s3-fake');
    t = await bootApp({ ...s3fake.env, CORS_ORIGINS: CONSOLE_ORIGIN });
    ds = await openDataSource();
    s3 = new S3Client({
      endpoint: s3fake.env.S3_ENDPOINT,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    studio = await signUp(t.url, { organizationName: 'Saltmarsh Quay Portraits' });
    // Uploads are a plan feature (studio plan).
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      studio.organizationId,
    ]);
    live = await createKey(studio, 'live');
  });

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    s3?.destroy();
    await s3fake?.stop();
  });

  const compute = (secret: string, endpoint: string, body: object, key?: string) => {
    const r = request(t.url).post(`/v1/${endpoint}`).set('Authorization', `Bearer ${secret}`);
    return (key === undefined ? r : r.set('Idempotency-Key', key)).send(body);
  };
  const upload = (secret: string, img: Buffer, key?: string, cameraKelvin = '5500') => {
    let r = request(t.url).post('/v1/frames').set('Authorization', `Bearer ${secret}`);
    if (key !== undefined) r = r.set('Idempotency-Key', key);
    return r
      .attach('file', img, { filename: 'quay-test.jpg', contentType: 'image/jpeg' })
      .field('patchX', String(PATCH.x))
      .field('patchY', String(PATCH.y))
      .field('patchWidth', String(PATCH.width))
      .field('patchHeight', String(PATCH.height))
      .field('cameraKelvin', cameraKelvin);
  };
  const frameImage = () => renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
  const framesOf = async (orgId: string) =>
    (await ds.query(`SELECT id FROM frames WHERE organization_id = $1`, [orgId])) as {
      id: string;
    }[];
  const objectsOf = async (orgId: string, frameId: string) => {
    const out = await s3.send(
      new ListObjectsV2Command({ Bucket: s3fake.env.S3_BUCKET, Prefix: `frames/${orgId}/` }),
    );
    return (out.Contents ?? []).map((o) => o.Key!).filter((k) => k.includes(frameId));
  };
  /** The usage events of a key on an endpoint, once every event of the calls made is written. */
  const usageOf = async (keyId: string, endpoint: string, expected: number) => {
    const read = () =>
      ds.query(
        `SELECT status, billable_units FROM usage_events
          WHERE key_id = $1 AND endpoint = $2 ORDER BY occurred_at, status`,
        [keyId, endpoint],
      ) as Promise<{ status: number; billable_units: number }[]>;
    let rows = await read();
    for (let i = 0; i < 100 && rows.length < expected; i++) {
      await new Promise((r) => setTimeout(r, 50));
      await t.app.get(UsageWriter).flush();
      rows = await read();
    }
    // Room for an event that should not exist to arrive, then read again.
    await new Promise((r) => setTimeout(r, 300));
    await t.app.get(UsageWriter).flush();
    return read();
  };

  it('answers a retried upload from the first: one frame row, one stored original, one usage event, the same bytes', async () => {
    const owner = await signUp(t.url, { organizationName: 'Heronsgate Studio' });
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      owner.organizationId,
    ]);
    const key = await createKey(owner, 'live');
    const img = await frameImage();
    const k = newKey();
    const first = await upload(key.secret, img, k);
    expect(first.status).toBe(201);
    expect(first.headers['idempotency-replayed']).toBeUndefined();
    // The retry frames the form anew (supertest picks a new multipart boundary): same request.
    const retry = await upload(key.secret, img, k);
    expect(retry.status).toBe(201);
    expect(retry.headers['idempotency-replayed']).toBe('true');
    expect(retry.headers['content-type']).toBe(first.headers['content-type']);
    expect(retry.text).toBe(first.text);
    // A replay takes nothing from the rate limit: it carries no RateLimit fields.
    expect(first.headers['ratelimit']).toBeDefined();
    expect(retry.headers['ratelimit']).toBeUndefined();

    const frames = await framesOf(owner.organizationId);
    expect(frames).toEqual([{ id: first.body.id }]);
    expect((await objectsOf(owner.organizationId, first.body.id)).sort()).toEqual([
      `frames/${owner.organizationId}/${first.body.id}/original.jpg`,
      `frames/${owner.organizationId}/${first.body.id}/thumbnail.jpg`,
    ]);
    expect(await usageOf(key.id, 'frames', 1)).toEqual([{ status: 201, billable_units: 1 }]);
  });

  it("stores an upload's answer with its frame: a lost write as the answer is sent still replays, no second frame", async () => {
    // The write made as the answer is sent fails (as if the instance stopped right after the
    // frame was stored); only writes inside the frame's transaction go through.
    const keys = t.app.get(IdempotencyService);
    const complete = keys.complete.bind(keys);
    const spy = jest
      .spyOn(keys, 'complete')
      .mockImplementation((held, answer, within) =>
        within ? complete(held, answer, within) : Promise.reject(new Error('connection lost')),
      );
    try {
      const img = await frameImage();
      const k = newKey();
      const first = await upload(live.secret, img, k, '5100');
      expect(first.status).toBe(201);
      const retry = await upload(live.secret, img, k, '5100');
      expect(retry.status).toBe(201);
      expect(retry.headers['idempotency-replayed']).toBe('true');
      expect(retry.text).toBe(first.text);
      const rows = await ds.query(`SELECT id FROM frames WHERE id = $1`, [first.body.id]);
      expect(rows).toHaveLength(1);
      const [{ n }] = await ds.query(
        `SELECT count(*)::int AS n FROM frames WHERE organization_id = $1 AND sha256 = $2`,
        [studio.organizationId, first.body.sha256],
      );
      expect(n).toBe(1);
    } finally {
      spy.mockRestore();
    }
  });

  it("lets go of a computation's key when its answer cannot be stored: the retry runs again, counted again", async () => {
    // The answer's write fails as it is sent (the database went away just then); letting go of
    // the key (a second statement) goes through. Computations store nothing but the usage count.
    const owner = await signUp(t.url, { organizationName: 'Reedbank Evening Studio' });
    const key = await createKey(owner, 'live');
    const keys = t.app.get(IdempotencyService);
    const spy = jest
      .spyOn(keys, 'complete')
      .mockImplementation(() => Promise.reject(new Error('connection lost')));
    const k = newKey();
    let first: request.Response;
    try {
      first = await compute(key.secret, 'balance', DEMO_BODIES.balance!, k);
      expect(first.status).toBe(200);
      expect(
        await ds.query(`SELECT state FROM idempotency_keys WHERE caller = $1 AND key = $2`, [
          `key:${key.id}`,
          k,
        ]),
      ).toEqual([]);
    } finally {
      spy.mockRestore();
    }
    // The retry is not told to wait: it runs afresh (not a replay) and gets the same answer.
    const retry = await compute(key.secret, 'balance', DEMO_BODIES.balance!, k);
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBeUndefined();
    expect(retry.body).toEqual(first.body);
    // Its answer was stored: the next retry is a replay.
    const third = await compute(key.secret, 'balance', DEMO_BODIES.balance!, k);
    expect(third.headers['idempotency-replayed']).toBe('true');
    expect(third.text).toBe(retry.text);
    // Both runs were metered: the first answer had been sent, so it counted; so did the rerun.
    expect(await usageOf(key.id, 'balance', 2)).toEqual([
      { status: 200, billable_units: 1 },
      { status: 200, billable_units: 1 },
    ]);
  });

  it("frees a computation's key left in flight after 30 s, an upload's only after 10 minutes", async () => {
    // Neither the answer's write nor letting go of the key goes through: the key stays in flight.
    const owner = await signUp(t.url, { organizationName: 'Cinderford Lane Portraits' });
    const key = await createKey(owner, 'live');
    const keys = t.app.get(IdempotencyService);
    const lost = () => Promise.reject(new Error('connection lost'));
    const spies = [
      jest.spyOn(keys, 'complete').mockImplementation(lost),
      jest.spyOn(keys, 'release').mockImplementation(lost),
    ];
    const k = newKey();
    const row = () =>
      ds.query(`SELECT state FROM idempotency_keys WHERE caller = $1 AND key = $2`, [
        `key:${key.id}`,
        k,
      ]);
    try {
      const first = await compute(key.secret, 'flash', DEMO_BODIES.flash!, k);
      expect(first.status).toBe(200);
      expect(await row()).toEqual([{ state: 'in_flight' }]);
    } finally {
      for (const spy of spies) spy.mockRestore();
    }
    const age = (k2: string, caller: string, seconds: number) =>
      ds.query(
        `UPDATE idempotency_keys SET created_at = now() - $3 * interval '1 second'
          WHERE caller = $1 AND key = $2`,
        [caller, k2, seconds],
      );
    // 20 s on: still in flight for a computation (409).
    await age(k, `key:${key.id}`, 20);
    expect((await compute(key.secret, 'flash', DEMO_BODIES.flash!, k)).status).toBe(409);
    // 31 s on: stale; the same request runs again (another body with the key is still refused).
    await age(k, `key:${key.id}`, 31);
    const other = await compute(key.secret, 'flash', { ...DEMO_BODIES.flash!, distance: 4 }, k);
    expect(other.status).toBe(422);
    const retry = await compute(key.secret, 'flash', DEMO_BODIES.flash!, k);
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBeUndefined();
    expect(await row()).toEqual([{ state: 'done' }]);
    // 2 metered runs (first and rerun) plus the refused other body (422, not billable).
    const usage = await usageOf(key.id, 'flash', 3);
    expect(usage.filter((u) => u.status === 200)).toHaveLength(2);

    // An upload's key left in flight 9 minutes still blocks a retry: the long stale time holds.
    const img = await frameImage();
    const u = newKey();
    const upl = await upload(live.secret, img, u, '5300');
    expect(upl.status).toBe(201);
    await ds.query(
      `UPDATE idempotency_keys SET state = 'in_flight', created_at = now() - interval '9 minutes'
        WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, u],
    );
    expect((await upload(live.secret, img, u, '5300')).status).toBe(409);
  });

  it('counts a retried computation once against the monthly quota', async () => {
    const owner = await signUp(t.url, { organizationName: 'Lanternfield Portraits' });
    const key = await createKey(owner, 'live');
    const now = new Date();
    const period = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), 1))
      .toISOString()
      .slice(0, 10);
    // One call left of the free plan's month.
    await ds.query(
      `INSERT INTO quota_counters (organization_id, period_start, mode, reserved)
       SELECT $1, $2, 'live', included_calls_per_month - 1 FROM plans WHERE code = 'free'`,
      [owner.organizationId, period],
    );
    const k = newKey();
    const first = await compute(key.secret, 'balance', DEMO_BODIES.balance!, k);
    expect(first.status).toBe(200);
    const retry = await compute(key.secret, 'balance', DEMO_BODIES.balance!, k);
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBe('true');
    expect(retry.text).toBe(first.text);
    // The month's last call went to the first request only: a new one is over the quota.
    const next = await compute(key.secret, 'balance', DEMO_BODIES.balance!);
    expect(next.status).toBe(429);
    expect(next.body.type).toBe(`${PROBLEMS}quota-exceeded`);
    expect(await usageOf(key.id, 'balance', 2)).toEqual([
      { status: 200, billable_units: 1 },
      { status: 429, billable_units: 0 },
    ]);
  });

  it('refuses the same key with another body or endpoint: 422 naming the header, the first answer kept', async () => {
    const k = newKey();
    const first = await compute(
      live.secret,
      'balance',
      { cameraKelvin: 3800, flashKelvin: 5600 },
      k,
    );
    expect(first.status).toBe(200);
    const other = await compute(
      live.secret,
      'balance',
      { cameraKelvin: 3200, flashKelvin: 5600 },
      k,
    );
    expect(other.status).toBe(422);
    expect(other.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(other.body).toMatchObject({
      type: `${PROBLEMS}idempotency-key-reused`,
      status: 422,
      errors: [{ field: 'Idempotency-Key', reason: expect.stringMatching(/different request/) }],
    });
    const elsewhere = await compute(live.secret, 'exposure', DEMO_BODIES.exposure!, k);
    expect(elsewhere.status).toBe(422);
    expect(elsewhere.body.type).toBe(`${PROBLEMS}idempotency-key-reused`);
    const again = await compute(
      live.secret,
      'balance',
      { cameraKelvin: 3800, flashKelvin: 5600 },
      k,
    );
    expect(again.headers['idempotency-replayed']).toBe('true');
    expect(again.text).toBe(first.text);
  });

  it("limits a loop of refused retries with the key's rate limit, and replays take nothing from it", async () => {
    const owner = await signUp(t.url, { organizationName: 'Bramblecote Portraits' });
    const key = await createKey(owner, 'live');
    const [free] = await ds.query(
      `SELECT rate_per_second AS rate, burst FROM plans WHERE code = 'free'`,
    );
    const k = newKey();
    expect(
      (await compute(key.secret, 'balance', { cameraKelvin: 3800, flashKelvin: 5600 }, k)).status,
    ).toBe(200);
    // The same key with other bodies, as fast as one connection sends them: once the burst is
    // spent the refusals become 429 rate-limited.
    const statuses: number[] = [];
    for (let i = 0; i < free.burst + 10; i++) {
      const r = await compute(
        key.secret,
        'balance',
        { cameraKelvin: 3000 + i, flashKelvin: 5600 },
        k,
      );
      statuses.push(r.status);
      if (r.status === 429) expect(r.body.type).toBe(`${PROBLEMS}rate-limited`);
    }
    expect(statuses.filter((x) => x === 422).length).toBeGreaterThan(0);
    expect(statuses.filter((x) => x === 429).length).toBeGreaterThan(0);
    expect(statuses.every((x) => x === 422 || x === 429)).toBe(true);
    // Replays pass even with the bucket empty: they take nothing from it.
    const replay = await compute(
      key.secret,
      'balance',
      { cameraKelvin: 3800, flashKelvin: 5600 },
      k,
    );
    expect(replay.status).toBe(200);
    expect(replay.headers['idempotency-replayed']).toBe('true');
  });

  it('answers 409 with Retry-After while the first request with the key is still running', async () => {
    const img = await frameImage();
    const k = newKey();
    const before = (await framesOf(studio.organizationId)).length;
    // Two at once: exactly one frame is stored, whichever way the race goes — the second is
    // told to wait (409) or, if the first already finished, gets its answer replayed.
    const both = await Promise.all([upload(live.secret, img, k), upload(live.secret, img, k)]);
    const created = both.filter((r) => r.status === 201 && !r.headers['idempotency-replayed']);
    expect(created).toHaveLength(1);
    const second = both.find((r) => r !== created[0])!;
    expect([409, 201]).toContain(second.status);
    if (second.status === 201) expect(second.text).toBe(created[0]!.text);
    expect((await framesOf(studio.organizationId)).length).toBe(before + 1);
    // Deterministically in flight: the key's row put back in that state, as while the first
    // request runs (recent, so not stale).
    await ds.query(
      `UPDATE idempotency_keys SET state = 'in_flight' WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, k],
    );
    const conflict = await upload(live.secret, img, k);
    expect(conflict.status).toBe(409);
    expect(conflict.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(conflict.headers['retry-after']).toBe('1');
    expect(conflict.body).toMatchObject({
      type: `${PROBLEMS}idempotency-key-in-use`,
      status: 409,
      errors: [{ field: 'Idempotency-Key', reason: expect.any(String) }],
    });
    expect((await framesOf(studio.organizationId)).length).toBe(before + 1);
    // Once the first has finished, the retry gets its answer.
    await ds.query(`UPDATE idempotency_keys SET state = 'done' WHERE caller = $1 AND key = $2`, [
      `key:${live.id}`,
      k,
    ]);
    const later = await upload(live.secret, img, k);
    expect(later.headers['idempotency-replayed']).toBe('true');
    expect(later.text).toBe(created[0]!.text);
  });

  it('lets a retry take over a key whose request never finished (stale in-flight), same request only', async () => {
    const k = newKey();
    const first = await compute(live.secret, 'flash', DEMO_BODIES.flash!, k);
    expect(first.status).toBe(200);
    // As if the instance stopped mid-request 11 minutes ago: in flight, no answer stored.
    await ds.query(
      `UPDATE idempotency_keys SET state = 'in_flight', status = NULL, headers = NULL, body = NULL,
         created_at = now() - interval '11 minutes' WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, k],
    );
    const other = await compute(live.secret, 'flash', { ...DEMO_BODIES.flash!, distance: 4 }, k);
    expect(other.status).toBe(422);
    const retry = await compute(live.secret, 'flash', DEMO_BODIES.flash!, k);
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBeUndefined();
    expect(retry.body).toEqual(first.body);
  });

  it("keeps each caller's keys apart: API keys, another organisation and a console user", async () => {
    const k = newKey();
    const test = await createKey(studio, 'test');
    const elsewhere = await signUp(t.url, { organizationName: 'Fernhollow Studio' });
    const theirs = await createKey(elsewhere, 'live');
    const bodies = [3000, 3400, 3800, 4200].map((cameraKelvin) => ({
      cameraKelvin,
      flashKelvin: 5600,
    }));
    const answers = [
      await compute(live.secret, 'balance', bodies[0]!, k),
      await compute(test.secret, 'balance', bodies[1]!, k),
      await compute(theirs.secret, 'balance', bodies[2]!, k),
      await studio.agent.post('/v1/balance').set('Idempotency-Key', k).send(bodies[3]!),
    ];
    for (const [i, res] of answers.entries()) {
      expect(res.status).toBe(200);
      expect(res.headers['idempotency-replayed']).toBeUndefined();
      // Each answer is for its own body, not another caller's stored one.
      const fresh = await compute(live.secret, 'balance', bodies[i]!);
      expect(res.body).toEqual(fresh.body);
    }
    const rows = await ds.query(`SELECT caller FROM idempotency_keys WHERE key = $1`, [k]);
    expect(rows).toHaveLength(4);
    // A console user's retry is replayed too.
    const again = await studio.agent.post('/v1/balance').set('Idempotency-Key', k).send(bodies[3]!);
    expect(again.headers['idempotency-replayed']).toBe('true');
    expect(again.text).toBe(answers[3]!.text);
  });

  it('forgets a key 24 hours on: the key works again, and the sweeper deletes expired rows', async () => {
    const k = newKey();
    const first = await compute(live.secret, 'falloff', DEMO_BODIES.falloff!, k);
    expect(first.status).toBe(200);
    const [row] = await ds.query(
      `SELECT extract(epoch FROM expires_at - created_at)::int AS ttl
         FROM idempotency_keys WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, k],
    );
    expect(row.ttl).toBe(24 * 3600);
    await ds.query(
      `UPDATE idempotency_keys SET expires_at = now() - interval '1 second'
        WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, k],
    );
    const body = { ...DEMO_BODIES.falloff!, backgroundDistance: 12 };
    const reused = await compute(live.secret, 'falloff', body, k);
    expect(reused.status).toBe(200);
    expect(reused.headers['idempotency-replayed']).toBeUndefined();
    expect(reused.body).toEqual((await compute(live.secret, 'falloff', body)).body);

    const k2 = newKey();
    await compute(live.secret, 'falloff', DEMO_BODIES.falloff!, k2).expect(200);
    await ds.query(
      `UPDATE idempotency_keys SET expires_at = now() - interval '1 second'
        WHERE caller = $1 AND key = $2`,
      [`key:${live.id}`, k2],
    );
    expect(await t.app.get(IdempotencySweeper).sweep()).toBeGreaterThanOrEqual(1);
    const left = await ds.query(
      `SELECT key FROM idempotency_keys WHERE expires_at <= now() OR key = $1`,
      [k2],
    );
    expect(left).toEqual([]);
  });

  it('takes a re-serialised JSON body (other key order, spacing, number spelling) as the same request', async () => {
    const k = newKey();
    const first = await compute(
      live.secret,
      'balance',
      { cameraKelvin: 3400, flashKelvin: 5600, maxGels: 2 },
      k,
    );
    expect(first.status).toBe(200);
    // RFC 8785 (JSON Canonicalization Scheme): member order, insignificant whitespace and the
    // spelling of a number (5.6e3 is 5600) do not change the value.
    const retry = await request(t.url)
      .post('/v1/balance')
      .set('Authorization', `Bearer ${live.secret}`)
      .set('Idempotency-Key', k)
      .set('Content-Type', 'application/json')
      .send('{ "maxGels": 2,\n  "flashKelvin": 5.6e3, "cameraKelvin": 3400 }');
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBe('true');
    expect(retry.text).toBe(first.text);
    // A different value is still a different request.
    const other = await compute(
      live.secret,
      'balance',
      { maxGels: 2, flashKelvin: 5601, cameraKelvin: 3400 },
      k,
    );
    expect(other.status).toBe(422);
    expect(other.body.type).toBe(`${PROBLEMS}idempotency-key-reused`);
  });

  it('refuses an upload with a key on a plan without uploads before reading its body', async () => {
    const free = await signUp(t.url, { organizationName: 'Larchfield Portraits' });
    const key = await createKey(free, 'live');
    // Headers announce 20 MB and only 1 KB is sent: the answer can only come before the body.
    const res = await new Promise<{ status: number; body: string }>((resolve, reject) => {
      const req = http.request(`${t.url}/v1/frames`, {
        method: 'POST',
        headers: {
          Authorization: `Bearer ${key.secret}`,
          'Idempotency-Key': newKey(),
          'Content-Type': 'multipart/form-data; boundary=larch',
          'Content-Length': String(20 * 1024 * 1024),
        },
      });
      const timer = setTimeout(() => {
        req.destroy();
        reject(new Error('no answer before the body was sent'));
      }, 5000);
      req.on('response', (r) => {
        let body = '';
        r.on('data', (c: Buffer) => (body += c.toString()));
        r.on('end', () => {
          clearTimeout(timer);
          req.destroy();
          resolve({ status: r.statusCode ?? 0, body });
        });
      });
      req.on('error', (e) => {
        clearTimeout(timer);
        reject(e);
      });
      req.write(
        '--larch\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\n' +
          'Content-Type: image/jpeg\r\n\r\n' +
          'x'.repeat(1024),
      );
    });
    expect(res.status).toBe(403);
    expect(JSON.parse(res.body)).toMatchObject({
      type: `${PROBLEMS}plan-feature-missing`,
      feature: 'uploads',
    });
    expect(await framesOf(free.organizationId)).toEqual([]);
  });

  it('replays a client error (422) like a success, byte for byte', async () => {
    const k = newKey();
    const bad = { cameraKelvin: 100, flashKelvin: 5600 };
    const first = await compute(live.secret, 'balance', bad, k);
    expect(first.status).toBe(422);
    const retry = await compute(live.secret, 'balance', bad, k);
    expect(retry.status).toBe(422);
    expect(retry.headers['idempotency-replayed']).toBe('true');
    expect(retry.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(retry.text).toBe(first.text);
  });

  it('reads a quoted (structured-field) key as the same key as the bare one', async () => {
    const k = newKey();
    const bare = await compute(live.secret, 'exposure', DEMO_BODIES.exposure!, k);
    expect(bare.status).toBe(200);
    const quoted = await compute(live.secret, 'exposure', DEMO_BODIES.exposure!, `"${k}"`);
    expect(quoted.headers['idempotency-replayed']).toBe('true');
    expect(quoted.text).toBe(bare.text);
  });

  it('refuses a malformed key with a 422 problem naming the header, before any work', async () => {
    for (const bad of ['', '   ', 'x'.repeat(256), '"unterminated', '"a"b"', '"bad\\escape"']) {
      const res = await compute(live.secret, 'balance', DEMO_BODIES.balance!, bad);
      expect(res.status).toBe(422);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({
        type: `${PROBLEMS}invalid-input`,
        errors: [{ field: 'Idempotency-Key', reason: expect.stringMatching(/255 printable/) }],
      });
    }
    const img = await frameImage();
    const res = await upload(live.secret, img, 'y'.repeat(300));
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ field: 'Idempotency-Key', reason: expect.any(String) }]);
  });

  it('lets browsers send Idempotency-Key and read Idempotency-Replayed (CORS)', async () => {
    const pre = await request(t.url)
      .options('/v1/frames')
      .set('Origin', CONSOLE_ORIGIN)
      .set('Access-Control-Request-Method', 'POST')
      .set('Access-Control-Request-Headers', 'authorization,idempotency-key');
    expect(pre.status).toBe(204);
    expect(pre.headers['access-control-allow-headers']).toMatch(/Idempotency-Key/i);
    const simple = await request(t.url).get('/v1/health').set('Origin', CONSOLE_ORIGIN);
    expect(simple.headers['access-control-expose-headers']).toMatch(/Idempotency-Replayed/);
  });
});

describe('Idempotency-Key when the server fails (5xx)', () => {
  let t: TestApp;
  let s3fake: RunningFake;
  let ds: DataSource;

  beforeAll(async () => {
    s3fake = await startFake('s3-fake');
    t = await bootApp(s3fake.env);
    ds = await openDataSource();
  });

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    await s3fake?.stop();
  });

  it('does not store a 5xx: the retry with the same key runs again and succeeds', async () => {
    const owner = await signUp(t.url, { organizationName: 'Millbrook Portraits' });
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      owner.organizationId,
    ]);
    const key = await createKey(owner, 'live');
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const send = () =>
      request(t.url)
        .post('/v1/frames')
        .set('Authorization', `Bearer ${key.secret}`)
        .set('Idempotency-Key', 'upload-after-outage')
        .attach('file', img, { filename: 'mill.jpg', contentType: 'image/jpeg' });
    const port = Number(new URL(s3fake.env.S3_ENDPOINT!).port);
    await s3fake.stop();
    const failed = await send();
    expect(failed.status).toBe(503);
    expect(
      await ds.query(`SELECT key FROM idempotency_keys WHERE caller = $1`, [`key:${key.id}`]),
    ).toEqual([]);
    // Object storage is back where the server expects it.
    s3fake = await startFake('s3-fake', { port });
    const retried = await send();
    expect(retried.status).toBe(201);
    expect(retried.headers['idempotency-replayed']).toBeUndefined();
    const again = await send();
    expect(again.headers['idempotency-replayed']).toBe('true');
    expect(again.text).toBe(retried.text);
    const frames = await ds.query(`SELECT id FROM frames WHERE organization_id = $1`, [
      owner.organizationId,
    ]);
    expect(frames).toEqual([{ id: retried.body.id }]);
  });
});
