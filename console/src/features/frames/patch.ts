export interface Point {
  x: number;
  y: number;
}
export interface Size {
  width: number;
  height: number;
}
export interface PixelRect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * The rectangle dragged on the preview (display pixels, either corner first) in the image's own
 * pixels: scaled by natural/displayed size, clamped to the image, at least 1 × 1.
 */
export function toImageRect(a: Point, b: Point, displayed: Size, natural: Size): PixelRect {
  const sx = natural.width / displayed.width;
  const sy = natural.height / displayed.height;
  const clampX = (v: number) => Math.min(natural.width, Math.max(0, v * sx));
  const clampY = (v: number) => Math.min(natural.height, Math.max(0, v * sy));
  const left = Math.floor(Math.min(clampX(a.x), clampX(b.x)));
  const top = Math.floor(Math.min(clampY(a.y), clampY(b.y)));
  const right = Math.ceil(Math.max(clampX(a.x), clampX(b.x)));
  const bottom = Math.ceil(Math.max(clampY(a.y), clampY(b.y)));
  const x = Math.min(left, natural.width - 1);
  const y = Math.min(top, natural.height - 1);
  return {
    x,
    y,
    width: Math.max(1, Math.min(right, natural.width) - x),
    height: Math.max(1, Math.min(bottom, natural.height) - y),
  };
}

/** The image rectangle back in display pixels, to draw the selection over the preview. */
export function toDisplayRect(rect: PixelRect, displayed: Size, natural: Size): PixelRect {
  const sx = displayed.width / natural.width;
  const sy = displayed.height / natural.height;
  return { x: rect.x * sx, y: rect.y * sy, width: rect.width * sx, height: rect.height * sy };
}

export const ACCEPTED_TYPES = ['image/jpeg', 'image/png'] as const;
export const MAX_BYTES = 25 * 1024 * 1024;

/** A quick check before uploading; the server sniffs the content and has the final say. */
export function checkFile(file: { type: string; size: number }): string | null {
  if (!(ACCEPTED_TYPES as readonly string[]).includes(file.type)) {
    return 'Choose a JPEG or PNG file.';
  }
  if (file.size > MAX_BYTES) return 'The file is over 25 MB.';
  return null;
}
