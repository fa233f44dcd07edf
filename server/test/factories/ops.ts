// Operations test helpers (faults, scale, security): a throwaway PostgreSQL cluster of our own,
// the BUILT server as a child process (its own PID, its own logs), restartable local fakes, and a
// small load generator. Jest runs CommonJS and cannot import scripts/lib/*.mjs, so those run in
// child Node processes; every process started here is stopped by its own PID.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { createInterface } from 'node:readline';

export const ROOT = path.resolve(__dirname, '../../..');
const PG_LIB = path.join(ROOT, 'scripts/lib/pg.mjs');
const REDIS_LIB = path.join(ROOT, 'scripts/lib/redis.mjs');
export const SERVER_MAIN = path.join(ROOT, 'server/dist/main.js');
const MIGRATE_BIN = path.join(ROOT, 'server/dist/bin/migrate.js');

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls `check` until it returns a truthy value or the time is up (then throws `what`). */
export async function until<T>(what: string, check: () => Promise<T>, timeoutMs = 10_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await check().catch(() => undefined);
    if (v) return v;
    if (Date.now() > end) throw new Error(`${what}: not within ${timeoutMs} ms`);
    await sleep(50);
  }
}

// ---------------------------------------------------------------- a throwaway PostgreSQL cluster

export interface ThrowawayCluster {
  port: number;
  start(): void;
  /** pg_ctl stop -m fast: every connection is cut, as in a crash or failover. */
  stop(): void;
  createDatabase(name: string): string;
  psql(sql: string, db?: string): string;
  /** Stops the cluster and deletes its directory. */
  remove(): void;
}

