// The demo studio's test frames: synthetic images stored through the upload route's own analysis
// and storage into the S3 fake, idempotently, and listed by the API with their analysis.
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import type { DataSource } from 'typeorm';
import { accountsSeeder, DEMO_MEMBERS, DEMO_ORG_ID } from '../../src/auth/accounts.seeder.js';
import { DEMO_FRAME_PATCH, DEMO_FRAMES } from '../../src/frames/demo-frames.js';
import { seedDemoFrames } from '../../src/frames/frames.seeder.js';
import { plansSeeder } from '../../src/plans/plans.seeder.js';
import { setPlan, signUp, type SignedInAgent } from '../factories/accounts.js';
import { startFake, type RunningFake } from '../factories/frames.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

/** sRGB's white point, D65, has a correlated colour temperature of about 6504 K (IEC 61966-2-1, CIE 15). */
const D65_CCT = 6504;

interface ListedFrame {
  id: string;
  fileName: string;
  width: number;
  height: number;
  exif: { iso: number | null; fNumber: number | null; exposureTime: number | null };
  patch: { x: number; y: number; width: number; height: number; source: string };
  colour: { cctKelvin: number | null; miredOffset: number | null };
  exposure: unknown;
  warnings: { code: string }[];
  thumbnailUrl: string;
}

