import { LightingInputError } from '../errors.js';
import { requireNumber } from '../units/validate.js';

/**
 * Correlated colour temperature from CIE 1931 xy (2° observer).
 * - Robertson 1968 (JOSA 58:1528; table as in Wyszecki & Stiles, Color Science, 2nd ed., Table
 *   1(3.11), p. 228): interpolation between isotemperature lines in CIE 1960 uv. This is the CCT
 *   reported. Its range is its table's: 600 mired (1e6/600 = 1667 K) to 0 mired (infinite
 *   temperature); outside it no CCT is given and `range` says on which side the point lies.
 * - McCamy 1992 (Color Research & Application 17:142): a fast cubic, reported alongside for
 *   comparison. Its stated accuracy (under 2 K) holds from CIE illuminant A to D65, 2856-6504 K,
 *   near the locus (as quoted in secondary sources; the paper itself not consulted here: from
 *   memory). It degrades outside: it gives about 19500 K for Kim et al.'s 25000 K locus point
 *   (locus.ts). `mccamyInRange` flags it.
 * Duv is the signed CIE 1960 uv distance from the Planckian locus (+ above, greenish); CCT is
 * only meaningful for |Duv| <= 0.05 (Ohno 2014, LEUKOS 10:47).
 */

/** The kelvin range of Robertson's table (600 to 0 mired), the range of {@link cctFromXy}. */
export const ROBERTSON_RANGE_KELVIN = { min: 1e6 / 600, max: Infinity } as const;

/** Where McCamy's cubic keeps its stated accuracy: CIE illuminant A to D65 (see above). */
export const MCCAMY_RANGE_KELVIN = { min: 2856, max: 6504 } as const;

/** Robertson's table: [reciprocal megakelvin (mired), u, v, slope t]. */
const ROBERTSON: ReadonlyArray<readonly [number, number, number, number]> = [
  [0, 0.18006, 0.26352, -0.24341],
  [10, 0.18066, 0.26589, -0.25479],
  [20, 0.18133, 0.26846, -0.26876],
  [30, 0.18208, 0.27119, -0.28539],
  [40, 0.18293, 0.27407, -0.3047],
  [50, 0.18388, 0.27709, -0.32675],
  [60, 0.18494, 0.28021, -0.35156],
  [70, 0.18611, 0.28342, -0.37915],
  [80, 0.1874, 0.28668, -0.40955],
  [90, 0.1888, 0.28997, -0.44278],
  [100, 0.19032, 0.29326, -0.47888],
  [125, 0.19462, 0.30141, -0.58204],
  [150, 0.19962, 0.30921, -0.70471],
  [175, 0.20525, 0.31647, -0.84901],
  [200, 0.21142, 0.32312, -1.0182],
  [225, 0.21807, 0.32909, -1.2168],
  [250, 0.22511, 0.33439, -1.4512],
  [275, 0.23247, 0.33904, -1.7298],
  [300, 0.2401, 0.34308, -2.0637],
  [325, 0.24792, 0.34655, -2.4681], // 0.24792 (0.24702 in some copies is a misprint)
  [350, 0.25591, 0.34951, -2.9641],
  [375, 0.264, 0.352, -3.5814],
  [400, 0.27218, 0.35407, -4.3633],
  [425, 0.28039, 0.35577, -5.3762],
  [450, 0.28863, 0.35714, -6.7262],
  [475, 0.29685, 0.35823, -8.5955],
  [500, 0.30505, 0.35907, -11.324],
  [525, 0.3132, 0.35968, -15.628],
  [550, 0.32129, 0.36011, -23.325],
  [575, 0.32931, 0.36038, -40.77],
  [600, 0.33724, 0.36051, -116.45],
];

/** CIE 1960 UCS (u, v) from CIE 1931 (x, y): u = 4x/(-2x+12y+3), v = 6y/(-2x+12y+3). */
export function xyToUv(x: number, y: number): { u: number; v: number } {
  const d = -2 * x + 12 * y + 3;
  return { u: (4 * x) / d, v: (6 * y) / d };
}

