// Decoding with sharp: a small working copy for the automatic patch search, the patch itself at
// full resolution, and the thumbnail. Every sharp failure here means the file is not a readable
// image (the caller gets 422), except the pixel limit, reported as such.
import sharp from 'sharp';
import { DomainError } from '../../common/errors/domain-error.js';
import { findNeutralPatch, scaleRect } from './auto-patch.js';
import { measurePatch, type PatchStats, type Pixels, type Rect } from './patch.js';

const WORKING_SIZE = 512;
const THUMB_SIZE = 320;

export interface Decoded {
  width: number;
  height: number;
  working: Pixels;
}

const open = (buf: Buffer, maxPixels: number) =>
  sharp(buf, { limitInputPixels: maxPixels, failOn: 'truncated', sequentialRead: true });

function unreadable(e: unknown, maxPixels: number): never {
  const msg = e instanceof Error ? e.message : String(e);
  if (/pixel limit/i.test(msg)) {
    throw new DomainError('invalid_input', `The image has more than ${maxPixels} pixels.`, [
      { field: 'file', reason: `has more than ${maxPixels} pixels` },
    ]);
  }
  throw new DomainError('invalid_input', 'The file could not be decoded as an image.', [
    { field: 'file', reason: 'is corrupt or truncated' },
  ]);
}

/** Decodes the whole image once (proving it is readable) into a small upright sRGB copy. */
export async function decode(buf: Buffer, maxPixels: number): Promise<Decoded> {
  try {
    const meta = await open(buf, maxPixels).metadata();
    const swap = (meta.orientation ?? 1) >= 5;
    const { data, info } = await open(buf, maxPixels)
      .rotate()
      .resize(WORKING_SIZE, WORKING_SIZE, { fit: 'inside', withoutEnlargement: true })
      .toColourspace('srgb')
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    return {
      width: (swap ? meta.height : meta.width) ?? info.width,
      height: (swap ? meta.width : meta.height) ?? info.height,
      working: { data, width: info.width, height: info.height, channels: info.channels },
    };
  } catch (e) {
    if (e instanceof DomainError) throw e;
    unreadable(e, maxPixels);
  }
}

/** Measures `rect` (upright full-size pixels) at full resolution. */
export async function measureRect(buf: Buffer, rect: Rect, maxPixels: number): Promise<PatchStats> {
  try {
    const { data, info } = await open(buf, maxPixels)
      .rotate()
      .extract({ left: rect.x, top: rect.y, width: rect.width, height: rect.height })
      .toColourspace('srgb')
      .removeAlpha()
      .raw()
      .toBuffer({ resolveWithObject: true });
    const px = { data, width: info.width, height: info.height, channels: info.channels };
    return measurePatch(px, { x: 0, y: 0, width: info.width, height: info.height });
  } catch (e) {
    unreadable(e, maxPixels);
  }
}

/** The automatic patch in full-size coordinates, or null when nothing looks neutral. */
export function autoRect(d: Decoded): Rect | null {
  const found = findNeutralPatch(d.working);
  if (!found) return null;
  const fx = d.width / d.working.width;
  const fy = d.height / d.working.height;
  return scaleRect(found.rect, fx, fy, d.width, d.height);
}

export async function thumbnail(buf: Buffer, maxPixels: number): Promise<Buffer> {
  try {
    return await open(buf, maxPixels)
      .rotate()
      .resize(THUMB_SIZE, THUMB_SIZE, { fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 80 })
      .toBuffer();
  } catch (e) {
    unreadable(e, maxPixels);
  }
}
