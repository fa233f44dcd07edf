// Frames test helpers: the local fakes started from their scripts/lib modules, and test images
// rendered with sharp from a known CIE chromaticity with known EXIF. The pixel values come from
// ./srgb-reference.ts (IEC 61966-2-1 and CIE 15, cross-checked with chroma-js), never from the
// analysis module's own colour helpers.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { createInterface } from 'node:readline';
import sharp from 'sharp';
import seedrandom from 'seedrandom';
import { dithered, srgbOfXy } from './srgb-reference.js';

const ROOT = path.resolve(__dirname, '../../..');

/** The part of piexifjs (no type declarations of its own) these helpers use. */
interface Piexif {
  ImageIFD: Record<string, number>;
  ExifIFD: Record<string, number>;
  dump(exif: object): string;
  insert(exifBytes: string, jpegBinary: string): string;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const piexif = require('piexifjs') as Piexif;

export interface RunningFake {
  env: Record<string, string>;
  urls: [string, string][];
  pid: number;
  stop(): Promise<void>;
}

/**
 * Starts `scripts/lib/<name>.mjs` in a child Node process (Jest runs CommonJS and cannot import
 * the ESM module itself), with `opts` passed to its start() (a fixed port, to bring a stopped fake
 * back where the server expects it). The child prints the fake's env as one JSON line and calls the fake's
 * stop() on SIGTERM; stop() here signals that one PID and waits for it to exit.
 */
export async function startFake(name: string, opts: { port?: number } = {}): Promise<RunningFake> {
  const mod = path.join(ROOT, 'scripts/lib', `${name}.mjs`);
  const args = JSON.stringify({ root: ROOT, ...opts });
  const script = `
    const f = await (await import(${JSON.stringify(mod)})).start(${args});
    process.stdout.write(JSON.stringify({ env: f.env, urls: f.urls }) + '\\n');
    process.on('SIGTERM', async () => { await f.stop(); process.exit(0); });
    setInterval(() => undefined, 1 << 30);`;
  const child: ChildProcess = spawn(process.execPath, ['--input-type=module', '-e', script], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'inherit'],
    env: { ...process.env, NODE_NO_WARNINGS: '1' },
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const line = await new Promise<string>((resolve, reject) => {
    const rl = createInterface({ input: child.stdout! });
    rl.once('line', resolve);
    child.once('exit', (code) => reject(new Error(`${name} exited early (${code})`)));
  });
  const { env, urls } = JSON.parse(line) as {
    env: Record<string, string>;
    urls: [string, string][];
  };
  return {
    env,
    urls,
    pid: child.pid!,
    stop: async () => {
      if (child.exitCode === null) process.kill(child.pid!, 'SIGTERM');
      await exited;
    },
  };
}

/** 8-bit sRGB code values of chromaticity (x, y) at luminance Y, randomly rounded (dither). */
export function srgbCodes(
  x: number,
  y: number,
  Y: number,
  rnd: () => number,
): [number, number, number] {
  return dithered(srgbOfXy(x, y, Y), rnd);
}

export interface FrameSpec {
  width?: number;
  height?: number;
  /** The patch and its CIE 1931 chromaticity and luminance. */
  patch: { x: number; y: number; width: number; height: number; cx: number; cy: number; Y: number };
  /** 'noise': saturated random 8-px cells (nothing neutral outside the patch); 'dark': near black. */
  background?: 'noise' | 'dark';
  format?: 'jpeg' | 'png';
  exif?: {
    exposureTime: [number, number];
    fNumber: [number, number];
    iso: number;
    whiteBalance: 0 | 1;
    flash: number;
    focalLength: [number, number];
  };
  seed?: number;
}

export async function renderFrame(spec: FrameSpec): Promise<Buffer> {
  const width = spec.width ?? 480;
  const height = spec.height ?? 320;
  // Deterministic, so test images are reproducible.
  const rnd = seedrandom(String(spec.seed ?? 7));
  const data = Buffer.alloc(width * height * 3);
  const cell = 8;
  const cells = new Map<number, [number, number, number]>();
  for (let row = 0; row < height; row++) {
    for (let col = 0; col < width; col++) {
      const i = (row * width + col) * 3;
      const p = spec.patch;
      let rgb: [number, number, number];
      if (col >= p.x && col < p.x + p.width && row >= p.y && row < p.y + p.height) {
        rgb = srgbCodes(p.cx, p.cy, p.Y, rnd);
      } else if (spec.background === 'dark') {
        rgb = [8, 8, 8];
      } else {
        const key = Math.floor(row / cell) * 10000 + Math.floor(col / cell);
        if (!cells.has(key)) {
          // One channel high, one low, one random: strongly coloured, never neutral.
          const order = Math.floor(rnd() * 3);
          const c: [number, number, number] = [0, 0, 0];
          c[order] = 200 + Math.floor(rnd() * 50);
          c[(order + 1) % 3] = Math.floor(rnd() * 40);
          c[(order + 2) % 3] = Math.floor(rnd() * 200);
          cells.set(key, c);
        }
        rgb = cells.get(key)!;
      }
      data[i] = rgb[0];
      data[i + 1] = rgb[1];
      data[i + 2] = rgb[2];
    }
  }
  const img = sharp(data, { raw: { width, height, channels: 3 } });
  if (spec.format === 'png') return img.png().toBuffer();
  const jpeg = await img.jpeg({ quality: 100, chromaSubsampling: '4:4:4' }).toBuffer();
  return spec.exif ? withExif(jpeg, spec.exif) : jpeg;
}

/** Writes the EXIF exposure tags into a JPEG with piexifjs. */
export function withExif(jpeg: Buffer, e: NonNullable<FrameSpec['exif']>): Buffer {
  const exif = {
    '0th': { [piexif.ImageIFD.Orientation!]: 1 },
    Exif: {
      [piexif.ExifIFD.ExposureTime!]: e.exposureTime,
      [piexif.ExifIFD.FNumber!]: e.fNumber,
      [piexif.ExifIFD.ISOSpeedRatings!]: e.iso,
      [piexif.ExifIFD.WhiteBalance!]: e.whiteBalance,
      [piexif.ExifIFD.Flash!]: e.flash,
      [piexif.ExifIFD.FocalLength!]: e.focalLength,
    },
  };
  return Buffer.from(piexif.insert(piexif.dump(exif), jpeg.toString('binary')), 'binary');
}