function requireXy(x: unknown, y: unknown): [number, number] {
  const xx = requireNumber('x', x, { min: 0, max: 1 });
  const yy = requireNumber('y', y, { min: 0, max: 1, exclusiveMin: true });
  if (xx + yy > 1) throw new LightingInputError('y', 'x + y must not exceed 1');
  return [xx, yy];
}

/** McCamy's cubic estimate of CCT, kelvin. n = (x - 0.3320) / (0.1858 - y). */
export function mccamyCct(x: number, y: number): number {
  const [xx, yy] = requireXy(x, y);
  if (Math.abs(0.1858 - yy) < 1e-9) throw new LightingInputError('y', 'too close to 0.1858');
  const n = (xx - 0.332) / (0.1858 - yy);
  return 449 * n ** 3 + 3525 * n ** 2 + 6823.3 * n + 5520.33;
}

export interface CctResult {
  /** Correlated colour temperature, kelvin (null when outside Robertson's table). */
  cct: number | null;
  /** Signed distance from the Planckian locus in CIE 1960 uv (+ above, greenish). */
  duv: number | null;
  method: 'Robertson 1968';
  /**
   * Where the point lies against Robertson's table ({@link ROBERTSON_RANGE_KELVIN}): 'inside';
   * 'warmer' = past its 1667 K end; 'bluer' = past its infinite-temperature end, bluer than any
   * black body. Outside, `cct`, `duv` and `mccamy` are null and `meaningful` is false.
   */
  range: 'inside' | 'warmer' | 'bluer';
  /** McCamy's estimate for comparison (null when outside Robertson's table). */
  mccamy: number | null;
  /**
   * False when Robertson's CCT is outside {@link MCCAMY_RANGE_KELVIN} (or there is none): McCamy's
   * number is then only a rough estimate.
   */
  mccamyInRange: boolean;
  /** False when |duv| > 0.05 or the point is outside the table: CCT then means little. */
  meaningful: boolean;
}

/** CCT and Duv from CIE xy by Robertson's method (with McCamy's estimate alongside). */
export function cctFromXy(x: number, y: number): CctResult {
  const [xx, yy] = requireXy(x, y);
  const { u, v } = xyToUv(xx, yy);
  let prevD = 0;
  for (let i = 0; i < ROBERTSON.length; i++) {
    const [, ui, vi, ti] = ROBERTSON[i] as readonly [number, number, number, number];
    // Signed distance from isotemperature line i: > 0 on its warm side, < 0 on its blue side.
    const d = (v - vi - ti * (u - ui)) / Math.sqrt(1 + ti * ti);
    if (i > 0 && d <= 0 !== prevD <= 0 && (d !== 0 || prevD !== 0)) {
      const [r0, u0, v0] = ROBERTSON[i - 1] as readonly [number, number, number, number];
      const [r1, u1, v1] = ROBERTSON[i] as readonly [number, number, number, number];
      const f = prevD / (prevD - d);
      const r = r0 + f * (r1 - r0);
      if (r <= 0) break; // on the infinite-temperature line itself: no finite CCT
      const uT = u0 + f * (u1 - u0);
      const vT = v0 + f * (v1 - v0);
      const duv = Math.sign(v - vT) * Math.hypot(u - uT, v - vT);
      const cct = 1e6 / r;
      const mccamy = Math.abs(0.1858 - yy) < 1e-9 ? null : mccamyCct(xx, yy);
      // The range's ends are CCTs quoted to the kelvin (A is 2856 K; Robertson gives 2855.8).
      const k = Math.round(cct);
      return {
        cct,
        duv,
        method: 'Robertson 1968',
        range: 'inside',
        mccamy,
        mccamyInRange:
          mccamy !== null && k >= MCCAMY_RANGE_KELVIN.min && k <= MCCAMY_RANGE_KELVIN.max,
        meaningful: Math.abs(duv) <= 0.05,
      };
    }
    prevD = d;
  }
  // No bracketing pair: the point is on the same side of every line. prevD is its distance from
  // the 600-mired line: > 0 is warmer than 1667 K; otherwise it is past the 0-mired end.
  return {
    cct: null,
    duv: null,
    method: 'Robertson 1968',
    range: prevD > 0 ? 'warmer' : 'bluer',
    mccamy: null,
    mccamyInRange: false,
    meaningful: false,
  };
}