/** Never the shared test cluster: a new one in a temporary directory on a free port. */
export async function throwawayCluster(): Promise<ThrowawayCluster> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-ops-pg-'));
  const port = await freePort();
  const call = (op: string, ...args: string[]) => {
    const script = `
      const m = await import(${JSON.stringify(PG_LIB)});
      const c = m.cluster({ dir: ${JSON.stringify(dir)}, port: ${port}, fast: true, log: () => undefined });
      const out = await c[${JSON.stringify(op)}](...${JSON.stringify(args)});
      process.stdout.write(JSON.stringify(out ?? null));`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], {
      encoding: 'utf8',
      timeout: 90_000,
    });
    if (r.status !== 0) throw new Error(`cluster ${op} failed: ${r.stderr}`);
    return JSON.parse(r.stdout || 'null') as unknown;
  };
  return {
    port,
    start: () => void call('start'),
    stop: () => void call('stop'),
    createDatabase: (name) => call('createDatabase', name) as string,
    psql: (sql, db = 'postgres') => call('psql', sql, db) as string,
    remove: () => {
      try {
        call('stop');
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

// ---------------------------------------------------------------- a throwaway Redis

export interface ThrowawayRedis {
  port: number;
  url: string;
  /** Starts redis-server (again, on the same port) and waits until it accepts connections. */
  start(): void;
  /** SIGTERM to its PID: every connection is cut, as in a crash or failover. */
  stop(): void;
  /** Stops it and deletes its directory. */
  remove(): void;
}

/**
 * A redis-server of our own on a free loopback port (scripts/lib/redis.mjs, which installs
 * Debian's redis-server when running as root and none is found). Fails with the installer's
 * message when it can't be had: the suites that need Redis fail rather than skip.
 */
export async function throwawayRedis(): Promise<ThrowawayRedis> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-redis-'));
  const port = await freePort();
  const call = (op: 'start' | 'stop') => {
    const script = `
      const m = await import(${JSON.stringify(REDIS_LIB)});
      await m.redis({ dir: ${JSON.stringify(dir)}, port: ${port}, log: (s) => console.error(s) })[${JSON.stringify(op)}]();`;
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], {
      encoding: 'utf8',
      timeout: 300_000, // a first run may install the package
      maxBuffer: 16 * 1024 * 1024,
    });
    if (r.status !== 0) throw new Error(`redis ${op} failed: ${r.stderr || r.error?.message}`);
  };
  return {
    port,
    url: `redis://127.0.0.1:${port}`,
    start: () => call('start'),
    stop: () => call('stop'),
    remove: () => {
      try {
        call('stop');
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}

/** Applies the migrations with the built migrate bin. */
export function migrateBuilt(databaseUrl: string): void {
  const r = spawnSync(process.execPath, [MIGRATE_BIN], {
    encoding: 'utf8',
    env: { PATH: process.env.PATH, DATABASE_URL: databaseUrl, NODE_ENV: 'test' },
    timeout: 60_000,
  });
  if (r.status !== 0) throw new Error(`migrate failed: ${r.stdout}\n${r.stderr}`);
}

// ---------------------------------------------------------------- the built server as a process

export interface ServerProcess {
  url: string;
  pid: number;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
  alive(): boolean;
  /** SIGTERM (graceful: drains and flushes usage), waits for exit; the exit code or signal. */
  stop(): Promise<number | string | null>;
}

export function assertBuilt(): void {
  if (!fs.existsSync(SERVER_MAIN)) {
    throw new Error(
      `${SERVER_MAIN} is missing: build first (npx tsc -p server/tsconfig.build.json)`,
    );
  }
}

/**
 * Starts `node server/dist/main.js` on a free loopback port with only the given environment
 * (plus PATH), and waits until /v1/health answers.
 */
export async function startServer(env: Record<string, string>): Promise<ServerProcess> {
  assertBuilt();
  const port = await freePort();
  const child: ChildProcess = spawn(process.execPath, [SERVER_MAIN], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: {
      PATH: process.env.PATH,
      NODE_ENV: 'production',
      // Every suite signs up from 127.0.0.1 into the same database: lift the per-address limit.
      SIGNUPS_PER_IP_PER_HOUR: '1000000',
      SESSION_SECRET: randomBytes(32).toString('hex'),
      LOG_LEVEL: 'warn',
      HOST: '127.0.0.1',
      PORT: String(port),
      ...env,
    },
  });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const exited = new Promise<number | string | null>((resolve) =>
    child.once('exit', (c, sig) => resolve(c ?? sig)),
  );
  const url = `http://127.0.0.1:${port}`;
  try {
    await until(
      'server health',
      async () => {
        if (child.exitCode !== null) throw new Error(`server exited (${child.exitCode}): ${out}`);
        return (await fetch(`${url}/v1/health`)).ok;
      },
      30_000,
    );
  } catch (e) {
    if (child.exitCode === null) process.kill(child.pid!, 'SIGKILL');
    throw new Error(`${(e as Error).message}\n${out}`, { cause: e });
  }
  return {
    url,
    pid: child.pid!,
    output: () => out,
    alive: () => child.exitCode === null && child.signalCode === null,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) process.kill(child.pid!, 'SIGTERM');
      const timer = setTimeout(() => {
        if (child.exitCode === null) process.kill(child.pid!, 'SIGKILL');
      }, 20_000);
      const code = await exited;
      clearTimeout(timer);
      return code;
    },
  };
}

// ---------------------------------------------------------------- restartable local fakes

export interface RestartableFake {
  env: Record<string, string>;
  info: Record<string, unknown>;
  pid: number;
  stop(): Promise<void>;
}

/**
 * Starts `scripts/lib/<name>.mjs` start(opts) in a child Node process (like factories/frames.ts,
 * but with options, so a fake can be brought back on the same port after a simulated outage).
 */