describe('frames: demo seed', () => {
  let t: TestApp;
  let s3fake: RunningFake;
  let s3: S3Client;
  let db: DataSource;
  let studio: SignedInAgent;

  beforeAll(async () => {
    s3fake = await startFake('s3-fake');
    t = await bootApp(s3fake.env);
    db = await openDataSource();
    s3 = new S3Client({
      endpoint: s3fake.env.S3_ENDPOINT,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    await plansSeeder.run(db);
    await accountsSeeder.run(db);
    studio = await signUp(t.url);
    await setPlan(studio.organizationId, 'studio');
  }, 60000);

  afterAll(async () => {
    await t?.close();
    await db?.destroy();
    s3?.destroy();
    await s3fake?.stop();
  });

  const objects = async (orgId: string) =>
    (
      await s3.send(
        new ListObjectsV2Command({ Bucket: s3fake.env.S3_BUCKET, Prefix: `frames/${orgId}/` }),
      )
    ).Contents?.length ?? 0;
  const frameCount = async (orgId: string) =>
    (
      (await db.query(`SELECT count(*)::int AS n FROM frames WHERE organization_id = $1`, [
        orgId,
      ])) as { n: number }[]
    )[0]!.n;
  const keys = DEMO_FRAMES.map((f) => f.key);
  const all = (outcome: string) => Object.fromEntries(keys.map((k) => [k, outcome]));

  it('seeds the demo studio’s frames once, uploaded by its photographer, original and thumbnail in the store', async () => {
    expect(await seedDemoFrames(db, t.config, DEMO_ORG_ID)).toEqual(all('created'));
    expect(await seedDemoFrames(db, t.config, DEMO_ORG_ID)).toEqual(all('current'));
    expect(await frameCount(DEMO_ORG_ID)).toBe(DEMO_FRAMES.length);
    expect(await objects(DEMO_ORG_ID)).toBe(2 * DEMO_FRAMES.length);
    const rows: { uploaded_by_user_id: string; api_key_id: string | null; file_name: string }[] =
      await db.query(
        `SELECT uploaded_by_user_id, api_key_id, file_name FROM frames WHERE organization_id = $1`,
        [DEMO_ORG_ID],
      );
    const photographer = DEMO_MEMBERS.find((m) => m.role === 'photographer')!;
    for (const r of rows) {
      expect(r.uploaded_by_user_id).toBe(photographer.id);
      expect(r.api_key_id).toBeNull();
    }
    expect(rows.map((r) => r.file_name).sort()).toEqual(DEMO_FRAMES.map((f) => f.fileName).sort());
  });

  it('lists the seeded frames through the API with their analysis and thumbnails', async () => {
    expect(await seedDemoFrames(db, t.config, studio.organizationId, studio.userId)).toEqual(
      all('created'),
    );
    const res = await studio.agent.get('/v1/frames').expect(200);
    const data = res.body.data as ListedFrame[];
    expect(data.map((f) => f.fileName).sort()).toEqual(DEMO_FRAMES.map((f) => f.fileName).sort());
    for (const f of data) {
      const demo = DEMO_FRAMES.find((d) => d.fileName === f.fileName)!;
      expect({ width: f.width, height: f.height }).toEqual({ width: 480, height: 320 });
      expect(f.patch).toMatchObject({ ...DEMO_FRAME_PATCH, source: 'caller' });
      // EXIF written by the renderer, read back by the analysis (exifr).
      expect(f.exif).toMatchObject({ iso: demo.exif.iso, fNumber: 2.8 });
      expect(f.colour.cctKelvin).toEqual(expect.any(Number));
      expect(f.colour.miredOffset).toEqual(expect.any(Number));
      expect(f.exposure).toBeTruthy();
      // A flat card: the analysis finds it even, unclipped and bright enough.
      expect(f.warnings.map((w) => w.code)).not.toContain('patch-uneven');
      expect(f.warnings.map((w) => w.code)).not.toContain('patch-clipped');
      const thumb = await studio.agent.get(f.thumbnailUrl).expect(200);
      expect(thumb.headers['content-type']).toBe('image/jpeg');
    }
    // The blue card (no gel) reads cooler than sRGB white; the warmish grey of the gelled frame
    // (R > G > B) reads warmer. D65 white's CCT: IEC 61966-2-1 / CIE 15.
    const cct = (name: string) => data.find((f) => f.fileName === name)!.colour.cctKelvin!;
    expect(cct(DEMO_FRAMES[0]!.fileName)).toBeGreaterThan(D65_CCT);
    expect(cct(DEMO_FRAMES[1]!.fileName)).toBeLessThan(D65_CCT);
  });

  it('replaces a frame from an older definition, and does not bring back one the studio deleted', async () => {
    const org = studio.organizationId;
    const recorded = async (key: string) =>
      (
        (await db.query(
          `SELECT row_id FROM demo_seed_rows WHERE organization_id = $1 AND kind = 'frame' AND demo_key = $2`,
          [org, key],
        )) as { row_id: string }[]
      )[0]!.row_id;
    const [first, second, third] = keys as [string, string, string];
    const oldId = await recorded(second);
    await db.query(
      `UPDATE demo_seed_rows SET version = 'an-older-definition' WHERE organization_id = $1 AND demo_key = $2`,
      [org, second],
    );
    // The same bytes are there under the old row: the replacement takes a new row for them.
    await db.query(`UPDATE frames SET sha256 = repeat('0', 64) WHERE id = $1`, [oldId]);
    await studio.agent.delete(`/v1/frames/${await recorded(third)}`).expect(204);

    expect(await seedDemoFrames(db, t.config, org, studio.userId)).toEqual({
      [first]: 'current',
      [second]: 'replaced',
      [third]: 'left',
    });
    const listed = (await studio.agent.get('/v1/frames').expect(200)).body.data as ListedFrame[];
    expect(listed.map((f) => f.id).sort()).toEqual(
      [await recorded(first), await recorded(second)].sort(),
    );
    expect(listed.map((f) => f.id)).not.toContain(oldId);
    await studio.agent.get(`/v1/frames/${oldId}`).expect(404);
    const [audit] = (await db.query(
      `SELECT count(*)::int AS n FROM audit_events WHERE organization_id = $1 AND action = 'frame.deleted' AND target_id = $2`,
      [org, oldId],
    )) as { n: number }[];
    expect(audit!.n).toBe(1);
    expect(await objects(org)).toBe(2 * 2);
  });
});
