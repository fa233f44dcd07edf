// sRGB code values → linear RGB → CIE XYZ → CIE xy, exactly as IEC 61966-2-1:1999 (sRGB) defines
// them: the piecewise transfer function and the 4-decimal RGB→XYZ matrix for the D65 white.

/** Undo the sRGB transfer function: code value 0..1 → linear 0..1 (IEC 61966-2-1 §5.2). */
export function srgbToLinear(c: number): number {
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Apply the sRGB transfer function: linear 0..1 → code value 0..1. */
export function linearToSrgb(c: number): number {
  return c <= 0.0031308 ? 12.92 * c : 1.055 * c ** (1 / 2.4) - 0.055;
}

export interface Xyz {
  X: number;
  Y: number;
  Z: number;
}

/** Linear sRGB → CIE 1931 XYZ (Y = 1 for white), IEC 61966-2-1 matrix. */
export function linearRgbToXyz(r: number, g: number, b: number): Xyz {
  return {
    X: 0.4124 * r + 0.3576 * g + 0.1805 * b,
    Y: 0.2126 * r + 0.7152 * g + 0.0722 * b,
    Z: 0.0193 * r + 0.1192 * g + 0.9505 * b,
  };
}

/** CIE 1931 XYZ → linear sRGB (the standard's inverse matrix); may leave 0..1 (out of gamut). */
export function xyzToLinearRgb({ X, Y, Z }: Xyz): [number, number, number] {
  return [
    3.2406 * X - 1.5372 * Y - 0.4986 * Z,
    -0.9689 * X + 1.8758 * Y + 0.0415 * Z,
    0.0557 * X - 0.204 * Y + 1.057 * Z,
  ];
}

/** Chromaticity x = X/(X+Y+Z), y = Y/(X+Y+Z); null for black. */
export function xyzToXy({ X, Y, Z }: Xyz): { x: number; y: number } | null {
  const s = X + Y + Z;
  if (!(s > 1e-9)) return null;
  return { x: X / s, y: Y / s };
}

/** XYZ of chromaticity (x, y) at luminance Y. */
export function xyToXyz(x: number, y: number, Y: number): Xyz {
  return { X: (x / y) * Y, Y, Z: ((1 - x - y) / y) * Y };
}
