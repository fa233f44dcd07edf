// Production builds that skip a workspace whose inputs haven't changed since its last build.
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { must } from './proc.mjs';

const ORDER = [
  {
    name: 'shared',
    inputs: ['src', 'package.json', 'tsconfig.json', 'tsconfig.build.json'],
    out: 'dist',
  },
  {
    name: 'server',
    inputs: ['src', 'package.json', 'tsconfig.json', 'tsconfig.build.json'],
    out: 'dist',
    after: ['shared'],
  },
  {
    name: 'sdk',
    inputs: ['src', 'package.json', 'tsconfig.json', 'tsconfig.build.json'],
    out: 'dist',
  },
  {
    name: 'console',
    inputs: ['src', 'index.html', 'public', 'package.json', 'tsconfig.json', 'vite.config.ts'],
    out: 'dist',
    after: ['shared', 'sdk'],
  },
];

function walk(dir, acc) {
  if (!fs.existsSync(dir)) return;
  const st = fs.statSync(dir);
  if (st.isFile()) {
    acc.push(`${dir}:${st.size}:${st.mtimeMs}`);
    return;
  }
  for (const e of fs.readdirSync(dir).sort()) {
    if (e === 'node_modules' || e === 'dist') continue;
    walk(path.join(dir, e), acc);
  }
}

function fingerprint(root, ws, upstream) {
  const acc = [];
  for (const i of ws.inputs) walk(path.join(root, ws.name, i), acc);
  acc.push(...upstream);
  return createHash('sha256').update(acc.join('\n')).digest('hex');
}

/** Builds every workspace that changed; returns the names built. */
export async function buildAll(root, { force = false, log = console.log } = {}) {
  const stampFile = path.join(root, '.data', 'build-stamps.json');
  const stamps = fs.existsSync(stampFile) ? JSON.parse(fs.readFileSync(stampFile, 'utf8')) : {};
  const prints = {};
  const built = [];
  for (const ws of ORDER) {
    if (!fs.existsSync(path.join(root, ws.name, 'package.json'))) continue;
    const fp = fingerprint(
      root,
      ws,
      (ws.after ?? []).map((a) => prints[a] ?? ''),
    );
    prints[ws.name] = fp;
    const hasOut = fs.existsSync(path.join(root, ws.name, ws.out));
    if (!force && hasOut && stamps[ws.name] === fp) continue;
    log(`Building ${ws.name}…`);
    await must('npm', ['run', 'build', '-w', `@lumenwright/${ws.name}`, '--silent'], { cwd: root });
    stamps[ws.name] = fp;
    built.push(ws.name);
    fs.mkdirSync(path.dirname(stampFile), { recursive: true });
    fs.writeFileSync(stampFile, JSON.stringify(stamps, null, 2));
  }
  return built;
}
