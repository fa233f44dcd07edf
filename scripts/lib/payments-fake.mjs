// The local payments service (scripts/fakes/payments/server.mjs) as a child `node` process on
// 127.0.0.1, any free port. Fresh random API and webhook secrets per start, passed to the server
// through env; the server registers its webhook URL with the fake at boot.
// With `persist` (npm start), the fake keeps its state in `<dir>/state.json` across restarts
// (customers, subscriptions, invoices, events...); otherwise (tests) in memory only, or in an
// explicit `stateFile`.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));
const SERVER = path.resolve(here, '../fakes/payments/server.mjs');

export async function start({
  log = () => undefined,
  port = 0,
  retryBaseMs = 500,
  dir,
  persist = false,
  stateFile = persist && dir ? path.join(dir, 'state.json') : undefined,
} = {}) {
  if (stateFile) fs.mkdirSync(path.dirname(stateFile), { recursive: true });
  const secretKey = `sk_test_${randomBytes(18).toString('hex')}`;
  const webhookSecret = `whsec_${randomBytes(24).toString('base64url')}`;
  const child = spawn(process.execPath, [SERVER], {
    stdio: ['ignore', 'pipe', 'inherit'],
    env: {
      PATH: process.env.PATH,
      PORT: String(port),
      PAYMENTS_SECRET_KEY: secretKey,
      PAYMENTS_WEBHOOK_SECRET: webhookSecret,
      WEBHOOK_RETRY_BASE_MS: String(retryBaseMs),
      ...(stateFile ? { PAYMENTS_STATE_FILE: stateFile } : {}),
    },
  });
  const exited = new Promise((resolve) => child.once('exit', resolve));
  const first = await new Promise((resolve, reject) => {
    createInterface({ input: child.stdout }).once('line', resolve);
    child.once('exit', (code) => reject(new Error(`payments fake exited (${code})`)));
  });
  const url = `http://127.0.0.1:${JSON.parse(first).port}`;
  log(
    `Payments fake on ${url} (pid ${child.pid}; ${stateFile ? `state kept in ${stateFile}` : 'state in memory'})`,
  );
  return {
    env: {
      PAYMENTS_API_URL: url,
      PAYMENTS_SECRET_KEY: secretKey,
      PAYMENTS_WEBHOOK_SECRET: webhookSecret,
      PAYMENTS_REGISTER_WEBHOOK: 'true',
    },
    urls: [['payments fake', url]],
    pid: child.pid,
    stop: async () => {
      if (child.exitCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}
