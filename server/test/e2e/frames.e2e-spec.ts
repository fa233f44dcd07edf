// Test-frame uploads end to end: real PostgreSQL, the local S3 fake (scripts/lib/s3-fake.mjs),
// images rendered here from known CIE chromaticities with known EXIF.
import { ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import sharp from 'sharp';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { createKey } from '../factories/compute.js';
import { renderFrame, startFake, type RunningFake } from '../factories/frames.js';
import { FrameOrphanSweeper } from '../../src/frames/orphan-sweeper.service.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

// CIE 15:2004 (Colorimetry, 3rd ed.), Table T.3 / §3.1: chromaticity of CIE standard illuminant
// A, x = 0.44757, y = 0.40745, CCT 2856 K; of D65, x = 0.31271, y = 0.32902, CCT 6504 K.
const ILLUMINANT_A = { cx: 0.44757, cy: 0.40745, cct: 2856 };
const D65 = { cx: 0.31271, cy: 0.32902, cct: 6504 };
// Tolerance of the method as used here: 8-bit sRGB code values (dithered ±0.5 LSB), JPEG at
// quality 100 and Robertson's interpolation; about ±1.5 mired at A, ±0.4 mired at D65.
const CCT_TOLERANCE_K = 15;
const mired = (k: number) => 1e6 / k;

const PATCH = { x: 160, y: 100, width: 160, height: 120 };
const EXIF = {
  exposureTime: [1, 60] as [number, number],
  fNumber: [40, 10] as [number, number],
  iso: 400,
  whiteBalance: 1 as const,
  flash: 1,
  focalLength: [85, 1] as [number, number],
};

describe('frames', () => {
  let t: TestApp;
  let s3fake: RunningFake;
  let s3: S3Client;
  let ds: DataSource;
  let studio: SignedInAgent;

  beforeAll(async () => {
    s3fake = await startFake('s3-fake');
    t = await bootApp(s3fake.env);
    ds = await openDataSource();
    s3 = new S3Client({
      endpoint: s3fake.env.S3_ENDPOINT,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    studio = await signUp(t.url);
    // Uploads are a plan feature: this organisation is on the studio plan.
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      studio.organizationId,
    ]);
  });

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    s3?.destroy();
    await s3fake?.stop();
  });

  const objectsOf = async (orgId: string) => {
    const out = await s3.send(
      new ListObjectsV2Command({ Bucket: s3fake.env.S3_BUCKET, Prefix: `frames/${orgId}/` }),
    );
    return (out.Contents ?? []).map((o) => o.Key!);
  };
  const rowsOf = async (orgId: string) =>
    Number(
      (await ds.query(`SELECT count(*) AS n FROM frames WHERE organization_id = $1`, [orgId]))[0].n,
    );
  const patchFields = (r: request.Test, p = PATCH) =>
    r
      .field('patchX', String(p.x))
      .field('patchY', String(p.y))
      .field('patchWidth', String(p.width))
      .field('patchHeight', String(p.height));

  it('reads CIE illuminant A from a JPEG patch as 2856 K, with its EXIF and an EV estimate', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...ILLUMINANT_A, Y: 0.3 }, exif: EXIF });
    const res = await patchFields(
      studio.agent
        .post('/v1/frames')
        .attach('file', img, { filename: 'terrace-test.jpg', contentType: 'image/jpeg' }),
    ).field('cameraKelvin', '5500');
    expect(res.status).toBe(201);
    const f = res.body;
    expect(f.contentType).toBe('image/jpeg');
    expect(f.patch).toMatchObject({ ...PATCH, source: 'caller' });
    expect(Math.abs(f.colour.cctKelvin - ILLUMINANT_A.cct)).toBeLessThanOrEqual(CCT_TOLERANCE_K);
    expect(Math.abs(f.colour.duv)).toBeLessThan(0.002); // A lies on the Planckian locus
    // Offset from sRGB's neutral (D65) in mireds, from the CIE CCTs, not from the server.
    const offset = mired(ILLUMINANT_A.cct) - mired(D65.cct);
    expect(Math.abs(f.colour.miredOffset - offset)).toBeLessThan(2);
    // At 5500 K white balance the light was 1e6 / (mired(5500) + offset) K: set that, or gel
    // the light by -offset mireds (a cooling, CTB-direction gel).
    const light = 1e6 / (mired(5500) + offset);
    expect(Math.abs(f.colour.whiteBalance.kelvin - light)).toBeLessThan(20);
    expect(f.colour.gel.requiredMiredShift).toBeCloseTo(-offset, -0.5);
    expect(f.colour.gel.gels.length).toBeGreaterThan(0);
    expect(f.colour.gel.gels.every((g: { miredShift: number }) => g.miredShift < 0)).toBe(true);
    expect(f.exif).toEqual({
      exposureTime: 1 / 60,
      fNumber: 4,
      iso: 400,
      whiteBalance: 'manual',
      flashFired: true,
      focalLengthMm: 85,
    });
    // APEX (Kerr 2007): EV100 = log2(N²/t) - log2(S/100) = log2(16 · 60) - 2 = 7.907;
    // the patch's luminance Y = 0.3 is log2(0.3 / 0.18) = 0.737 stops over middle grey.
    expect(f.exposure.settingsEv100).toBeCloseTo(7.91, 2);
    expect(f.exposure.patchLuminance).toBeCloseTo(0.3, 2);
    expect(f.exposure.sceneEv100).toBeCloseTo(7.907 + Math.log2(0.3 / 0.18), 1);
    expect(f.exposure.basis).toMatch(/flash/i);
    expect(f.thumbnailUrl).toBe(`/v1/frames/${f.id}/thumbnail`);
    console.log(`illuminant A patch read as ${f.colour.cctKelvin} K, Duv ${f.colour.duv}`);
  });

  it('reads CIE D65 from a PNG patch as 6504 K, a zero offset and no correction', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 }, format: 'png' });
    const res = await patchFields(
      studio.agent
        .post('/v1/frames')
        .attach('file', img, { filename: 'daylight.png', contentType: 'image/png' }),
    ).field('cameraKelvin', '6500');
    expect(res.status).toBe(201);
    const f = res.body;
    expect(f.contentType).toBe('image/png');
    expect(Math.abs(f.colour.cctKelvin - D65.cct)).toBeLessThanOrEqual(CCT_TOLERANCE_K);
    expect(Math.abs(f.colour.miredOffset)).toBeLessThan(1);
    expect(Math.abs(f.colour.whiteBalance.kelvin - 6500)).toBeLessThan(50);
    expect(f.exif.fNumber).toBeNull(); // no EXIF in this PNG
    expect(f.exposure.sceneEv100).toBeNull();
    console.log(`D65 patch read as ${f.colour.cctKelvin} K, Duv ${f.colour.duv}`);
  });

  it('finds the neutral patch by itself on a busy, coloured background', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...ILLUMINANT_A, Y: 0.25 }, seed: 11 });
    const res = await studio.agent.post('/v1/frames').attach('file', img, 'auto.jpg');
    expect(res.status).toBe(201);
    const p = res.body.patch;
    expect(p.source).toBe('auto');
    expect(p.x).toBeGreaterThanOrEqual(PATCH.x);
    expect(p.y).toBeGreaterThanOrEqual(PATCH.y);
    expect(p.x + p.width).toBeLessThanOrEqual(PATCH.x + PATCH.width);
    expect(p.y + p.height).toBeLessThanOrEqual(PATCH.y + PATCH.height);
    expect(Math.abs(res.body.colour.cctKelvin - ILLUMINANT_A.cct)).toBeLessThanOrEqual(
      CCT_TOLERANCE_K,
    );
    expect(res.body.colour.cameraKelvinSource).toBe('assumed');
  });

  it('lists frames, returns one, and serves its thumbnail; other organisations see none', async () => {
    const list = await studio.agent.get('/v1/frames?limit=2').expect(200);
    expect(list.body.data).toHaveLength(2);
    expect(list.body.nextCursor).toEqual(expect.any(String));
    const next = await studio.agent
      .get(`/v1/frames?limit=2&cursor=${list.body.nextCursor}`)
      .expect(200);
    const ids = [...list.body.data, ...next.body.data].map((f: { id: string }) => f.id);
    expect(new Set(ids).size).toBe(3);
    const one = await studio.agent.get(`/v1/frames/${ids[0]}`).expect(200);
    expect(one.body.id).toBe(ids[0]);
    const thumb = await studio.agent.get(one.body.thumbnailUrl).buffer(true).expect(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    const meta = await sharp(thumb.body as Buffer).metadata();
    expect(Math.max(meta.width!, meta.height!)).toBeLessThanOrEqual(320);
    const stranger = await signUp(t.url);
    await stranger.agent.get(`/v1/frames/${ids[0]}`).expect(404);
    const theirs = await stranger.agent.get('/v1/frames').expect(200);
    expect(theirs.body.data).toEqual([]);
    // A malformed id names no frame: the same 404 naming `id` as other routes give.
    const bad = await studio.agent.get('/v1/frames/not-a-uuid').expect(404);
    expect(bad.body.errors).toEqual([
      { field: 'id', reason: 'is not a test frame of your organisation (ids are UUIDs)' },
    ]);
    // Every row has its two objects, and there is no object without a row.
    expect(await objectsOf(studio.organizationId)).toHaveLength(
      2 * (await rowsOf(studio.organizationId)),
    );
  });

  it('sweeps objects no row refers to once they are old enough, and keeps every frame', async () => {
    const framed = await objectsOf(studio.organizationId);
    expect(framed.length).toBeGreaterThan(0);
    // What a crash between the object writes and the row insert leaves behind.
    const orphan = `frames/${studio.organizationId}/00000000-0000-4000-8000-000000000001/original.png`;
    await s3.send(
      new PutObjectCommand({
        Bucket: s3fake.env.S3_BUCKET,
        Key: orphan,
        Body: Buffer.from('left over'),
        ContentType: 'image/png',
      }),
    );
    const sweeper = t.app.get(FrameOrphanSweeper);
    // Young objects are left alone (an upload may still be writing its row).
    const young = await sweeper.sweep(60 * 60_000);
    expect(young.deleted).toBe(0);
    expect(await objectsOf(studio.organizationId)).toContain(orphan);
    // S3 times have one-second resolution: wait until the orphan is strictly older than "now - 0".
    await new Promise((r) => setTimeout(r, 1100));
    const swept = await sweeper.sweep(0);
    expect(swept.deleted).toBe(1);
    expect(swept.scanned).toBeGreaterThanOrEqual(framed.length + 1);
    const after = await objectsOf(studio.organizationId);
    expect(after).not.toContain(orphan);
    expect(after.sort()).toEqual([...framed].sort());
    // Frames still open, with their thumbnails.
    const list = await studio.agent.get('/v1/frames?limit=1').expect(200);
    await studio.agent.get(list.body.data[0].thumbnailUrl).expect(200);
  });

  it('refuses a file over 25 MB with 413 while streaming, storing nothing', async () => {
    const before = await objectsOf(studio.organizationId);
    const rows = await rowsOf(studio.organizationId);
    const big = Buffer.alloc(25 * 1024 * 1024 + 1024, 0x41);
    big.set([0xff, 0xd8, 0xff, 0xe0], 0);
    const res = await studio.agent.post('/v1/frames').attach('file', big, 'huge.jpg');
    expect(res.status).toBe(413);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    expect(res.body.errors).toEqual([
      { field: 'file', reason: `must be at most ${25 * 1024 * 1024} bytes` },
    ]);
    expect(await rowsOf(studio.organizationId)).toBe(rows);
    expect(await objectsOf(studio.organizationId)).toEqual(before);
  });

  it('refuses what is not JPEG or PNG by its content (415), whatever the name and header say', async () => {
    const gif = Buffer.from('R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7', 'base64');
    const res = await studio.agent
      .post('/v1/frames')
      .attach('file', gif, { filename: 'frame.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(415);
    expect(res.body.errors[0]).toMatchObject({ field: 'file' });
    expect(res.body.detail).toMatch(/image\/gif/);
    const text = await studio.agent
      .post('/v1/frames')
      .attach('file', Buffer.from('just words'), 'a.png');
    expect(text.status).toBe(415);
    const json = await studio.agent.post('/v1/frames').send({ file: 'x' });
    expect(json.status).toBe(415);
    expect(json.body.errors[0].field).toBe('body');
  });

  it('refuses a corrupt JPEG with 422 and stores nothing', async () => {
    const before = await objectsOf(studio.organizationId);
    const good = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const truncated = good.subarray(0, Math.floor(good.length / 2));
    const res = await studio.agent.post('/v1/frames').attach('file', truncated, 'cut.jpg');
    expect(res.status).toBe(422);
    // The same problem type as every other 422 naming a field.
    expect(res.body.type).toBe('https://lumenwright.test/problems/invalid-input');
    expect(res.body.errors).toEqual([{ field: 'file', reason: 'is corrupt or truncated' }]);
    expect(await objectsOf(studio.organizationId)).toEqual(before);
  });

  it('names the field when the patch is outside the image or half given', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const out = await patchFields(studio.agent.post('/v1/frames').attach('file', img, 'a.jpg'), {
      ...PATCH,
      width: 400,
    });
    expect(out.status).toBe(422);
    expect(out.body.errors).toEqual([
      { field: 'patchWidth', reason: 'reaches past the right edge (width 480)' },
    ]);
    const half = await studio.agent
      .post('/v1/frames')
      .field('patchX', '3')
      .attach('file', img, 'a.jpg');
    expect(half.status).toBe(422);
    expect(half.body.errors.map((e: { field: string }) => e.field)).toEqual([
      'patchY',
      'patchWidth',
      'patchHeight',
    ]);
    const nothing = await studio.agent
      .post('/v1/frames')
      .attach(
        'file',
        await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 }, background: 'dark' }),
        'dark.jpg',
      )
      .field('cameraKelvin', '99');
    expect(nothing.status).toBe(422);
    expect(nothing.body.errors).toEqual([
      { field: 'cameraKelvin', reason: 'must be a whole number from 1500 to 20000' },
    ]);
  });

  it('gives an invalid patch field one problem, not also "is required"', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const bad = await studio.agent
      .post('/v1/frames')
      .field('patchX', 'abc')
      .field('patchY', String(PATCH.y))
      .field('patchWidth', String(PATCH.width))
      .field('patchHeight', String(PATCH.height))
      .attach('file', img, 'a.jpg');
    expect(bad.status).toBe(422);
    expect(bad.body.errors).toEqual([
      { field: 'patchX', reason: 'must be a whole number from 0 to 100000' },
    ]);
    // Alone, the invalid field is still itself; the ones never sent are the missing ones.
    const alone = await studio.agent
      .post('/v1/frames')
      .field('patchX', '-1')
      .field('patchX', '7')
      .attach('file', img, 'a.jpg');
    expect(alone.status).toBe(422);
    expect(alone.body.errors).toEqual([
      { field: 'patchX', reason: 'must be a whole number from 0 to 100000' },
      { field: 'patchY', reason: 'is required when any patch field is given' },
      { field: 'patchWidth', reason: 'is required when any patch field is given' },
      { field: 'patchHeight', reason: 'is required when any patch field is given' },
    ]);
  });

  it('flags a patch bluer than any black body: no CCT, a warning saying why, kept on the stored frame', async () => {
    // The Planckian locus ends at x 0.2399, y 0.2340 as T -> infinity (from memory); x 0.22,
    // y 0.21 lies past it, so Robertson's table (1667 K to infinite temperature) has no CCT.
    const img = await renderFrame({
      patch: { ...PATCH, cx: 0.22, cy: 0.21, Y: 0.2 },
      format: 'png',
    });
    const res = await patchFields(studio.agent.post('/v1/frames').attach('file', img, 'sky.png'));
    expect(res.status).toBe(201);
    expect(res.body.colour).toMatchObject({ cctKelvin: null, duv: null, cctMeaningful: false });
    expect(res.body.colour.gel).toBeNull();
    expect(res.body.warnings).toEqual([
      { code: 'bluer-than-cct-range', message: expect.stringMatching(/bluer than any black body/) },
    ]);
    expect(res.body.colour.notes).toContainEqual(res.body.warnings[0]);
    const again = await studio.agent.get(`/v1/frames/${res.body.id}`).expect(200);
    expect(again.body.warnings).toEqual(res.body.warnings);
  });

  it('reads a frame stored before warnings had codes: its strings come back as "unclassified"', async () => {
    const img = await renderFrame({ patch: { ...PATCH, ...ILLUMINANT_A, Y: 0.2 }, format: 'png' });
    const res = await patchFields(studio.agent.post('/v1/frames').attach('file', img, 'old.png'));
    expect(res.status).toBe(201);
    // The row as the earlier analysis wrote it: plain strings in `warnings` and `colour.notes`.
    await ds.query(
      `UPDATE frames SET analysis = jsonb_set(jsonb_set(analysis, '{warnings}', $2::jsonb),
         '{colour,notes}', $3::jsonb) WHERE id = $1`,
      [
        res.body.id,
        JSON.stringify(['The patch is very dark: its colour is unreliable.']),
        JSON.stringify(['An older note.', { code: 'tint', message: 'A coded note.' }]),
      ],
    );
    const one = await studio.agent.get(`/v1/frames/${res.body.id}`).expect(200);
    expect(one.body.warnings).toEqual([
      { code: 'unclassified', message: 'The patch is very dark: its colour is unreliable.' },
    ]);
    expect(one.body.colour.notes).toEqual([
      { code: 'unclassified', message: 'An older note.' },
      { code: 'tint', message: 'A coded note.' },
    ]);
    const list = await studio.agent.get('/v1/frames').expect(200);
    const listed = (list.body.data as { id: string; warnings: unknown }[]).find(
      (f) => f.id === res.body.id,
    );
    expect(listed?.warnings).toEqual(one.body.warnings);
  });

  it('meters uploads like computations: rate-limit headers, a usage event each, live stored frames billed', async () => {
    const live = await createKey(studio, 'live');
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const stored = await request(t.url)
      .post('/v1/frames')
      .set('Authorization', `Bearer ${live.secret}`)
      .attach('file', img, { filename: 'terrace.jpg', contentType: 'image/jpeg' });
    expect(stored.status).toBe(201);
    expect(stored.headers['ratelimit-policy']).toMatch(/^"key";q=\d+;w=\d+$/);
    const refused = await request(t.url)
      .post('/v1/frames')
      .set('Authorization', `Bearer ${live.secret}`)
      .attach('file', Buffer.from('just words'), 'a.png');
    expect(refused.status).toBe(415);
    let rows: { status: number; billable_units: number; source: string }[] = [];
    for (let i = 0; i < 100 && rows.length < 2; i++) {
      rows = await ds.query(
        `SELECT status, billable_units, source FROM usage_events
          WHERE key_id = $1 AND endpoint = 'frames' ORDER BY status`,
        [live.id],
      );
      if (rows.length < 2) await new Promise((r) => setTimeout(r, 50));
    }
    expect(rows).toEqual([
      { status: 201, billable_units: 1, source: 'live' },
      { status: 415, billable_units: 0, source: 'live' },
    ]);
    const summary = await studio.agent
      .get('/v1/usage/events')
      .query({ endpoint: 'frames', keyId: live.id })
      .expect(200);
    expect(summary.body.data).toHaveLength(2);
  });

  it('refuses uploads on a plan without them (403 naming the feature) and without a session', async () => {
    const free = await signUp(t.url);
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const res = await free.agent.post('/v1/frames').attach('file', img, 'a.jpg');
    expect(res.status).toBe(403);
    expect(res.body).toMatchObject({
      type: 'https://lumenwright.test/problems/plan-feature-missing',
      feature: 'uploads',
      plan: 'free',
    });
    await request(t.url).post('/v1/frames').attach('file', img, 'a.jpg').expect(401);
  });

  it('deletes a frame with a key: row and both objects gone, other organisations refused', async () => {
    const key = await createKey(studio, 'test');
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const up = await request(t.url)
      .post('/v1/frames')
      .set('Authorization', `Bearer ${key.secret}`)
      .attach('file', img, { filename: 'to-delete.jpg', contentType: 'image/jpeg' })
      .expect(201);
    const id: string = up.body.id;
    const objects = await objectsOf(studio.organizationId);
    expect(objects.filter((k) => k.includes(id))).toHaveLength(2);
    const stranger = await signUp(t.url);
    await stranger.agent.delete(`/v1/frames/${id}`).expect(404);
    const rows = await rowsOf(studio.organizationId);
    const del = await request(t.url)
      .delete(`/v1/frames/${id}`)
      .set('Authorization', `Bearer ${key.secret}`);
    expect(del.status).toBe(204);
    expect(del.text).toBe('');
    expect(await rowsOf(studio.organizationId)).toBe(rows - 1);
    expect((await objectsOf(studio.organizationId)).filter((k) => k.includes(id))).toEqual([]);
    // Who deleted it stays on record: one audit event naming the key, the frame and its file.
    const audit = await ds.query(
      `SELECT actor_key_id, actor_user_id, target_type, metadata FROM audit_events
        WHERE organization_id = $1 AND action = 'frame.deleted' AND target_id = $2`,
      [studio.organizationId, id],
    );
    expect(audit).toEqual([
      {
        actor_key_id: key.id,
        actor_user_id: null,
        target_type: 'frame',
        metadata: { fileName: 'to-delete.jpg', sha256: up.body.sha256 },
      },
    ]);
    await studio.agent.get(`/v1/frames/${id}`).expect(404);
    await request(t.url)
      .delete(`/v1/frames/${id}`)
      .set('Authorization', `Bearer ${key.secret}`)
      .expect(404);
    const bad = await studio.agent.delete('/v1/frames/not-a-uuid').expect(404);
    expect(bad.body.errors[0].field).toBe('id');
    await request(t.url).delete(`/v1/frames/${id}`).expect(401);
  });

  it('keeps no row when object storage fails mid-upload (503)', async () => {
    const rows = await rowsOf(studio.organizationId);
    await s3fake.stop();
    const img = await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } });
    const res = await patchFields(studio.agent.post('/v1/frames').attach('file', img, 'a.jpg'));
    expect(res.status).toBe(503);
    expect(await rowsOf(studio.organizationId)).toBe(rows);
  });
});
