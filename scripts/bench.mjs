#!/usr/bin/env node
// `npm run bench`: POST /v1/balance on a production server (authentication, limits and metering on)
// against a bare node:http baseline doing the same computation, measured with autocannon on
// loopback; plain-Fastify and plain-NestJS baselines (same computation) show how much of the gap
// is the frameworks' floor. Each server's CPU time per call is read from /proc, which a busy
// machine disturbs less than req/s. Last line:
// `bench: <r> req/s, p99 <ms> ms, <ratio> of bare node, <n> usage events lost`.
import { fork } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { cluster, freePort } from './lib/pg.mjs';
import { buildAll } from './lib/build.mjs';
import { ensureInstalled, must, service, stopAll, waitForHttp } from './lib/proc.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const DURATION = Number(process.env.BENCH_SECONDS ?? 15);
// Each server's measurement is split into rounds taken in turn (rotating the order), so a change
// in the machine's load during the run falls on all three alike instead of on one.
const ROUNDS = Math.max(1, Number(process.env.BENCH_ROUNDS ?? 3));
const KEYS = Number(process.env.BENCH_KEYS_COUNT ?? 4);
const BODY = JSON.stringify({ cameraKelvin: 3200, flashKelvin: 5500, maxGels: 3 });

const cleanups = [];
async function cleanup() {
  await stopAll();
  for (const c of cleanups.reverse()) await c();
}

async function api(base, method, p, body, headers = {}) {
  const res = await fetch(base + p, {
    method,
    headers: { 'content-type': 'application/json', origin: base, ...headers },
    body: body ? JSON.stringify(body) : undefined,
  });
  const text = await res.text();
  if (!res.ok) throw new Error(`${method} ${p} → ${res.status} ${text}`);
  return { res, json: text ? JSON.parse(text) : null };
}

/** CPU seconds (user + system) a process has used so far, from /proc/<pid>/stat; null elsewhere. */
function cpuSeconds(pid) {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100; // utime, stime in USER_HZ ticks
  } catch {
    return null;
  }
}

/** One measured slice: autocannon's result plus the server's CPU µs per answered call. */
async function measure(target, keys, duration) {
  const before = cpuSeconds(target.pid);
  const result = await cannon(target.url, keys, duration);
  const after = cpuSeconds(target.pid);
  result.cpuMicros =
    before === null || after === null || result.requests.total === 0
      ? null
      : ((after - before) * 1e6) / result.requests.total;
  return result;
}

async function cannon(url, keys, duration = DURATION) {
  const { default: autocannon } = await import('autocannon');
  let i = 0;
  return new Promise((resolve, reject) => {
    const inst = autocannon(
      {
        url,
        connections: CONNECTIONS,
        duration,
        requests: [
          {
            method: 'POST',
            path: '/v1/balance',
            setupRequest: (req) => ({
              ...req,
              headers: {
                'content-type': 'application/json',
                authorization: `Bearer ${keys[i++ % keys.length]}`,
              },
              body: BODY,
            }),
          },
        ],
      },
      (err, result) => (err ? reject(err) : resolve(result)),
    );
    void inst;
  });
}

/**
 * Rounds of one server, combined: req/s over all rounds, median p50, worst round's p99, median
 * CPU µs per call.
 */
function summary(name, rounds) {
  const seconds = rounds.reduce((a, r) => a + r.duration, 0);
  const rps = rounds.reduce((a, r) => a + r.requests.total, 0) / seconds;
  const ok = rounds.reduce((a, r) => a + r['2xx'], 0);
  const non2xx = rounds.reduce((a, r) => a + r.non2xx, 0);
  const errors = rounds.reduce((a, r) => a + r.errors, 0);
  const p50s = rounds.map((r) => r.latency.p50).sort((a, b) => a - b);
  const p50 = p50s[Math.floor(p50s.length / 2)];
  const p99 = Math.max(...rounds.map((r) => r.latency.p99));
  const perRound = rounds.map((r) => r.requests.average.toFixed(0)).join(' / ');
  const cpus = rounds
    .map((r) => r.cpuMicros)
    .filter((c) => c !== null)
    .sort((a, b) => a - b);
  const cpuMicros = cpus.length ? cpus[Math.floor(cpus.length / 2)] : null;
  const cpuText = cpuMicros === null ? 'n/a' : cpuMicros.toFixed(1);
  console.log(
    `${name.padEnd(22)} ${rps.toFixed(0).padStart(7)} req/s  p50 ${String(p50).padStart(4)} ms  p99 ${String(p99).padStart(4)} ms  CPU ${cpuText.padStart(6)} µs/call  2xx ${ok}  non-2xx ${non2xx}  errors ${errors}  (rounds: ${perRound} req/s)`,
  );
  return { rps, p50, p99, cpuMicros, ok, non2xx, rounds: rounds.map((r) => r.requests.average) };
}

