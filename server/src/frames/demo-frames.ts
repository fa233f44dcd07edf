// Three invented test frames for the demo studio's winter jetty session, drawn by code (no
// photograph): a dusk sky graded from deep blue to a warm band at the horizon, dark water, a
// subject lit from camera right with a rim on the left, and a flat grey card beside them whose
// square is passed as the neutral patch. The card's tint is what differs: the key without a gel
// under a cooled white balance (blue card), with a half CTO (near neutral), and a later frame at a
// higher ISO under a darker sky. Colours are sRGB code values chosen for the look; equal R, G and
// B is neutral in sRGB (IEC 61966-2-1), which is all the analysis is expected to see in them.
import sharp from 'sharp';

type Rgb = readonly [number, number, number];

export interface DemoFrame {
  /** Stable key in demo_seed_rows. */
  key: string;
  fileName: string;
  /** The grey card's colour, and the white balance the frame was "shot" at (kelvin). */
  card: Rgb;
  cameraKelvin: number;
  /** The subject's lit skin tone. */
  skin: Rgb;
  /** Sky brightness, 1 = the first frame. */
  sky: number;
  exif: { exposureTime: string; fNumber: string; iso: number; focalLength: string };
}

export const DEMO_FRAME_SIZE = { width: 480, height: 320 } as const;
/** The grey card, in pixels: the neutral patch sent with each frame. */
export const DEMO_FRAME_PATCH = { x: 316, y: 168, width: 40, height: 32 } as const;

export const DEMO_FRAMES: DemoFrame[] = [
  {
    key: 'jetty-test-1',
    fileName: 'jetty-test-01-no-gel.jpg',
    card: [146, 160, 196],
    cameraKelvin: 3800,
    skin: [178, 164, 178],
    sky: 1,
    exif: { exposureTime: '1/125', fNumber: '28/10', iso: 800, focalLength: '85/1' },
  },
  {
    key: 'jetty-test-2',
    fileName: 'jetty-test-02-half-cto.jpg',
    card: [160, 158, 152],
    cameraKelvin: 3800,
    skin: [206, 162, 136],
    sky: 0.85,
    exif: { exposureTime: '1/125', fNumber: '28/10', iso: 1600, focalLength: '85/1' },
  },
  {
    key: 'jetty-test-3',
    fileName: 'jetty-test-03-later.jpg',
    card: [154, 153, 150],
    cameraKelvin: 3800,
    skin: [200, 158, 134],
    sky: 0.6,
    exif: { exposureTime: '1/100', fNumber: '28/10', iso: 3200, focalLength: '85/1' },
  },
];

const SKY_TOP: Rgb = [20, 32, 86];
const SKY_HORIZON: Rgb = [168, 118, 112];
const WATER: Rgb = [18, 26, 44];
const HORIZON_ROW = 200;
const SUBJECT = { cx: 214, cy: 214, rx: 52, ry: 118 };

const clamp = (v: number) => Math.max(0, Math.min(255, Math.round(v)));
const mix = (a: Rgb, b: Rgb, t: number, k = 1): Rgb => [
  (a[0] + (b[0] - a[0]) * t) * k,
  (a[1] + (b[1] - a[1]) * t) * k,
  (a[2] + (b[2] - a[2]) * t) * k,
];

function pixel(f: DemoFrame, x: number, y: number): Rgb {
  const p = DEMO_FRAME_PATCH;
  if (x >= p.x && x < p.x + p.width && y >= p.y && y < p.y + p.height) return f.card;
  const dx = (x - SUBJECT.cx) / SUBJECT.rx;
  const dy = (y - SUBJECT.cy) / SUBJECT.ry;
  const r = Math.hypot(dx, dy);
  if (r <= 1) {
    // Key from camera right: full on the right edge, about 1.5 stops down on the left.
    const lit = 0.35 + 0.65 * ((dx + 1) / 2);
    const rim = dx < 0 && r > 0.88 ? 1.25 : 1;
    const k = Math.min(lit * rim, 1.2);
    return [f.skin[0] * k, f.skin[1] * k, f.skin[2] * k];
  }
  if (y < HORIZON_ROW) return mix(SKY_TOP, SKY_HORIZON, (y / HORIZON_ROW) ** 2, f.sky);
  return mix(WATER, SKY_HORIZON, 0.08 * (1 - (y - HORIZON_ROW) / 120), f.sky);
}

/** The frame as a JPEG with its EXIF exposure tags (the same bytes on every run). */
export async function renderDemoFrame(f: DemoFrame): Promise<Buffer> {
  const { width, height } = DEMO_FRAME_SIZE;
  const data = Buffer.alloc(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const [r, g, b] = pixel(f, x, y);
      const i = (y * width + x) * 3;
      data[i] = clamp(r);
      data[i + 1] = clamp(g);
      data[i + 2] = clamp(b);
    }
  }
  return sharp(data, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 92, chromaSubsampling: '4:4:4' })
    .withExif({
      IFD0: { Orientation: '1' },
      IFD2: {
        ExposureTime: f.exif.exposureTime,
        FNumber: f.exif.fNumber,
        ISOSpeedRatings: String(f.exif.iso),
        // Manual white balance, flash fired.
        WhiteBalance: '1',
        Flash: '1',
        FocalLength: f.exif.focalLength,
      },
    })
    .toBuffer();
}
