import { requireNumber } from '../units/validate.js';

/**
 * Planckian locus in CIE 1931 xy by the cubic-spline approximation of Kim et al. (2002,
 * J. Korean Physical Society 41:865; citation from memory), 1667..25000 K; within about 0.0006 of tabulated locus points.
 */
export function planckianXy(kelvin: number): { x: number; y: number } {
  const t = requireNumber('kelvin', kelvin, { min: 1667, max: 25000 });
  const x =
    t <= 4000
      ? -0.2661239e9 / t ** 3 - 0.2343589e6 / t ** 2 + 0.8776956e3 / t + 0.17991
      : -3.0258469e9 / t ** 3 + 2.1070379e6 / t ** 2 + 0.2226347e3 / t + 0.24039;
  let y: number;
  if (t <= 2222) y = -1.1063814 * x ** 3 - 1.3481102 * x ** 2 + 2.18555832 * x - 0.20219683;
  else if (t <= 4000) y = -0.9549476 * x ** 3 - 1.37418593 * x ** 2 + 2.09137015 * x - 0.16748867;
  else y = 3.081758 * x ** 3 - 5.8733867 * x ** 2 + 3.75112997 * x - 0.37001483;
  return { x, y };
}

/**
 * CIE daylight locus (CIE 15:2004), 4000..25000 K: chromaticity of the D-series illuminant
 * with correlated colour temperature `kelvin`.
 */
export function daylightXy(kelvin: number): { x: number; y: number } {
  const t = requireNumber('kelvin', kelvin, { min: 4000, max: 25000 });
  const x =
    t <= 7000
      ? -4.607e9 / t ** 3 + 2.9678e6 / t ** 2 + 0.09911e3 / t + 0.244063
      : -2.0064e9 / t ** 3 + 1.9018e6 / t ** 2 + 0.24748e3 / t + 0.23704;
  return { x, y: -3 * x * x + 2.87 * x - 0.275 };
}