async function main() {
  await ensureInstalled(root);
  await buildAll(root);
  const pgDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lumenwright-bench-pg-'));
  const pg = cluster({ dir: pgDir, port: await freePort(), log: () => undefined });
  cleanups.push(() => fs.rmSync(pgDir, { recursive: true, force: true }));
  cleanups.push(() => pg.stop());
  pg.start();
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env = {
    ...process.env,
    NODE_ENV: 'production',
    DATABASE_URL: pg.url(),
    PORT: String(port),
    HOST: '127.0.0.1',
    PUBLIC_URL: base,
    SESSION_SECRET: 'bench-session-secret-'.padEnd(48, 'x'),
    LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
    SIGNUPS_PER_IP_PER_HOUR: '1000000', // every test signs up from 127.0.0.1
  };
  await must('node', ['server/dist/bin/migrate.js'], { cwd: root, env });
  const server = service(
    'server',
    'node',
    [...(process.env.BENCH_NODE_ARGS ?? '').split(' ').filter(Boolean), 'server/dist/main.js'],
    {
      cwd: root,
      env,
      stdio: ['ignore', 'ignore', 'inherit'],
    },
  );
  await waitForHttp(`${base}/v1/health`);

  // A studio on the top plan with a few live keys (the plan's per-key rate is above what we send).
  const email = `bench-${Date.now()}@bench.test`;
  const signUp = await api(base, 'POST', '/v1/auth/sign-up', {
    email,
    password: 'bench-password-long-enough-1',
    name: 'Bench Runner',
    organizationName: 'Bench Studio',
  });
  const cookie = (signUp.res.headers.getSetCookie?.() ?? []).map((c) => c.split(';')[0]).join('; ');
  const orgId = signUp.json.organization?.id;
  pg.psql(`UPDATE organizations SET plan_code = 'platform' WHERE id = '${orgId}'`, 'lumenwright');
  const keys = [];
  for (let k = 0; k < KEYS; k++) {
    const { json } = await api(
      base,
      'POST',
      '/v1/keys',
      { name: `bench ${k}`, environment: 'live' },
      { cookie },
    );
    keys.push(json.secret);
  }

  const baseline = async (script) => {
    const child = fork(path.join(root, 'server/bench', script), [String(await freePort())], {
      env: { ...process.env, BENCH_KEYS: keys.join(',') },
      stdio: 'ignore',
    });
    cleanups.push(
      () =>
        new Promise((r) =>
          child.exitCode !== null ? r() : (child.once('exit', r), child.kill('SIGTERM')),
        ),
    );
    const { port: p } = await new Promise((r) => child.once('message', r));
    return { url: `http://127.0.0.1:${p}`, pid: child.pid };
  };
  const ours = { url: base, pid: server.pid };
  const bare = await baseline('bare.mjs');
  const plainFastify = await baseline('fastify.mjs');
  const plainNest = await baseline('nest.mjs');

  console.log(
    `\n${os.cpus().length} cores (${os.cpus()[0]?.model ?? 'unknown'}), Node ${process.version}, ${CONNECTIONS} connections, ${DURATION} s each in ${ROUNDS} rounds taken in turn\n`,
  );
  const warm = await cannon(base, keys); // warm-up: not in the figures, but its usage rows count
  const targets = [ours, bare, plainFastify, plainNest];
  // the baselines get a short warm-up too
  for (const t of targets.slice(1)) await cannon(t.url, keys, Math.min(DURATION, 3));
  const results = targets.map(() => []);
  const slice = Math.max(1, Math.round(DURATION / ROUNDS));
  for (let round = 0; round < ROUNDS; round++) {
    for (let k = 0; k < targets.length; k++) {
      const t = (round + k) % targets.length; // rotate who goes first
      results[t].push(await measure(targets[t], keys, slice));
    }
  }
  const lw = summary('Lumenwright /v1/balance', results[0]);
  const bareR = summary('bare node:http', results[1]);
  const fastifyR = summary('plain Fastify', results[2]);
  const nestR = summary('plain NestJS (Fastify)', results[3]);

  // Metering is batched: give the writer time to flush, then compare rows with 2xx answers.
  await new Promise((r) => setTimeout(r, 2000));
  const rows = Number(
    pg.psql(
      `SELECT count(*) FROM usage_events WHERE endpoint = 'balance' AND status BETWEEN 200 AND 299`,
      'lumenwright',
    ),
  );
  const answered = warm['2xx'] + lw.ok;
  const lost = Math.max(0, answered - rows);
  const ratio = lw.rps / bareR.rps;
  console.log(
    `\nusage rows with a 2xx status: ${rows}; 2xx answered (warm-up + measured): ${answered}`,
  );
  const result = {
    at: new Date().toISOString(),
    machine: `${os.cpus().length} × ${os.cpus()[0]?.model ?? 'unknown'}, Node ${process.version}`,
    connections: CONNECTIONS,
    seconds: DURATION,
    rounds: ROUNDS,
    lumenwright: lw,
    bare: bareR,
    fastify: fastifyR,
    ratio,
    nest: nestR,
    fastifyRatio: fastifyR.rps / bareR.rps,
    nestRatio: nestR.rps / bareR.rps,
    usageRows: rows,
    answered,
    lost,
  };
  if (process.env.BENCH_OUTPUT)
    fs.writeFileSync(process.env.BENCH_OUTPUT, JSON.stringify(result, null, 2));
  // Speed is reported, not enforced; lost usage or refused calls are failures.
  console.log(
    `plain Fastify: ${(fastifyR.rps / bareR.rps).toFixed(2)} of bare node; plain NestJS on Fastify: ${(nestR.rps / bareR.rps).toFixed(2)} (the frameworks' floor)`,
  );
  if (lw.cpuMicros !== null && bareR.cpuMicros !== null && nestR.cpuMicros !== null)
    console.log(
      `CPU per call: ours ${lw.cpuMicros.toFixed(1)} µs = plain NestJS ${nestR.cpuMicros.toFixed(1)} + ${(lw.cpuMicros - nestR.cpuMicros).toFixed(1)} µs of ours (bare node ${bareR.cpuMicros.toFixed(1)} µs)`,
    );
  if ([lw, bareR, fastifyR, nestR].some((r) => r.non2xx > 0) || lost > 0) process.exitCode = 1;
  console.log(
    `bench: ${lw.rps.toFixed(0)} req/s, p99 ${lw.p99} ms, ${ratio.toFixed(2)} of bare node, ${lost} usage events lost`,
  );
}

main()
  .catch((e) => {
    console.error(e.stack ?? e.message);
    process.exitCode = 1;
  })
  .finally(() => cleanup());
