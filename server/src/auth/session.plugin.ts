// Console sessions: @fastify/cookie + @fastify/session with the PostgreSQL store, and Nest's
// Origin-based CSRF protection for cookie-authenticated writes. Registered from createApp().
import fastifyCookie from '@fastify/cookie';
import fastifySession from '@fastify/session';
import type { NestFastifyApplication } from '@nestjs/platform-fastify';
import connectPgSimple from 'connect-pg-simple';
import type pg from 'pg';
import { DataSource } from 'typeorm';
import type { AppConfig } from '../config/config.js';

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
  // checking one for every such request cost ~18% of CPU in profiles. Wrap the session plugin's
  // hooks so a request with a Bearer token and no cookie skips them (req.session stays empty).
  const fastify = app.getHttpAdapter().getInstance();
  const addHook = fastify.addHook.bind(fastify) as (name: string, fn: unknown) => unknown;
  (fastify as unknown as { addHook: unknown }).addHook = (name: string, fn: unknown) =>
    addHook(name, typeof fn === 'function' ? skipForBearer(fn as HookFn) : fn);
  try {
    await registerSessionPlugin(app, config, store);
  } finally {
    (fastify as unknown as { addHook: unknown }).addHook = addHook;
  }
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

type HookFn = (
  req: { headers: Record<string, unknown>; session?: unknown },
  ...rest: unknown[]
) => unknown;

/** True for a request that authenticates with a bearer key and carries no cookie. */
export function isBearerOnly(headers: Record<string, unknown>): boolean {
  const auth = headers.authorization;
  return typeof auth === 'string' && /^Bearer\s/i.test(auth) && !headers.cookie;
}

function skipForBearer(fn: HookFn): HookFn {
  return function (this: unknown, req, ...rest) {
    if (isBearerOnly(req.headers)) {
      // Fastify hooks finish through their last argument (done) when not async.
      const done = rest[rest.length - 1];
      if (typeof done === 'function') return (done as () => void)();
      return undefined;
    }
    return fn.call(this, req, ...rest);
  };
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
