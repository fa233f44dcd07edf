// A live server for the SDK tests. When the workspace test script exports LUMENWRIGHT_TEST_URL,
// that server is used (migrated, seeded, with the local fakes). Otherwise this starts the built
// server (server/dist/main.js) on a fresh, migrated and seeded database in the local test cluster
// (.data/test-postgres, as the server's tests use; TEST_PG_DIR/TEST_PG_PORT move it) with the
// object-storage fake for test frames, and stops both afterwards. Build the server first:
// `npx tsc -p server/tsconfig.build.json`.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let child: ChildProcess | null = null;
let stopStorage: (() => Promise<void>) | null = null;

interface Fake {
  env: Record<string, string>;
  stop: () => Promise<void>;
}

async function waitForHealth(url: string, ms: number) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      const r = await fetch(`${url}/v1/health`);
      if (r.ok) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() > until) throw new Error(`server at ${url} not healthy within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export default async function setup(project: TestProject) {
  let url = process.env.LUMENWRIGHT_TEST_URL;
  if (!url) {
    const main = path.join(root, 'server/dist/main.js');
    if (!fs.existsSync(main))
      throw new Error('server/dist/main.js is missing: build the server first');
    const pg = (await import(
      path.join(root, 'scripts/lib/pg.mjs')
    )) as typeof import('../../scripts/lib/pg.mjs');
    const c = pg.cluster({
      dir: process.env.TEST_PG_DIR ?? path.join(root, '.data/test-postgres'),
      port: Number(process.env.TEST_PG_PORT ?? 54330),
      fast: true,
      log: () => undefined,
    });
    c.start();
    const databaseUrl = c.createDatabase(`lw_sdk_${Date.now().toString(36)}_${process.pid}`);
    const port = await pg.freePort();
    const s3 = (await import(path.join(root, 'scripts/lib/s3-fake.mjs'))) as {
      start: (o: { root: string }) => Promise<Fake>;
    };
    const storage = await s3.start({ root });
    stopStorage = storage.stop;
    const env = {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: databaseUrl,
      PORT: String(port),
      HOST: '127.0.0.1',
      LOG_LEVEL: 'silent',
      ...storage.env,
    };
    // The seed gives the demo studio (on a plan with uploads) that the frame tests sign in as.
    for (const bin of ['migrate', 'seed']) {
      const r = spawnSync(process.execPath, [path.join(root, `server/dist/bin/${bin}.js`)], {
        env,
        encoding: 'utf8',
      });
      if (r.status !== 0) throw new Error(`${bin} failed: ${r.stderr}`);
    }
    child = spawn(process.execPath, [main], { env, stdio: ['ignore', 'ignore', 'inherit'] });
    url = `http://127.0.0.1:${port}`;
    await waitForHealth(url, 30_000);
  }
  project.provide('baseUrl', url);
  return async () => {
    if (child?.pid) {
      child.kill('SIGTERM');
      await new Promise((r) => child!.once('exit', r));
    }
    await stopStorage?.();
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
  }
}
