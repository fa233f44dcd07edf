#!/usr/bin/env node
// `npm test`: lint, typecheck, drift checks, every workspace's tests on a throwaway PostgreSQL
// cluster, the SDK against a live server, the browser tests and the benchmark. Always stops what
// it started.
// Prints "N passed, N failed" at the end; exits non-zero on any failure.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { cluster, freePort } from './lib/pg.mjs';
import { ensureRedisBin } from './lib/redis.mjs';
import { buildAll } from './lib/build.mjs';
import { ensureInstalled, run, service, stopAll, waitForHttp } from './lib/proc.mjs';
import { startFakes } from './lib/fakes.mjs';
import { countResults } from './lib/results.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const artifacts = path.join(root, '.artifacts');
const only = process.argv.slice(2); // e.g. `npm test -- server shared`
const want = (step) => only.length === 0 || only.includes(step);

const steps = [];
const cleanups = [];
let cleaning = false;

async function cleanup() {
  if (cleaning) return;
  cleaning = true;
  await stopAll();
  for (const c of cleanups.reverse()) {
    try {
      await c();
    } catch (e) {
      console.error(`cleanup: ${e.message}`);
    }
  }
}
for (const sig of ['SIGINT', 'SIGTERM']) {
  process.on(sig, () => {
    void cleanup().then(() => process.exit(130));
  });
}

async function step(name, fn) {
  const t0 = Date.now();
  console.log(`\n━━ ${name}`);
  let result;
  try {
    result = await fn();
  } catch (e) {
    console.error(e.stack ?? e.message);
    result = { ok: false };
  }
  const secs = ((Date.now() - t0) / 1000).toFixed(1);
  steps.push({ name, secs, ...result });
  console.log(`━━ ${name}: ${result.ok ? 'ok' : 'FAILED'} (${secs} s)`);
}

async function main() {
  fs.mkdirSync(artifacts, { recursive: true });
  await ensureInstalled(root);

  const pgDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-test-pg-'));
  const pg = cluster({ dir: pgDir, port: await freePort(), fast: true, log: () => undefined });
  cleanups.push(() => fs.rmSync(pgDir, { recursive: true, force: true }));
  cleanups.push(() => pg.stop());
  pg.start();
  console.log(`Test PostgreSQL on 127.0.0.1:${pg.port} (${pgDir})`);

  await step('build', async () => ({
    ok: (await buildAll(root, { force: !!process.env.CI }), true),
  }));

  if (want('lint'))
    await step('lint', async () => ({
      ok: (await run('npm', ['run', 'lint', '--silent'], { cwd: root })) === 0,
    }));
  if (want('typecheck'))
    await step('typecheck', async () => ({
      ok: (await run('npm', ['run', 'typecheck', '--silent'], { cwd: root })) === 0,
    }));
  if (want('drift')) await step('spec and SDK drift', () => driftCheck());

  if (want('shared')) await step('shared (vitest)', () => vitest('shared'));
  if (want('server'))
    await step('server (jest)', async () => {
      // The Redis suites start redis-server themselves; install it up front (as root, when
      // missing) so that is not counted against a test's timeout. If it can't be had, those
      // suites fail with this message and the others still run.
      try {
        ensureRedisBin();
      } catch (e) {
        console.error(e.message);
      }
      const out = path.join(artifacts, 'server-jest.json');
      const code = await run('npx', ['jest', '--runInBand', '--json', `--outputFile=${out}`], {
        cwd: path.join(root, 'server'),
        env: {
          ...process.env,
          TEST_DATABASE_URL: pg.createDatabase('lw_server_tests'),
          CI: 'true',
        },
      });
      return { ok: code === 0, ...countResults(out, 'jest') };
    });
  if (want('console')) await step('console (vitest)', () => vitest('console'));

  if (want('sdk') || want('browser')) {
    const live = await liveServer(pg);
    if (want('sdk'))
      await step('sdk against a live server (vitest)', () =>
        vitest('sdk', { LUMENWRIGHT_TEST_URL: live.url }),
      );
    if (want('browser') && fs.existsSync(path.join(root, 'console', 'e2e'))) {
      await step('browser (playwright + chromium)', async () => {
        await ensureChromium();
        const out = path.join(artifacts, 'browser.json');
        const code = await run(
          'npx',
          [
            'vitest',
            'run',
            '--config',
            'e2e/vitest.config.ts',
            '--reporter=default',
            '--reporter=json',
            `--outputFile=${out}`,
          ],
          {
            cwd: path.join(root, 'console'),
            env: {
              ...process.env,
              LUMENWRIGHT_TEST_URL: live.url,
              ...live.env,
              ARTIFACTS_DIR: path.join(artifacts, 'browser'),
            },
          },
        );
        return { ok: code === 0, ...countResults(out, 'vitest') };
      });
    }
  }

  // Last, on a quiet machine: the benchmark (reported, not a speed gate; it fails only when a
  // usage event is lost or a call is refused). Its figures are the README's performance table.
  if (want('bench'))
    await step('benchmark (autocannon)', async () => {
      const out = path.join(artifacts, 'bench.json');
      const code = await run('node', ['scripts/bench.mjs'], {
        cwd: root,
        env: {
          ...process.env,
          BENCH_SECONDS: process.env.BENCH_SECONDS ?? '10',
          BENCH_OUTPUT: out,
        },
      });
      return { ok: code === 0, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 };
    });

  await cleanup();
  report();
}

