// 8-bit sRGB pixel values of a CIE 1931 chromaticity, computed here from the published
// definitions and never with the analysis module's helpers (src/frames/analysis/colour.ts), so
// that an error shared by a test's renderer and the server's reader cannot pass unseen. A second,
// separately written route through chroma-js (a general-purpose colour library) cross-checks it.
import chroma from 'chroma-js';

/** CIE 1931 XYZ, white Y = 1. */
export type Xyz = [number, number, number];

/** CIE 15:2004 §7.3 (definition of chromaticity): X = xY/y, Z = (1 - x - y)Y/y. */
export function xyYToXyz(x: number, y: number, Y: number): Xyz {
  return [(x / y) * Y, Y, ((1 - x - y) / y) * Y];
}

/**
 * IEC 61966-2-1:1999 §5.3: CIE XYZ (D65 white, Y = 1) to linear sRGB with the standard's
 * four-decimal inverse matrix, then the encoding transfer function (12.92·L up to 0.0031308,
 * else 1.055·L^(1/2.4) − 0.055). Returns unrounded code values 0..255; throws outside the gamut.
 */
export function srgbOfXyz([X, Y, Z]: Xyz): [number, number, number] {
  const linear = [
    3.2406 * X - 1.5372 * Y - 0.4986 * Z,
    -0.9689 * X + 1.8758 * Y + 0.0415 * Z,
    0.0557 * X - 0.204 * Y + 1.057 * Z,
  ];
  if (linear.some((c) => c < 0 || c > 1)) {
    throw new Error(`XYZ (${X}, ${Y}, ${Z}) is outside the sRGB gamut`);
  }
  return linear.map((c) => 255 * (c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055)) as [
    number,
    number,
    number,
  ];
}

/** {@link srgbOfXyz} of chromaticity (x, y) at luminance Y. */
export function srgbOfXy(x: number, y: number, Y: number): [number, number, number] {
  return srgbOfXyz(xyYToXyz(x, y, Y));
}

/**
 * The same through chroma-js 3.2: XYZ to CIELAB here (CIE 15:2004 §8.2.1), relative to the D65
 * white chroma-js itself uses for Lab (Xn 0.95047, Zn 1.08883, ASTM E308), then chroma-js's Lab to
 * sRGB (its own full-precision matrix and transfer function). Unrounded code values 0..255.
 */
export function srgbOfXyViaChroma(x: number, y: number, Y: number): [number, number, number] {
  const [X, , Z] = xyYToXyz(x, y, Y);
  const f = (t: number) => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  const fx = f(X / 0.95047);
  const fy = f(Y);
  const fz = f(Z / 1.08883);
  return chroma.lab(116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)).rgb(false);
}

/** Integer code values with random rounding (mean preserved): `rnd` gives 0 <= r < 1. */
export function dithered(codes: readonly number[], rnd: () => number): [number, number, number] {
  return codes.map((c) => Math.max(0, Math.min(255, Math.floor(c + rnd())))) as [
    number,
    number,
    number,
  ];
}
