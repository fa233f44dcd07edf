// API keys: issue once, hash at rest, bearer auth, immediate revocation on every instance, rotation.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import {
  addMember,
  MailInbox,
  setPlan,
  signUp,
  SignedInAgent,
  startMaildev,
  tokenFromText,
  waitForMail,
} from '../factories/accounts.js';

describe('accounts: API keys', () => {
  let t: TestApp;
  let t2: TestApp; // a second instance on the same database
  let mail: MailInbox;
  let db: DataSource;
  let owner: SignedInAgent;
  const bearer = (key: string, app = t) =>
    request(app.url).get('/v1/whoami').set('Authorization', `Bearer ${key}`);
  /**
   * The other instance hears of a revocation by PostgreSQL notification (measured in tens of
   * milliseconds); the promise is 1 s. Asks it until it refuses, and says how long that took.
   */
  const refusedWithinOneSecond = async (key: string, app: TestApp) => {
    const t0 = Date.now();
    for (;;) {
      const res = await bearer(key, app);
      if (res.status === 401) return Date.now() - t0;
      expect(res.status).toBe(200);
      if (Date.now() - t0 > 1000) throw new Error('still accepted after 1 s');
      await new Promise((r) => setTimeout(r, 20));
    }
  };

  beforeAll(async () => {
    mail = await startMaildev();
    t = await bootApp({ SMTP_URL: mail.smtpUrl });
    t2 = await bootApp({ SMTP_URL: mail.smtpUrl });
    db = await openDataSource();
    owner = await signUp(t.url);
    await setPlan(owner.organizationId, 'studio'); // one member per role
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t2?.close();
    await t?.close();
    await mail?.stop();
  });

  it('creates a key whose secret appears once, in the documented format', async () => {
    const res = await owner.agent
      .post('/v1/keys')
      .send({ name: 'Booking app', environment: 'live' })
      .expect(201);
    expect(res.body).toMatchObject({ name: 'Booking app', environment: 'live', status: 'active' });
    expect(res.body.secret).toMatch(/^lw_live_[0-9A-Za-z]{12}_[0-9A-Za-z]{32}$/);
    expect(res.body.secret.startsWith(res.body.prefix + '_')).toBe(true);
    const list = await owner.agent.get('/v1/keys').expect(200);
    const row = list.body.data.find((k: { id: string }) => k.id === res.body.id);
    expect(row).toMatchObject({
      prefix: res.body.prefix,
      status: 'active',
      createdBy: { id: owner.userId },
    });
    expect(row.secret).toBeUndefined();
    expect(JSON.stringify(list.body)).not.toContain(res.body.secret.split('_')[3]);
    const one = await owner.agent.get(`/v1/keys/${res.body.id}`).expect(200);
    expect(one.body.secret).toBeUndefined();
    const who = await bearer(res.body.secret).expect(200);
    expect(who.body).toEqual({
      kind: 'api-key',
      organizationId: owner.organizationId,
      userId: null,
      role: null,
      keyId: res.body.id,
      keyMode: 'live',
    });
    const created = await waitForMail(
      mail.webUrl,
      owner.email,
      /New live API key "Booking app" created/,
    );
    expect(created.text).toContain(res.body.prefix);
    expect(created.text).not.toContain(res.body.secret);
  });

  it('stores only a SHA-256 of the secret', async () => {
    const res = await owner.agent
      .post('/v1/keys')
      .send({ name: 'hash check', environment: 'test' })
      .expect(201);
    const secretPart = res.body.secret.split('_')[3] as string;
    const [row] = await db.query(
      `SELECT row_to_json(k)::text AS j, secret_hash FROM api_keys k WHERE id = $1`,
      [res.body.id],
    );
    expect(row.j).not.toContain(secretPart);
    expect(row.secret_hash).toMatch(/^[0-9a-f]{64}$/);
    const leaks = await db.query(
      `SELECT count(*)::int AS n FROM (SELECT row_to_json(e)::text AS j FROM audit_events e) x WHERE j LIKE '%' || $1 || '%'`,
      [secretPart],
    );
    expect(leaks[0].n).toBe(0);
  });

  it('refuses bad, unknown and malformed keys with 401 problem+json and WWW-Authenticate', async () => {
    const good = await owner.agent
      .post('/v1/keys')
      .send({ name: 'tamper', environment: 'test' })
      .expect(201);
    const tampered = good.body.secret.slice(0, -1) + (good.body.secret.endsWith('A') ? 'B' : 'A');
    for (const k of [
      tampered,
      'lw_test_000000000000_00000000000000000000000000000000',
      'nonsense',
      good.body.secret.replace('lw_test_', 'lw_live_'),
    ]) {
      const res = await bearer(k).expect(401);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
      expect(res.headers['www-authenticate']).toMatch(
        /^Bearer realm="lumenwright", error="invalid_token"/,
      );
    }
  });

  it('revokes: the very next request fails on this instance, and within 1 s on another, warm caches included', async () => {
    const res = await owner.agent
      .post('/v1/keys')
      .send({ name: 'to revoke', environment: 'live' })
      .expect(201);
    // Warm both instances' caches.
    for (let i = 0; i < 3; i++) {
      await bearer(res.body.secret, t).expect(200);
      await bearer(res.body.secret, t2).expect(200);
    }
    const del = await owner.agent.delete(`/v1/keys/${res.body.id}`).expect(200);
    expect(del.body.status).toBe('revoked');
    await bearer(res.body.secret, t).expect(401);
    expect(await refusedWithinOneSecond(res.body.secret, t2)).toBeLessThanOrEqual(1000);
    const msg = await waitForMail(mail.webUrl, owner.email, /API key "to revoke" revoked/);
    expect(msg.text).toContain(res.body.prefix);
  });

  it('rotates with a caller-chosen grace period; grace 0 stops the old secret at once (within 1 s elsewhere)', async () => {
    const res = await owner.agent
      .post('/v1/keys')
      .send({ name: 'rotating', environment: 'test' })
      .expect(201);
    await bearer(res.body.secret, t2).expect(200);
    const rot = await owner.agent
      .post(`/v1/keys/${res.body.id}/rotate`)
      .send({ gracePeriodSeconds: 3600 })
      .expect(201);
    expect(rot.body.id).toBe(res.body.id);
    expect(rot.body.secret).not.toBe(res.body.secret);
    expect(rot.body.previousSecretExpiresAt).not.toBeNull();
    await bearer(res.body.secret, t2).expect(200);
    await bearer(rot.body.secret, t2).expect(200);
    const rot2 = await owner.agent
      .post(`/v1/keys/${res.body.id}/rotate`)
      .send({ gracePeriodSeconds: 0 })
      .expect(201);
    await bearer(rot.body.secret, t).expect(401);
    expect(await refusedWithinOneSecond(rot.body.secret, t2)).toBeLessThanOrEqual(1000);
    await bearer(res.body.secret, t2).expect(401);
    await bearer(rot2.body.secret, t2).expect(200);
    await owner.agent
      .post(`/v1/keys/${res.body.id}/rotate`)
      .send({ gracePeriodSeconds: 999999 })
      .expect(422);
  });

  it('honours expiry, and validates expiresAt', async () => {
    await owner.agent
      .post('/v1/keys')
      .send({ name: 'past', environment: 'test', expiresAt: '2001-01-01T00:00:00Z' })
      .expect(422);
    const bad = await owner.agent
      .post('/v1/keys')
      .send({ name: 'x', environment: 'prod' })
      .expect(422);
    expect(bad.body.errors[0].field).toBe('environment');
    const res = await owner.agent
      .post('/v1/keys')
      .send({
        name: 'short-lived',
        environment: 'test',
        expiresAt: new Date(Date.now() + 1500).toISOString(),
      })
      .expect(201);
    await bearer(res.body.secret, t).expect(200);
    await bearer(res.body.secret, t2).expect(200);
    await new Promise((r) => setTimeout(r, 1700));
    // Cached rows carry the expiry; the check is against the clock, so warm caches refuse too.
    await bearer(res.body.secret, t).expect(401);
    await bearer(res.body.secret, t2).expect(401);
    const [row] = await db.query(`SELECT expires_at FROM api_keys WHERE id = $1`, [res.body.id]);
    expect(new Date(row.expires_at).getTime()).toBeLessThan(Date.now());
    const view = await owner.agent.get(`/v1/keys/${res.body.id}`).expect(200);
    expect(view.body.status).toBe('expired');
  });

  it('records last use in batches, not per request', async () => {
    const res = await owner.agent
      .post('/v1/keys')
      .send({ name: 'used', environment: 'test' })
      .expect(201);
    await bearer(res.body.secret).expect(200);
    const [before] = await db.query(`SELECT last_used_at FROM api_keys WHERE id = $1`, [
      res.body.id,
    ]);
    expect(before.last_used_at).toBeNull();
    await new Promise((r) => setTimeout(r, 5600));
    const [after] = await db.query(`SELECT last_used_at FROM api_keys WHERE id = $1`, [
      res.body.id,
    ]);
    expect(after.last_used_at).not.toBeNull();
  }, 15000);

  it('lets developers manage only their own keys; admins manage all; photographers none', async () => {
    const invite = async (email: string) =>
      tokenFromText((await waitForMail(mail.webUrl, email, /invited/)).text);
    const dev = await addMember(t.url, owner, 'developer', invite);
    const admin = await addMember(t.url, owner, 'admin', invite);
    const photo = await addMember(t.url, owner, 'photographer', invite);
    const ownerKey = await owner.agent
      .post('/v1/keys')
      .send({ name: 'owner key', environment: 'test' })
      .expect(201);
    const devKey = await dev.agent
      .post('/v1/keys')
      .send({ name: 'dev key', environment: 'test' })
      .expect(201);
    const devList = await dev.agent.get('/v1/keys').expect(200);
    expect(devList.body.data.map((k: { id: string }) => k.id)).toEqual([devKey.body.id]);
    await dev.agent.get(`/v1/keys/${ownerKey.body.id}`).expect(404);
    await dev.agent.delete(`/v1/keys/${ownerKey.body.id}`).expect(404);
    await dev.agent.post(`/v1/keys/${ownerKey.body.id}/rotate`).send({}).expect(404);
    await bearer(ownerKey.body.secret).expect(200);
    const adminList = await admin.agent.get('/v1/keys?limit=100').expect(200);
    expect(adminList.body.data.map((k: { id: string }) => k.id)).toEqual(
      expect.arrayContaining([ownerKey.body.id, devKey.body.id]),
    );
    await admin.agent.delete(`/v1/keys/${devKey.body.id}`).expect(200);
    await bearer(devKey.body.secret).expect(401);
    await photo.agent.get('/v1/keys').expect(403);
    await photo.agent.post('/v1/keys').send({ name: 'nope', environment: 'test' }).expect(403);
    // A key never manages keys.
    await request(t.url)
      .get('/v1/keys')
      .set('Authorization', `Bearer ${ownerKey.body.secret}`)
      .expect(401);
  }, 60000);

  it('paginates with nextCursor', async () => {
    const o = await signUp(t.url);
    for (let i = 0; i < 5; i++)
      await o.agent
        .post('/v1/keys')
        .send({ name: `k${i}`, environment: 'test' })
        .expect(201);
    const p1 = await o.agent.get('/v1/keys?limit=2').expect(200);
    expect(p1.body.data).toHaveLength(2);
    const p2 = await o.agent.get(`/v1/keys?limit=2&cursor=${p1.body.nextCursor}`).expect(200);
    const p3 = await o.agent.get(`/v1/keys?limit=2&cursor=${p2.body.nextCursor}`).expect(200);
    expect(p3.body.data).toHaveLength(1);
    expect(p3.body.nextCursor).toBeNull();
    const names = [...p1.body.data, ...p2.body.data, ...p3.body.data].map(
      (k: { name: string }) => k.name,
    );
    expect(names).toEqual(['k4', 'k3', 'k2', 'k1', 'k0']);
    const bad = await o.agent.get('/v1/keys?cursor=zzz&limit=0').expect(422);
    expect(bad.body.errors.map((e: { field: string }) => e.field)).toContain('limit');
  });
});