export async function startFakeWith(
  name: string,
  opts: Record<string, unknown>,
): Promise<RestartableFake> {
  const mod = path.join(ROOT, 'scripts/lib', `${name}.mjs`);
  const script = `
    const f = await (await import(${JSON.stringify(mod)})).start(${JSON.stringify(opts)});
    const { stop, messages, clear, ...info } = f;
    process.stdout.write(JSON.stringify({ env: f.env ?? {}, info }) + '\\n');
    process.on('SIGTERM', async () => { await f.stop(); process.exit(0); });
    setInterval(() => undefined, 1 << 30);`;
  const child = spawn(process.execPath, ['--input-type=module', '-e', script], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'inherit'],
    env: { ...process.env, NODE_NO_WARNINGS: '1' },
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const line = await new Promise<string>((resolve, reject) => {
    createInterface({ input: child.stdout }).once('line', resolve);
    child.once('exit', (code) => reject(new Error(`${name} exited early (${code})`)));
  });
  const parsed = JSON.parse(line) as { env: Record<string, string>; info: Record<string, unknown> };
  return {
    ...parsed,
    pid: child.pid!,
    stop: async () => {
      if (child.exitCode === null) process.kill(child.pid!, 'SIGTERM');
      await exited;
    },
  };
}

// ---------------------------------------------------------------- load

export interface CallResult {
  at: number;
  status: number;
  contentType: string;
  body: string;
  retryAfter: string | null;
}

/** POSTs a JSON body; a refused connection is recorded as status 0. */
export async function call(
  url: string,
  secret: string,
  endpoint: string,
  body: unknown,
): Promise<CallResult> {
  const at = Date.now();
  try {
    const r = await fetch(`${url}/v1/${endpoint}`, {
      method: 'POST',
      headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
      body: JSON.stringify(body),
      signal: AbortSignal.timeout(15_000),
    });
    return {
      at,
      status: r.status,
      contentType: r.headers.get('content-type') ?? '',
      body: await r.text(),
      retryAfter: r.headers.get('retry-after'),
    };
  } catch (e) {
    return { at, status: 0, contentType: '', body: String(e), retryAfter: null };
  }
}

/** Counts results by HTTP status (0 = connection refused), for the logs of load tests. */
export const tally = (rs: CallResult[]) =>
  rs.reduce<Record<number, number>>((a, r) => ({ ...a, [r.status]: (a[r.status] ?? 0) + 1 }), {});

/** GET /v1/health: its status, content type and raw body. */
export async function health(url: string) {
  const r = await fetch(`${url}/v1/health`);
  return { status: r.status, type: r.headers.get('content-type') ?? '', body: await r.text() };
}

/** `concurrency` loops calling until stop() resolves; every result is kept in order of start. */
export function load(
  url: string,
  secret: string,
  endpoint: string,
  body: unknown,
  concurrency = 8,
  pauseMs = 5,
) {
  const results: CallResult[] = [];
  let running = true;
  const loops = Array.from({ length: concurrency }, async () => {
    while (running) {
      results.push(await call(url, secret, endpoint, body));
      await sleep(pauseMs);
    }
  });
  return {
    results,
    stop: async () => {
      running = false;
      await Promise.all(loops);
      return results;
    },
  };
}

// ---------------------------------------------------------------- in-process app on a fixed port

/**
 * Like test/setup/app.ts bootApp(), but on a chosen port (PUBLIC_URL and PORT agree, so the
 * payments fake can be told where to deliver, and a restarted app is reachable at the same URL).
 * Each app checks API keys with its own strategy instance and key cache.
 */
export async function bootAppOn(port: number, env: Record<string, string> = {}) {
  const { createApp } = await import('../../src/app.factory.js');
  const { loadConfig } = await import('../../src/config/config.js');
  const { migrate } = await import('../setup/db.js');
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: process.env.TEST_DATABASE_URL!,
    LOG_LEVEL: 'silent',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    ...env,
  });
  await migrate();
  const app = await createApp(config);
  await app.listen({ port, host: '127.0.0.1' });
  await app.getHttpAdapter().getInstance().ready();
  return { app, url: `http://127.0.0.1:${port}`, close: () => app.close() };
}