async function vitest(ws, env = {}) {
  const out = path.join(artifacts, `${ws}-vitest.json`);
  const code = await run(
    'npx',
    ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile=${out}`],
    {
      cwd: path.join(root, ws),
      env: { ...process.env, ...env },
    },
  );
  return { ok: code === 0, ...countResults(out, 'vitest') };
}

/** Regenerates the spec and the SDK types into temp files and compares with the committed ones. */
async function driftCheck() {
  const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-drift-'));
  try {
    const spec = path.join(tmp, 'openapi.json');
    if ((await run('node', ['server/dist/bin/write-openapi.js', spec], { cwd: root })) !== 0)
      return { ok: false };
    const committed = path.join(root, 'openapi', 'openapi.json');
    let ok = true;
    if (
      !fs.existsSync(committed) ||
      fs.readFileSync(committed, 'utf8') !== fs.readFileSync(spec, 'utf8')
    ) {
      console.error(
        'openapi/openapi.json is out of date: run `npm run openapi` and commit the result.',
      );
      ok = false;
    }
    const schema = path.join(root, 'sdk', 'src', 'generated', 'schema.ts');
    if (fs.existsSync(schema)) {
      const gen = path.join(tmp, 'schema.ts');
      // The SDK's own generator (openapi-typescript plus the Blob transform for binary parts).
      const a = await run('node', ['scripts/generate.mjs', committed, gen], {
        cwd: path.join(root, 'sdk'),
      });
      const b = await run(
        'npx',
        [
          'prettier',
          '--write',
          gen,
          '--log-level=warn',
          '--config',
          path.join(root, '.prettierrc.json'),
        ],
        { cwd: root },
      );
      if (a !== 0 || b !== 0 || fs.readFileSync(gen, 'utf8') !== fs.readFileSync(schema, 'utf8')) {
        console.error(
          'sdk/src/generated/schema.ts is out of date: run `npm run openapi` and commit the result.',
        );
        ok = false;
      }
    }
    console.log(ok ? 'spec and SDK types match the code' : '');
    return { ok, passed: ok ? 1 : 0, failed: ok ? 0 : 1 };
  } finally {
    fs.rmSync(tmp, { recursive: true, force: true });
  }
}

/** A production server on a free port with its own database, migrated and seeded. */
async function liveServer(pg) {
  const port = await freePort();
  const fakes = await startFakes({
    root,
    dataDir: fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-fakes-')),
    log: () => undefined,
  });
  cleanups.push(() => fakes.stop());
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: pg.createDatabase('lw_live_tests'),
    PORT: String(port),
    HOST: '127.0.0.1',
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    SESSION_SECRET: 'test-session-secret-'.padEnd(48, 'x'),
    CONSOLE_DIST: path.join(root, 'console', 'dist'),
    LOG_LEVEL: 'warn',
    SIGNUPS_PER_IP_PER_HOUR: '1000000', // every test signs up from 127.0.0.1
    ...fakes.env,
  };
  for (const bin of ['migrate', 'seed']) {
    if ((await run('node', [`server/dist/bin/${bin}.js`], { cwd: root, env })) !== 0)
      throw new Error(`${bin} failed`);
  }
  service('server', 'node', ['server/dist/main.js'], { cwd: root, env });
  const url = `http://127.0.0.1:${port}`;
  await waitForHttp(`${url}/v1/health`, 60000);
  return { url, env: fakes.env };
}

async function ensureChromium() {
  if (fs.existsSync('/usr/bin/chromium')) return;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot) throw new Error('chromium is not installed: sudo apt-get install -y chromium');
  await run('apt-get', ['update', '-qq']);
  const code = await run('apt-get', ['install', '-y', '-qq', 'chromium'], {
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
  if (code !== 0) throw new Error('apt-get install chromium failed');
}

function report() {
  let passed = 0;
  let failed = 0;
  console.log('\n━━ Summary');
  for (const s of steps) {
    const counts = s.passed !== undefined ? ` ${s.passed} passed, ${s.failed} failed` : '';
    console.log(
      `  ${s.ok ? 'ok  ' : 'FAIL'} ${s.name.padEnd(40)} ${s.secs.padStart(6)} s${counts}`,
    );
    passed += s.passed ?? (s.ok ? 1 : 0);
    // A failed step with no failed test (a crash, a lint error) still counts as one failure.
    failed += Math.max(s.failed ?? 0, s.ok ? 0 : 1);
  }
  console.log(`\n${passed} passed, ${failed} failed`);
  process.exitCode = steps.every((s) => s.ok) ? 0 : 1;
}

main().catch(async (err) => {
  console.error(err.stack ?? err.message);
  await cleanup();
  process.exit(1);
});
