// §4 security: secrets never in logs, never stored in plaintext. Runs the BUILT server
// (node server/dist/main.js) as a child process at LOG_LEVEL=debug, captures everything it
// writes, drives sign-up, sign-in, key creation, bearer calls and a password reset through it,
// then looks for each secret in the output and in every table.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import {
  startMaildev,
  tokenFromText,
  uniqueEmail,
  waitForMail,
  type MailInbox,
} from '../factories/accounts.js';
import { DEMO_BODIES } from '../factories/compute.js';
import { startServer, type ServerProcess } from '../factories/ops.js';
import { migrate, openDataSource, testDatabaseUrl } from '../setup/db.js';

describe('security: secrets in logs and at rest', () => {
  let server: ServerProcess;
  let mail: MailInbox;
  let ds: DataSource;
  const secrets: Record<string, string> = {};
  let output = '';

  beforeAll(async () => {
    await migrate();
    mail = await startMaildev();
    server = await startServer({
      DATABASE_URL: testDatabaseUrl(),
      SMTP_URL: mail.smtpUrl,
      LOG_LEVEL: 'debug',
    });
    ds = await openDataSource();

    const email = uniqueEmail('logs');
    secrets.password = 'dusk-over-the-saltings-41';
    secrets.newPassword = 'blue-hour-at-the-lock-gate-77';
    const agent = request.agent(server.url);
    const up = await agent.post('/v1/auth/sign-up').send({
      email,
      password: secrets.password,
      name: 'Log Check',
      organizationName: 'Saltings Log Studio',
    });
    expect(up.status).toBe(201);
    const cookie = String(up.headers['set-cookie']?.[0] ?? '').split(';')[0]!;
    expect(cookie).toMatch(/^lw_session=/);
    secrets.cookie = decodeURIComponent(cookie.slice('lw_session='.length));
    secrets.sessionId = secrets.cookie.split('.')[0]!;
    await request(server.url)
      .post('/v1/auth/sign-in')
      .send({ email, password: `${secrets.password}-wrong` })
      .expect(401);
    const signIn = await agent.post('/v1/auth/sign-in').send({ email, password: secrets.password });
    expect(signIn.status).toBe(200);
    secrets.cookieAfterSignIn = decodeURIComponent(
      String(signIn.headers['set-cookie']?.[0] ?? '')
        .split(';')[0]!
        .slice('lw_session='.length),
    );
    const key = await agent.post('/v1/keys').send({ name: 'log check', environment: 'test' });
    expect(key.status).toBe(201);
    secrets.key = key.body.secret;
    for (let i = 0; i < 3; i++) {
      await request(server.url)
        .post('/v1/balance')
        .set('Authorization', `Bearer ${secrets.key}`)
        .send(DEMO_BODIES.balance as object)
        .expect(200);
    }
    await request(server.url)
      .get('/v1/whoami')
      .set('Authorization', `Bearer ${secrets.key}`)
      .expect(200);
    // A refused call (logged as a warning) with a near-miss of the key.
    secrets.nearMissKey = secrets.key!.slice(0, -2) + 'zz';
    await request(server.url)
      .get('/v1/whoami')
      .set('Authorization', `Bearer ${secrets.nearMissKey}`)
      .expect(401);
    await request(server.url).post('/v1/auth/password-reset').send({ email }).expect(202);
    secrets.resetToken = tokenFromText((await waitForMail(mail.webUrl, email, /password/i)).text);
    await request(server.url)
      .post('/v1/auth/password-reset/confirm')
      .send({ token: secrets.resetToken, password: secrets.newPassword })
      .expect(204);
    await request(server.url)
      .post('/v1/auth/sign-in')
      .send({ email, password: secrets.newPassword })
      .expect(200);
    // Nest re-raises SIGTERM after its shutdown hooks: a graceful stop ends by that signal.
    expect([0, 'SIGTERM']).toContain(await server.stop());
    output = server.output();
  }, 60_000);

  afterAll(async () => {
    await server?.stop();
    await ds?.destroy();
    await mail?.stop();
  });

  it('logs every request at debug level, and no password, key secret, cookie or reset token', () => {
    // Not vacuous: the log holds the calls made above.
    for (const path of [
      '/v1/auth/sign-up',
      '/v1/auth/sign-in',
      '/v1/keys',
      '/v1/balance',
      '/v1/auth/password-reset/confirm',
    ]) {
      expect(output).toContain(path);
    }
    expect(output.split('\n').length).toBeGreaterThan(15);
    const found = Object.entries(secrets)
      .filter(([, v]) => v.length >= 16 && output.includes(v))
      .map(([k]) => k);
    expect(found).toEqual([]);
    // Nor the secret part of the key on its own.
    expect(output).not.toContain(secrets.key!.slice(-24));
  });

  it('stores no password, key secret or reset token in plaintext in any table', async () => {
    const tables: { schema: string; name: string }[] = await ds.query(
      `SELECT n.nspname AS schema, c.relname AS name FROM pg_class c
         JOIN pg_namespace n ON n.oid = c.relnamespace
        WHERE c.relkind IN ('r', 'p') AND n.nspname IN ('public', 'pgboss') AND NOT c.relispartition`,
    );
    expect(tables.length).toBeGreaterThan(10);
    const atRest = ['password', 'newPassword', 'key', 'resetToken'] as const;
    const hits: string[] = [];
    for (const t of tables) {
      for (const k of atRest) {
        const [{ n }] = await ds.query(
          `SELECT count(*)::int AS n FROM "${t.schema}"."${t.name}" x WHERE x::text LIKE '%' || $1 || '%'`,
          [secrets[k]],
        );
        if (n > 0) hits.push(`${k} in ${t.schema}.${t.name}`);
      }
    }
    expect(hits).toEqual([]);
  });
});
