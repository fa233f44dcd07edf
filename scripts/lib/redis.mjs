// A throwaway Redis for tests (the shared rate-limit store, RATE_LIMIT_STORE=redis): Node
// built-ins only, like pg.mjs. Listens on 127.0.0.1 only, keeps nothing on disk, and is stopped
// by the PID it wrote at start.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const CANDIDATES = ['/usr/bin/redis-server', '/usr/local/bin/redis-server'];

/** Finds redis-server: the usual Debian path, /usr/local/bin, then PATH. */
export function findRedisBin() {
  for (const f of CANDIDATES) if (fs.existsSync(f)) return f;
  const r = spawnSync('sh', ['-c', 'command -v redis-server'], { encoding: 'utf8' });
  return r.status === 0 && r.stdout.trim() ? r.stdout.trim() : null;
}

/** Finds the binary, installing Debian's package when running as root; otherwise explains. */
export function ensureRedisBin(log = console.log) {
  let bin = findRedisBin();
  if (bin) return bin;
  const hasApt = spawnSync('sh', ['-c', 'command -v apt-get']).status === 0;
  if (isRoot && hasApt) {
    log('redis-server not found; installing Debian package "redis-server" with apt-get…');
    // RUNLEVEL=1: the package's init script must not start a system-wide Redis on port 6379.
    const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive', RUNLEVEL: '1' };
    try {
      execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
      execFileSync('apt-get', ['install', '-y', '-qq', 'redis-server'], { stdio: 'inherit', env });
    } catch (e) {
      throw new Error(`apt-get install redis-server failed: ${e.message}`, { cause: e });
    }
    bin = findRedisBin();
    if (bin) return bin;
  }
  throw new Error(
    'redis-server was not found, and it could not be installed ' +
      (isRoot ? '(apt-get is missing or did not provide it).\n' : '(not running as root).\n') +
      'Install it, e.g. on Debian/Ubuntu: sudo apt-get install -y redis-server',
  );
}

/** Resolves true once something accepts TCP connections on 127.0.0.1:port. */
function accepts(port) {
  return new Promise((resolve) => {
    const s = net.connect({ host: '127.0.0.1', port });
    s.once('connect', () => {
      s.destroy();
      resolve(true);
    });
    s.once('error', () => resolve(false));
  });
}

function alive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * A Redis handle on `dir` (created if missing) and `port`: { port, url, dir, start(), stop(),
 * pid() }. start() launches `redis-server` daemonised with no persistence (--save '',
 * --appendonly no) and waits until it accepts connections; stop() sends SIGTERM to the PID in
 * its pid file and waits for the process to exit. Both may be called again (restart on the same
 * port, as after an outage).
 */
export function redis({ dir, port, log = console.log }) {
  const pidFile = path.join(dir, 'redis.pid');
  const logFile = path.join(dir, 'redis.log');

  function pid() {
    try {
      const n = Number(fs.readFileSync(pidFile, 'utf8').trim());
      return n > 0 && alive(n) ? n : null;
    } catch {
      return null;
    }
  }

  async function start() {
    const bin = ensureRedisBin(log);
    fs.mkdirSync(dir, { recursive: true });
    if (pid()) return;
    const r = spawnSync(
      bin,
      [
        '--port',
        String(port),
        '--bind',
        '127.0.0.1',
        '--save',
        '',
        '--appendonly',
        'no',
        '--dir',
        dir,
        '--daemonize',
        'yes',
        '--pidfile',
        pidFile,
        '--logfile',
        logFile,
      ],
      { encoding: 'utf8' },
    );
    if (r.status !== 0) throw new Error(`redis-server failed to start: ${r.stderr}${r.stdout}`);
    const deadline = Date.now() + 10_000;
    while (!(pid() && (await accepts(port)))) {
      if (Date.now() > deadline) {
        const tail = safeRead(logFile).split('\n').slice(-20).join('\n');
        throw new Error(`redis-server did not listen on 127.0.0.1:${port}:\n${tail}`);
      }
      await sleep(20);
    }
  }

  async function stop() {
    const p = pid();
    if (!p) return;
    process.kill(p, 'SIGTERM');
    const deadline = Date.now() + 10_000;
    while (alive(p)) {
      if (Date.now() > deadline) {
        process.kill(p, 'SIGKILL');
        break;
      }
      await sleep(20);
    }
  }

  return { dir, port, url: `redis://127.0.0.1:${port}`, start, stop, pid };
}

function safeRead(f) {
  try {
    return fs.readFileSync(f, 'utf8');
  } catch {
    return '';
  }
}
