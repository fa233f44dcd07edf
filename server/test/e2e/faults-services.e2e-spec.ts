// §2 faults of the services around the database: the S3 fake and the payments fake going down
// and (where it matters) coming back on the same port. SMTP: faults-mail.e2e-spec.ts.
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { buyer, eventually, fakeApi } from '../factories/billing.js';
import { renderFrame, type RunningFake } from '../factories/frames.js';
import {
  bootAppOn,
  freePort,
  sleep,
  startFakeWith,
  type RestartableFake,
} from '../factories/ops.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

const PATCH = { x: 160, y: 100, width: 160, height: 120 };
const D65 = { cx: 0.31271, cy: 0.32902 }; // CIE 15:2004 Table T.3

describe('faults: object storage and payments down', () => {
  const ports = { s3: 0 };
  const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-faults-s3-'));
  let s3fake: RestartableFake;
  let pay: RestartableFake;
  let t: TestApp;
  let ds: DataSource;
  let owner: SignedInAgent;

  beforeAll(async () => {
    ports.s3 = await freePort();
    s3fake = await startFakeWith('s3-fake', { dir: s3Dir, port: ports.s3 });
    pay = await startFakeWith('payments-fake', { retryBaseMs: 250 });
    t = await bootApp({ ...s3fake.env, ...pay.env });
    ds = await openDataSource();
    owner = await signUp(t.url, { organizationName: 'Lanternfield Faults Studio' });
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      owner.organizationId,
    ]);
  }, 60_000);

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
    await s3fake?.stop();
    await pay?.stop();
    fs.rmSync(s3Dir, { recursive: true, force: true });
  });

  const s3 = () =>
    new S3Client({
      endpoint: s3fake.env.S3_ENDPOINT,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
  const objectsOf = async (orgId: string) => {
    const c = s3();
    try {
      const out = await c.send(
        new ListObjectsV2Command({ Bucket: s3fake.env.S3_BUCKET, Prefix: `frames/${orgId}/` }),
      );
      return (out.Contents ?? []).map((o) => o.Key!).sort();
    } finally {
      c.destroy();
    }
  };
  const frameRows = async (orgId: string) =>
    Number(
      (
        await ds.query(`SELECT count(*)::int AS n FROM frames WHERE organization_id = $1`, [orgId])
      )[0].n,
    );
  const upload = async (name: string) =>
    owner.agent
      .post('/v1/frames')
      .attach('file', await renderFrame({ patch: { ...PATCH, ...D65, Y: 0.3 } }), name)
      .field('patchX', String(PATCH.x))
      .field('patchY', String(PATCH.y))
      .field('patchWidth', String(PATCH.width))
      .field('patchHeight', String(PATCH.height));

  it('S3 down: uploads answer 503 problem+json and nothing is half-written; uploads work once it returns', async () => {
    const first = await upload('before.jpg');
    expect(first.status).toBe(201);
    const objectsBefore = await objectsOf(owner.organizationId);
    expect(objectsBefore).toHaveLength(2); // original + thumbnail
    await s3fake.stop();
    const down = await upload('during.jpg');
    expect(down.status).toBe(503);
    expect(down.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(down.body.type).toBe('https://lumenwright.test/problems/unavailable');
    expect(await frameRows(owner.organizationId)).toBe(1);
    s3fake = await startFakeWith('s3-fake', { dir: s3Dir, port: ports.s3 });
    expect(await objectsOf(owner.organizationId)).toEqual(objectsBefore);
    const after = await upload('after.jpg');
    expect(after.status).toBe(201);
    expect(await frameRows(owner.organizationId)).toBe(2);
  }, 60_000);

  it('S3 up but the row is refused after both objects are stored: the objects are removed (503)', async () => {
    const before = await objectsOf(owner.organizationId);
    const rows = await frameRows(owner.organizationId);
    // A trigger that refuses this one file name stands in for the database failing at the end.
    await ds.query(`CREATE OR REPLACE FUNCTION ops_refuse_frame() RETURNS trigger AS $$
      BEGIN RAISE EXCEPTION 'refused by the faults test'; END $$ LANGUAGE plpgsql`);
    await ds.query(`CREATE TRIGGER ops_refuse_frame BEFORE INSERT ON frames FOR EACH ROW
      WHEN (NEW.file_name = 'refused-row.jpg') EXECUTE FUNCTION ops_refuse_frame()`);
    try {
      const res = await upload('refused-row.jpg');
      expect(res.status).toBe(503);
      expect(res.body.detail).toMatch(/nothing was kept/);
    } finally {
      await ds.query(`DROP TRIGGER IF EXISTS ops_refuse_frame ON frames`);
      await ds.query(`DROP FUNCTION IF EXISTS ops_refuse_frame()`);
    }
    expect(await frameRows(owner.organizationId)).toBe(rows);
    expect(await objectsOf(owner.organizationId)).toEqual(before);
  });

  it('webhooks the payments service retries (our server was down) are processed once', async () => {
    const port = await freePort();
    const env = { ...pay.env, SESSION_SECRET: randomBytes(32).toString('hex') };
    let b = await bootAppOn(port, env);
    const buyerOrg = await signUp(b.url, { organizationName: 'Quayside Retry Studio' });
    const checkout = await buyerOrg.agent
      .post('/v1/billing/checkout')
      .send({ planCode: 'studio' })
      .expect(201);
    await b.close(); // the webhook endpoint is now unreachable
    try {
      const approved = await buyer(checkout.body.url, 'approve');
      expect(approved.status).toBe(303);
      await sleep(600); // at least two failed attempts (back-off 250, 500 ms)
      b = await bootAppOn(port, env);
      await eventually(async () => {
        const r = await ds.query(`SELECT plan_code FROM organizations WHERE id = $1`, [
          buyerOrg.organizationId,
        ]);
        return r[0]?.plan_code === 'studio';
      }, 20_000);
      const events = (await fakeApi(pay as unknown as RunningFake, 'GET', '/_fake/events'))
        .data as {
        id: string;
        type: string;
        deliveries: { endpoint: string; attempts: number; delivered: boolean }[];
      }[];
      const ours = events.filter((e) =>
        e.deliveries.some((d) => d.endpoint === `${b.url}/v1/billing/webhooks`),
      );
      await eventually(async () => {
        const ev = (await fakeApi(pay as unknown as RunningFake, 'GET', '/_fake/events')).data as {
          deliveries: { delivered: boolean }[];
        }[];
        return ev.every((e) => e.deliveries.every((d) => d.delivered));
      }, 20_000);
      const retried = ours.filter((e) => e.deliveries.some((d) => d.attempts >= 2));
      expect(retried.map((e) => e.type)).toContain('checkout.session.completed');
      const ids = ours.map((e) => e.id);
      const rows: { id: string }[] = await ds.query(
        `SELECT id FROM billing_events WHERE id = ANY($1)`,
        [ids],
      );
      expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort()); // each exactly once (pk)
      // The same event delivered again, twice at once (a retry racing a slow first attempt).
      const completed = ours.find((e) => e.type === 'checkout.session.completed')!;
      await Promise.all([
        fakeApi(pay as unknown as RunningFake, 'POST', `/_fake/events/${completed.id}/resend`),
        fakeApi(pay as unknown as RunningFake, 'POST', `/_fake/events/${completed.id}/resend`),
      ]);
      const [{ n }] = await ds.query(
        `SELECT count(*)::int AS n FROM billing_events WHERE id = $1`,
        [completed.id],
      );
      expect(n).toBe(1);
      const subs = await ds.query(
        `SELECT count(*)::int AS n FROM billing_subscriptions WHERE organization_id = $1`,
        [buyerOrg.organizationId],
      );
      expect(subs[0].n).toBe(1);
    } finally {
      await b.close();
    }
  }, 60_000);

  it('payments service down: checkout answers a clear 503 problem naming the payments service', async () => {
    await pay.stop();
    const res = await owner.agent.post('/v1/billing/checkout').send({ planCode: 'platform' });
    console.log(
      `checkout with the payments service down: ${res.status} ${JSON.stringify(res.body)}`,
    );
    expect(res.status).toBe(503);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.type).toBe('https://lumenwright.test/problems/unavailable');
    expect(res.body.detail).toMatch(/payment/i);
    // Nothing recorded for a checkout that never started.
    const open = await ds.query(
      `SELECT count(*)::int AS n FROM billing_checkouts WHERE organization_id = $1 AND plan_code = 'platform'`,
      [owner.organizationId],
    );
    expect(open[0].n).toBe(0);
  }, 30_000);
});
