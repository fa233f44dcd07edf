// Console sessions: @fastify/cookie + @fastify/session with the PostgreSQL store, and Nest's
// Origin-based CSRF protection for cookie-authenticated writes. Registered from createApp().
import fastifyCookie from '@fastify/cookie';
import fastifySession from '@fastify/session';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import connectPgSimple from 'connect-pg-simple';
import type pg from 'pg';
import { DataSource } from 'typeorm';
import type { AppConfig } from '../config/config.js';
import { isBearerOnly, scopedHooks } from '../common/http/scoped-hooks.js';

declare module 'fastify' {
  interface Session {
    userId?: string;
    organizationId?: string;
    /** Epoch ms of sign-in: sessions end 30 days after it however active they are. */
    signedInAt?: number;
  }
}

export const SESSION_COOKIE = 'lw_session';
export const SESSION_IDLE_MS = 7 * 24 * 3600 * 1000;
export const SESSION_ABSOLUTE_MS = 30 * 24 * 3600 * 1000;

export async function registerSessions(
  app: NestFastifyApplication,
  config: AppConfig,
  opts: { preview: boolean },
): Promise<void> {
  await app.register(fastifyCookie);
  if (opts.preview) return; // the spec writer has no database
  // Reuse TypeORM's pool: no second pool to size or close.
  const ds = app.get(DataSource);
  const pool = (ds.driver as unknown as { master: pg.Pool }).master;
  const PgStore = connectPgSimple(fastifySession as never);
  const store = new PgStore({
    pool,
    tableName: 'sessions',
    createTableIfMissing: false, // the Accounts migration owns the table
    pruneSessionInterval: 15 * 60,
  });
  // Bearer-key callers (the metered hot path) never use a session: creating, signing and
  // checking one for every such request cost ~18% of CPU in profiles, so the session plugin's
  // hooks skip a request with a Bearer token and no cookie (req.session stays empty).
  const fastify = app.getHttpAdapter().getInstance();
  await scopedHooks(
    fastify,
    (req) => !isBearerOnly(req),
    () => registerSessionPlugin(app, config, store),
  );
  app
    .getHttpAdapter()
    .getInstance()
    .addHook('onClose', async () => store.close());
  // Foreign-Origin (or cross-site Sec-Fetch-Site) writes are refused when they carry cookies;
  // bearer-key callers send no cookie and are let through.
  app.enableCsrfProtection({
    trustedOrigins: config.corsOrigins,
    exclude: (req: { headers: Record<string, unknown> }) => !req.headers.cookie,
  });
}

async function registerSessionPlugin(
  app: NestFastifyApplication,
  config: AppConfig,
  store: unknown,
): Promise<void> {
  await app.register(fastifySession, {
    secret: config.sessionSecret,
    cookieName: SESSION_COOKIE,
    store: store as never,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      // Only the API sees the cookie; static assets and docs stay cookie-free.
      path: '/v1',
      httpOnly: true,
      sameSite: 'lax',
      secure: config.publicUrl.startsWith('https://'),
      maxAge: SESSION_IDLE_MS,
    },
  });
}
