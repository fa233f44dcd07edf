#!/usr/bin/env node
// `npm start`: install if needed, start PostgreSQL and the local fakes on loopback, build,
// migrate, seed the demo, serve API + console. `npm run dev`: the same with watchers.
// Node built-ins only: this runs before dependencies are installed.
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { cluster } from './lib/pg.mjs';
import { buildAll } from './lib/build.mjs';
import { ensureInstalled, must, service, stopAll, waitForHttp } from './lib/proc.mjs';
import { startFakes } from './lib/fakes.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dev = process.argv.includes('--dev');
const env = process.env;
const PORT = Number(env.PORT ?? 3000);
const PG_PORT = Number(env.PG_PORT ?? 54329);
const dataDir = path.join(root, '.data');

const stoppers = [];
let stopping = false;

async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping…');
  await stopAll();
  for (const stop of stoppers.reverse()) {
    try {
      await stop();
    } catch (e) {
      console.error(e.message);
    }
  }
  console.log('Stopped.');
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

function secrets() {
  const file = path.join(dataDir, 'secrets.json');
  fs.mkdirSync(dataDir, { recursive: true });
  if (!fs.existsSync(file)) {
    const s = { sessionSecret: randomBytes(32).toString('hex') };
    fs.writeFileSync(file, JSON.stringify(s, null, 2), { mode: 0o600 });
  }
  return JSON.parse(fs.readFileSync(file, 'utf8'));
}

async function main() {
  const t0 = Date.now();
  await ensureInstalled(root);

  let databaseUrl = env.DATABASE_URL;
  if (!databaseUrl) {
    const pg = cluster({ dir: path.join(dataDir, 'postgres'), port: PG_PORT });
    const { created } = pg.start();
    stoppers.push(() => pg.stop());
    databaseUrl = pg.url();
    console.log(
      `PostgreSQL ${created ? 'initialised and ' : ''}running on 127.0.0.1:${PG_PORT} (data in .data/postgres)`,
    );
  } else {
    console.log('Using the database in DATABASE_URL.');
  }

  // The fakes (maildev takes a few seconds) start while we build, migrate and seed.
  // The payments fake keeps its state in .data/payments-fake/state.json: the demo's subscription
  // and invoices (seeded through it) outlive a restart.
  const fakesReady = startFakes({ root, dataDir, log: console.log, persist: true });
  stoppers.push(async () => (await fakesReady.catch(() => null))?.stop());
  const fakes = { env: {}, urls: [] };

  const serverEnv = {
    ...env,
    NODE_ENV: dev ? 'development' : 'production',
    DATABASE_URL: databaseUrl,
    PORT: String(PORT),
    HOST: '127.0.0.1',
    PUBLIC_URL: env.PUBLIC_URL ?? `http://127.0.0.1:${PORT}`,
    SESSION_SECRET: env.SESSION_SECRET ?? secrets().sessionSecret,
    CONSOLE_DIST: path.join(root, 'console', 'dist'),
    SCARF_ANALYTICS: 'false',
    ...fakes.env,
  };

  if (dev) {
    // shared must exist for the server and console to resolve it.
    await must('npm', ['run', 'build', '-w', '@lumenwright/shared', '--silent'], { cwd: root });
    await must('npm', ['run', 'build', '-w', '@lumenwright/server', '--silent'], { cwd: root });
  } else {
    const built = await buildAll(root);
    console.log(built.length ? `Built: ${built.join(', ')}` : 'Builds up to date.');
  }
  await must('node', ['server/dist/bin/migrate.js'], { cwd: root, env: serverEnv });
  // The seed stores the demo's test frames in the S3 fake: wait for the fakes first.
  Object.assign(fakes, await fakesReady);
  Object.assign(serverEnv, fakes.env);
  await must('node', ['server/dist/bin/seed.js'], { cwd: root, env: serverEnv });

  if (dev) {
    service(
      'tsc',
      'npx',
      ['tsc', '-w', '--preserveWatchOutput', '-p', 'server/tsconfig.build.json'],
      {
        cwd: root,
      },
    );
    service('server', 'node', ['--watch', 'server/dist/main.js'], { cwd: root, env: serverEnv });
    service(
      'vite',
      'node',
      ['node_modules/vite/bin/vite.js', '--host', '127.0.0.1', '--strictPort'],
      {
        cwd: path.join(root, 'console'),
        env: { ...serverEnv, PORT: String(PORT) },
      },
    );
  } else {
    const srv = service('server', 'node', ['server/dist/main.js'], { cwd: root, env: serverEnv });
    srv.child.on('exit', (code) => {
      if (!stopping) {
        console.error(`The server exited (${code}).`);
        void shutdown(1);
      }
    });
  }
  await waitForHttp(`http://127.0.0.1:${PORT}/v1/health`, 120000);

  const base = `http://127.0.0.1:${PORT}`;
  console.log(`
Lumenwright is running (${((Date.now() - t0) / 1000).toFixed(1)} s).
  Console        ${dev ? 'http://127.0.0.1:5173 (Vite, proxies the API)' : base + '/'}
  API            ${base}/v1   (health: ${base}/v1/health)
  API docs       ${base}/docs   (spec: ${base}/openapi.json)
${fakes.urls.map(([name, url]) => `  ${name.padEnd(14)} ${url}`).join('\n')}
${demoSignIns()}
Press Ctrl-C to stop everything.`);
}

function demoSignIns() {
  const file = path.join(root, 'scripts', 'demo-sign-ins.json');
  if (!fs.existsSync(file)) return '';
  const list = JSON.parse(fs.readFileSync(file, 'utf8'));
  return (
    '\nDemo sign-ins (invented studio):\n' +
    list.map((s) => `  ${s.role.padEnd(13)} ${s.email.padEnd(34)} ${s.password}`).join('\n') +
    '\n'
  );
}

main().catch(async (err) => {
  console.error(`\nnpm start failed: ${err.message}`);
  await shutdown(1);
});
