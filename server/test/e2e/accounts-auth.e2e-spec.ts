// Sign-up, sign-in, sessions, CSRF, throttling, password reset and e-mail change, end to end.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import {
  MailInbox,
  PASSWORD,
  signUp,
  startMaildev,
  tokenFromText,
  uniqueEmail,
  waitForMail,
} from '../factories/accounts.js';

/** The session cookie a response leaves in the browser (the last non-empty lw_session). */
const sessionCookie = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .filter((c) => /^lw_session=[^;]/.test(c))
    .pop();

describe('accounts: sign-in and sessions', () => {
  let t: TestApp;
  let mail: MailInbox;
  let db: DataSource;
  beforeAll(async () => {
    mail = await startMaildev();
    t = await bootApp({ SMTP_URL: mail.smtpUrl, PUBLIC_URL: 'http://127.0.0.1:3999' });
    db = await openDataSource();
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
    await mail?.stop();
  });

  it('signs up: user, organisation, owner role; httpOnly SameSite=Lax cookie scoped to /v1', async () => {
    const email = uniqueEmail('signup');
    const agent = request.agent(t.url);
    const res = await agent
      .post('/v1/auth/sign-up')
      .send({
        email,
        password: PASSWORD,
        name: 'Ada Lumen',
        organizationName: 'Harbour Glow Studio',
      })
      .expect(201);
    expect(res.body).toMatchObject({
      user: { email, name: 'Ada Lumen' },
      organization: { name: 'Harbour Glow Studio', planCode: 'free' },
      role: 'owner',
    });
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\/v1/);
    expect(cookie).not.toMatch(/Secure/i); // PUBLIC_URL is http here
    const me = await agent.get('/v1/me').expect(200);
    expect(me.body).toMatchObject({
      user: { email },
      organization: { id: res.body.organization.id },
      role: 'owner',
    });
    expect(me.body.permissions).toContain('billing:manage');
  });

  it('refuses a taken e-mail (409) and weak or malformed input (422 naming the field)', async () => {
    const a = await signUp(t.url);
    const dup = await request(t.url)
      .post('/v1/auth/sign-up')
      .send({ email: a.email.toUpperCase(), password: PASSWORD, name: 'X', organizationName: 'Y' })
      .expect(409);
    expect(dup.body.errors).toEqual([{ field: 'email', reason: 'is already registered' }]);
    const weak = await request(t.url)
      .post('/v1/auth/sign-up')
      .send({ email: uniqueEmail(), password: 'short', name: 'X', organizationName: 'Y' })
      .expect(422);
    expect(weak.headers['content-type']).toMatch(/problem\+json/);
    expect(weak.body.errors[0].field).toBe('password');
    const common = await request(t.url)
      .post('/v1/auth/sign-up')
      .send({ email: uniqueEmail(), password: 'password123', name: 'X', organizationName: 'Y' })
      .expect(422);
    expect(common.body.errors[0]).toEqual({
      field: 'password',
      reason: expect.stringMatching(/common/),
    });
    const bad = await request(t.url)
      .post('/v1/auth/sign-up')
      .send({ email: 'not-an-address', password: PASSWORD, organizationName: '' })
      .expect(422);
    const fields = bad.body.errors.map((e: { field: string }) => e.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'name', 'organizationName']));
    const extra = await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD, admin: true })
      .expect(422);
    expect(extra.body.errors).toEqual([{ field: 'admin', reason: expect.any(String) }]);
  });

  it('issues a new session id at sign-in, and the pre-sign-in id is worthless', async () => {
    const a = await signUp(t.url);
    const first = await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD })
      .expect(200);
    const c1 = sessionCookie(first)!.split(';')[0]!;
    // Sign in again carrying the first cookie: the id must change (no fixation).
    const second = await request(t.url)
      .post('/v1/auth/sign-in')
      .set('Cookie', c1)
      .send({ email: a.email, password: PASSWORD })
      .expect(200);
    const c2 = sessionCookie(second)!.split(';')[0]!;
    expect(c2).not.toBe(c1);
    await request(t.url).get('/v1/me').set('Cookie', c2).expect(200);
    await request(t.url).get('/v1/me').set('Cookie', c1).expect(401);
  });

  it('signs out this session, and everywhere', async () => {
    const a = await signUp(t.url);
    const other = request.agent(t.url);
    await other.post('/v1/auth/sign-in').send({ email: a.email, password: PASSWORD }).expect(200);
    await other.get('/v1/me').expect(200);
    await a.agent.post('/v1/auth/sign-out').expect(204);
    await a.agent.get('/v1/me').expect(401);
    await other.get('/v1/me').expect(200);
    const third = request.agent(t.url);
    await third.post('/v1/auth/sign-in').send({ email: a.email, password: PASSWORD }).expect(200);
    await third.post('/v1/auth/sign-out-everywhere').expect(204);
    await other.get('/v1/me').expect(401);
    await third.get('/v1/me').expect(401);
    const [{ n }] = await db.query(
      `SELECT count(*)::int AS n FROM sessions WHERE sess->>'userId' = $1`,
      [a.userId],
    );
    expect(n).toBe(0);
  });

  it('answers a wrong password and an unknown e-mail identically', async () => {
    const a = await signUp(t.url);
    const wrong = await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: 'not-the-password' })
      .expect(401);
    const unknown = await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: uniqueEmail('nobody'), password: 'not-the-password' })
      .expect(401);
    expect(wrong.body.detail).toBe(unknown.body.detail);
    expect(wrong.body.type).toBe(unknown.body.type);
  });

  it('throttles repeated failures with 429 + Retry-After, for known and unknown e-mails alike', async () => {
    const a = await signUp(t.url);
    for (const email of [a.email, uniqueEmail('ghost')]) {
      for (let i = 0; i < 5; i++) {
        await request(t.url)
          .post('/v1/auth/sign-in')
          .send({ email, password: `wrong-${i}-password` })
          .expect(401);
      }
      const res = await request(t.url)
        .post('/v1/auth/sign-in')
        .send({ email, password: 'still-wrong-pass' })
        .expect(429);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
      expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(900);
      expect(res.headers['content-type']).toMatch(/problem\+json/);
    }
    // Even the right password waits until the window ends.
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD })
      .expect(429);
  });

  it('refuses a cookie-authenticated write from a foreign Origin, but lets bearer callers through', async () => {
    const a = await signUp(t.url);
    const csrf = await a.agent
      .post('/v1/keys')
      .set('Origin', 'https://elsewhere.test')
      .send({ name: 'from a foreign page', environment: 'test' })
      .expect(403);
    expect(csrf.headers['content-type']).toMatch(/problem\+json/);
    const crossSite = await a.agent
      .post('/v1/keys')
      .set('Sec-Fetch-Site', 'cross-site')
      .send({ name: 'cross-site', environment: 'test' });
    expect(crossSite.status).toBe(403);
    const [{ n }] = await db.query(
      `SELECT count(*)::int AS n FROM api_keys WHERE organization_id = $1`,
      [a.organizationId],
    );
    expect(n).toBe(0);
    // Same origin is fine.
    const host = new URL(t.url).host;
    await a.agent
      .post('/v1/keys')
      .set('Origin', `http://${host}`)
      .send({ name: 'same origin', environment: 'test' })
      .expect(201);
    const key = await a.agent
      .post('/v1/keys')
      .send({ name: 'bearer', environment: 'test' })
      .expect(201);
    // A bearer call (no cookie) from a foreign origin is not a CSRF risk and passes.
    await request(t.url)
      .get('/v1/whoami')
      .set('Origin', 'https://elsewhere.test')
      .set('Authorization', `Bearer ${key.body.secret}`)
      .expect(200);
  });

  it('resets a password by an e-mailed single-use link; all sessions end', async () => {
    const a = await signUp(t.url);
    await request(t.url).post('/v1/auth/password-reset').send({ email: a.email }).expect(202);
    const unknown = await request(t.url)
      .post('/v1/auth/password-reset')
      .send({ email: uniqueEmail('none') })
      .expect(202);
    expect(unknown.body.message).toMatch(/If the address belongs/);
    const msg = await waitForMail(mail.webUrl, a.email, /Reset your Lumenwright password/);
    expect(msg.html).toContain('Choose a new password');
    const token = tokenFromText(msg.text);
    expect(msg.text).toContain('http://127.0.0.1:3999/reset-password?token=');
    await request(t.url)
      .post('/v1/auth/password-reset/confirm')
      .send({ token, password: 'short' })
      .expect(422);
    await request(t.url)
      .post('/v1/auth/password-reset/confirm')
      .send({ token, password: 'new-amber-gel-phrase' })
      .expect(204);
    const again = await request(t.url)
      .post('/v1/auth/password-reset/confirm')
      .send({ token, password: 'another-amber-phrase' })
      .expect(422);
    expect(again.body.errors[0].field).toBe('token');
    await a.agent.get('/v1/me').expect(401);
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD })
      .expect(401);
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: 'new-amber-gel-phrase' })
      .expect(200);
  });

  it('expires reset links', async () => {
    const a = await signUp(t.url);
    await request(t.url).post('/v1/auth/password-reset').send({ email: a.email }).expect(202);
    const msg = await waitForMail(mail.webUrl, a.email, /Reset your/);
    await db.query(
      `UPDATE user_tokens SET expires_at = now() - interval '1 second' WHERE user_id = $1`,
      [a.userId],
    );
    await request(t.url)
      .post('/v1/auth/password-reset/confirm')
      .send({ token: tokenFromText(msg.text), password: 'new-amber-gel-phrase' })
      .expect(422);
  });

  it('changes the e-mail address only after the link sent to the new address is opened', async () => {
    const a = await signUp(t.url);
    const next = uniqueEmail('moved');
    await a.agent
      .post('/v1/me/email')
      .send({ newEmail: next, password: 'wrong-password!' })
      .expect(422);
    expect((await a.agent.get('/v1/me/email').expect(200)).body).toEqual({
      email: a.email,
      pendingEmail: null,
      pendingUntil: null,
    });
    await a.agent.post('/v1/me/email').send({ newEmail: next, password: PASSWORD }).expect(202);
    expect((await a.agent.get('/v1/me').expect(200)).body.user.email).toBe(a.email);
    // The change waits for its link, and says so (24 hours to confirm).
    const waiting = (await a.agent.get('/v1/me/email').expect(200)).body;
    expect(waiting).toMatchObject({ email: a.email, pendingEmail: next });
    const hours = (Date.parse(waiting.pendingUntil) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(23.9);
    expect(hours).toBeLessThanOrEqual(24);
    const msg = await waitForMail(mail.webUrl, next, /Confirm your new Lumenwright e-mail address/);
    await request(t.url)
      .post('/v1/auth/email-change/confirm')
      .send({ token: tokenFromText(msg.text) })
      .expect(204);
    expect((await a.agent.get('/v1/me').expect(200)).body.user.email).toBe(next);
    expect((await a.agent.get('/v1/me/email').expect(200)).body).toMatchObject({
      email: next,
      pendingEmail: null,
    });
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: next, password: PASSWORD })
      .expect(200);
  });

  it('changes the password with the current one; other sessions end, this one stays', async () => {
    const a = await signUp(t.url);
    const other = request.agent(t.url);
    await other.post('/v1/auth/sign-in').send({ email: a.email, password: PASSWORD }).expect(200);
    await a.agent
      .post('/v1/me/password')
      .send({ currentPassword: 'nope-nope-nope', newPassword: 'fresh-softbox-phrase' })
      .expect(422);
    await a.agent
      .post('/v1/me/password')
      .send({ currentPassword: PASSWORD, newPassword: 'fresh-softbox-phrase' })
      .expect(204);
    await a.agent.get('/v1/me').expect(200);
    await other.get('/v1/me').expect(401);
  });

  it('stores no plaintext password, only argon2id hashes; tokens only as SHA-256', async () => {
    const a = await signUp(t.url);
    const [u] = await db.query(`SELECT password_hash FROM users WHERE id = $1`, [a.userId]);
    expect(u.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(u.password_hash).not.toContain(PASSWORD);
    const hits = await db.query(
      `SELECT count(*)::int AS n FROM (
         SELECT row_to_json(x)::text AS j FROM users x UNION ALL
         SELECT row_to_json(s)::text FROM sessions s UNION ALL
         SELECT row_to_json(t)::text FROM user_tokens t UNION ALL
         SELECT row_to_json(e)::text FROM audit_events e) all_rows
       WHERE j LIKE '%' || $1 || '%'`,
      [PASSWORD],
    );
    expect(hits[0].n).toBe(0);
    await request(t.url).post('/v1/auth/password-reset').send({ email: a.email }).expect(202);
    const msg = await waitForMail(mail.webUrl, a.email, /Reset your/);
    const token = tokenFromText(msg.text);
    const rows = await db.query(`SELECT token_hash FROM user_tokens WHERE user_id = $1`, [
      a.userId,
    ]);
    expect(rows.length).toBe(1);
    expect(rows[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(rows[0].token_hash).not.toContain(token);
  });

  it('records sign-ins and failed sign-ins with the address they came from', async () => {
    const a = await signUp(t.url);
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: 'wrong-password-1' })
      .expect(401);
    await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD })
      .expect(200);
    const page = await a.agent.get('/v1/audit').expect(200);
    const actions = page.body.data.map((e: { action: string }) => e.action);
    expect(actions).toEqual(
      expect.arrayContaining(['auth.sign_up', 'auth.sign_in_failed', 'auth.sign_in']),
    );
    const failed = page.body.data.find(
      (e: { action: string }) => e.action === 'auth.sign_in_failed',
    );
    expect(failed.ip).toBe('127.0.0.1');
    expect(failed.actor.userId).toBe(a.userId);
  });
});
