// Child-process helpers for the start and test scripts (Node built-ins only).
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

const children = new Set();

/** Runs a command to completion, streaming its output; resolves with the exit code. */
export function run(cmd, args, opts = {}) {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', ...opts });
    children.add(child);
    child.on('exit', (code, signal) => {
      children.delete(child);
      resolve(code ?? (signal ? 128 : 1));
    });
    child.on('error', (err) => {
      children.delete(child);
      console.error(`${cmd}: ${err.message}`);
      resolve(127);
    });
  });
}

/** Runs a command and throws when it fails. */
export async function must(cmd, args, opts = {}) {
  const code = await run(cmd, args, opts);
  if (code !== 0) throw new Error(`${[cmd, ...args].join(' ')} exited with ${code}`);
}

/** Starts a long-running process; returns {child, stop()}. */
export function service(name, cmd, args, opts = {}) {
  const child = spawn(cmd, args, { stdio: 'inherit', ...opts });
  children.add(child);
  child.on('exit', () => children.delete(child));
  return {
    name,
    child,
    pid: child.pid,
    stop: (timeoutMs = 10000) => stopChild(child, timeoutMs),
  };
}

export function stopChild(child, timeoutMs = 10000) {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    const timer = setTimeout(() => {
      try {
        child.kill('SIGKILL');
      } catch {
        /* already gone */
      }
    }, timeoutMs);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    try {
      child.kill('SIGTERM');
    } catch {
      clearTimeout(timer);
      resolve();
    }
  });
}

/** Stops every child this process started and is still tracking. */
export async function stopAll() {
  await Promise.all([...children].map((c) => stopChild(c)));
}

/** Polls a URL until it answers 2xx or the timeout passes (or `child`, if given, exits). */
export async function waitForHttp(url, timeoutMs = 60000, child = null) {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < deadline) {
    if (child && child.exitCode !== null) {
      throw new Error(`the process serving ${url} exited early (code ${child.exitCode})`);
    }
    try {
      const res = await fetch(url);
      if (res.ok) return true;
      last = `HTTP ${res.status}`;
    } catch (e) {
      last = e.message;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not become ready in ${timeoutMs} ms (${last})`);
}

/** npm ci when node_modules is missing or older than package-lock.json. */
export async function ensureInstalled(root) {
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  const lock = path.join(root, 'package-lock.json');
  const stale = !fs.existsSync(marker) || fs.statSync(marker).mtimeMs < fs.statSync(lock).mtimeMs;
  if (!stale) return false;
  console.log('Installing dependencies (npm ci)…');
  await must('npm', ['ci', '--no-audit', '--no-fund'], {
    cwd: root,
    env: { ...process.env, SCARF_ANALYTICS: 'false' },
  });
  return true;
}

/** Asks the OS for a free loopback port. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address();
      srv.close(() => resolve(port));
    });
  });
}
