// A local fake SMTP server with a web inbox (maildev), for `npm start` and the tests.
// Node built-ins only; binds 127.0.0.1 for both SMTP and the web UI. REST API: <webUrl>/api/email.
//
//   const mail = await start({ smtpPort: 0, webPort: 0 });   // 0 = pick free ports
//   mail.smtpUrl  -> smtp://127.0.0.1:<port>   (give it to the server as SMTP_URL)
//   mail.webUrl   -> http://127.0.0.1:<port>   (the inbox; messages at /api/email)
//   await mail.stop();
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { freePort, waitForHttp } from './proc.mjs';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '../..');

/** Finds maildev's entry script (its `bin` lives under dist/ in v3). */
function maildevBin() {
  const pkgDir = path.join(root, 'node_modules/maildev');
  const pkg = JSON.parse(fs.readFileSync(path.join(pkgDir, 'package.json'), 'utf8'));
  const rel = typeof pkg.bin === 'string' ? pkg.bin : pkg.bin.maildev;
  return path.join(pkgDir, rel);
}

/**
 * Starts maildev as a child process (its PID is kept; stop() ends only that process).
 * @param {{ smtpPort?: number, webPort?: number, dir?: string, log?: (line: string) => void, timeoutMs?: number }} [opts]
 *   dir: when given, messages persist there (--mail-directory) and output goes to dir/maildev.log.
 */
export async function start(opts = {}) {
  const smtpPort = opts.smtpPort || (await freePort());
  const webPort = opts.webPort || (await freePort());
  const args = [
    maildevBin(),
    '--ip',
    '127.0.0.1',
    '--web-ip',
    '127.0.0.1',
    '--smtp',
    String(smtpPort),
    '--web',
    String(webPort),
    '--silent',
  ];
  if (opts.dir) {
    fs.mkdirSync(path.join(opts.dir, 'mail'), { recursive: true });
    args.push('--mail-directory', path.join(opts.dir, 'mail'));
  }
  const out = opts.dir ? fs.openSync(path.join(opts.dir, 'maildev.log'), 'a') : 'ignore';
  const child = spawn(process.execPath, args, { stdio: ['ignore', out, out], cwd: root });
  if (typeof out === 'number') fs.closeSync(out);
  const webUrl = `http://127.0.0.1:${webPort}`;
  try {
    await waitForHttp(`${webUrl}/api/email`, opts.timeoutMs ?? 60000, child);
  } catch (e) {
    if (child.exitCode === null) child.kill('SIGTERM');
    throw e;
  }
  opts.log?.(`fake SMTP on 127.0.0.1:${smtpPort}; inbox at ${webUrl}/`);
  const pid = child.pid;
  return {
    pid,
    smtpPort,
    webPort,
    smtpUrl: `smtp://127.0.0.1:${smtpPort}`,
    webUrl,
    apiUrl: `${webUrl}/api`,
    /** Every message in the inbox (maildev's JSON). */
    async messages() {
      const res = await fetch(`${webUrl}/api/email`);
      return res.json();
    },
    async clear() {
      await fetch(`${webUrl}/api/email/all`, { method: 'DELETE' });
    },
    /** Ends the maildev process started here (by its PID), waiting for it to exit. */
    stop() {
      return new Promise((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        const timer = setTimeout(() => child.kill('SIGKILL'), 3000);
        child.once('exit', () => {
          clearTimeout(timer);
          resolve();
        });
        child.kill('SIGTERM');
      });
    },
  };
}
