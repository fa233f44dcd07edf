// The exposure settings a test frame was shot with, read by exifr (EXIF 2.32 tag meanings).
import exifr from 'exifr';

export interface FrameExif {
  exposureTime: number | null;
  fNumber: number | null;
  iso: number | null;
  /** EXIF WhiteBalance: 0 = auto, 1 = manual. */
  whiteBalance: 'auto' | 'manual' | null;
  /** EXIF Flash bit 0. */
  flashFired: boolean | null;
  focalLengthMm: number | null;
}

const TAGS = ['ExposureTime', 'FNumber', 'ISO', 'WhiteBalance', 'Flash', 'FocalLength'];

const positive = (v: unknown): number | null =>
  typeof v === 'number' && Number.isFinite(v) && v > 0 ? v : null;

/** Missing or unreadable EXIF is not an error: every field is then null. */
export async function readExif(buf: Buffer): Promise<FrameExif> {
  let raw: Record<string, unknown>;
  try {
    raw = ((await exifr.parse(buf, { pick: TAGS, translateValues: false })) ?? {}) as Record<
      string,
      unknown
    >;
  } catch {
    raw = {};
  }
  const iso = Array.isArray(raw.ISO) ? raw.ISO[0] : raw.ISO;
  const wb = raw.WhiteBalance;
  return {
    exposureTime: positive(raw.ExposureTime),
    fNumber: positive(raw.FNumber),
    iso: positive(iso),
    whiteBalance: wb === 0 ? 'auto' : wb === 1 ? 'manual' : null,
    flashFired: typeof raw.Flash === 'number' ? (raw.Flash & 1) === 1 : null,
    focalLengthMm: positive(raw.FocalLength),
  };
}
