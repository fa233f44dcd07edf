/**
 * Nominal third-stop scales as marked on cameras and lenses, each with its exact value.
 * Marked values are rounded: "f/5.6" is 2^2.5 = 5.657, "1/60" stands for 2^-6 s (ISO 2720 /
 * ANSI PH3.49 conventions; the labels themselves are the trade's nominal series).
 */

export interface ScaleStop {
  /** The exact value (f-number, seconds or ISO speed). */
  value: number;
  /** The nominal marking, e.g. `f/5.6`, `1/60`, `2s`, `ISO 800`. */
  label: string;
  /** The marked (nominal) number, e.g. 5.6, 1/60, 800. */
  nominal: number;
  /** Index in thirds of a stop from the scale's reference (f/1, 1 s, ISO 100). */
  thirds: number;
}

const F_MARKS = [
  '1',
  '1.1',
  '1.2',
  '1.4',
  '1.6',
  '1.8',
  '2',
  '2.2',
  '2.5',
  '2.8',
  '3.2',
  '3.5',
  '4',
  '4.5',
  '5',
  '5.6',
  '6.3',
  '7.1',
  '8',
  '9',
  '10',
  '11',
  '13',
  '14',
  '16',
  '18',
  '20',
  '22',
  '25',
  '29',
  '32',
  '36',
  '40',
  '45',
  '51',
  '57',
  '64',
];

/** Aperture scale f/1 .. f/64 in thirds; exact value 2^(k/6). */
export const APERTURE_SCALE: readonly ScaleStop[] = F_MARKS.map((m, k) => ({
  value: 2 ** (k / 6),
  label: `f/${m}`,
  nominal: Number(m),
  thirds: k,
}));

// Seconds from 30 s down to 1 s, then fractions 1/1.3 .. 1/8000 (denominators).
const LONG_MARKS = [
  '30',
  '25',
  '20',
  '15',
  '13',
  '10',
  '8',
  '6',
  '5',
  '4',
  '3.2',
  '2.5',
  '2',
  '1.6',
  '1.3',
  '1',
];
const SHORT_DENOMS = [
  '1.3',
  '1.6',
  '2',
  '2.5',
  '3',
  '4',
  '5',
  '6',
  '8',
  '10',
  '13',
  '15',
  '20',
  '25',
  '30',
  '40',
  '50',
  '60',
  '80',
  '100',
  '125',
  '160',
  '200',
  '250',
  '320',
  '400',
  '500',
  '640',
  '800',
  '1000',
  '1250',
  '1600',
  '2000',
  '2500',
  '3200',
  '4000',
  '5000',
  '6400',
  '8000',
];

/** Shutter scale 30 s .. 1/8000 s in thirds; exact value 2^(-k/3), k = 0 at 1 s. */
export const SHUTTER_SCALE: readonly ScaleStop[] = [
  ...LONG_MARKS.map((m, i) => {
    const k = -(LONG_MARKS.length - 1 - i);
    return { value: 2 ** (-k / 3), label: `${m}s`, nominal: Number(m), thirds: k };
  }),
  ...SHORT_DENOMS.map((d, i) => {
    const k = i + 1;
    const label = Number(d) < 3 ? `${(1 / Number(d)).toFixed(1)}s` : `1/${d}`;
    return { value: 2 ** (-k / 3), label, nominal: 1 / Number(d), thirds: k };
  }),
];

// The ISO 12232 / ISO 5800 third-stop series from ISO 3 to 409600, the whole range the API takes
// (the 'iso-off-scale' warning still marks what lies outside the usual 50..102400).
const ISO_MARKS = [
  3, 4, 5, 6, 8, 10, 12, 16, 20, 25, 32, 40, 50, 64, 80, 100, 125, 160, 200, 250, 320, 400, 500,
  640, 800, 1000, 1250, 1600, 2000, 2500, 3200, 4000, 5000, 6400, 8000, 10000, 12800, 16000, 20000,
  25600, 32000, 40000, 51200, 64000, 80000, 102400, 128000, 160000, 204800, 256000, 320000, 409600,
];
const ISO_100_INDEX = ISO_MARKS.indexOf(100);

/** ISO scale 3 .. 409600 in thirds; exact value 100 * 2^(k/3), k = 0 at ISO 100. */
export const ISO_SCALE: readonly ScaleStop[] = ISO_MARKS.map((m, i) => {
  const k = i - ISO_100_INDEX;
  return { value: 100 * 2 ** (k / 3), label: `ISO ${m}`, nominal: m, thirds: k };
});

/** The scale stop nearest to `value` in log terms (ties go to the lower index). */
export function nearestStop(scale: readonly ScaleStop[], value: number): ScaleStop {
  let best = scale[0] as ScaleStop;
  let bestDist = Infinity;
  for (const s of scale) {
    const d = Math.abs(Math.log2(s.value / value));
    if (d < bestDist - 1e-12) {
      best = s;
      bestDist = d;
    }
  }
  return best;
}

/** Label for an arbitrary shutter time: the nominal mark if within 1/6 stop, else decimal. */
export function shutterLabel(seconds: number): string {
  const s = nearestStop(SHUTTER_SCALE, seconds);
  if (Math.abs(Math.log2(s.value / seconds)) <= 1 / 6 + 1e-9) return s.label;
  return seconds >= 1 ? `${seconds.toFixed(1)}s` : `1/${Math.round(1 / seconds)}`;
}

/** Label for an arbitrary f-number: the nominal mark if within 1/6 stop, else one decimal. */
export function apertureLabel(fNumber: number): string {
  // Below f/1 lenses are marked in hundredths (f/0.95), not on the third-stop scale.
  if (fNumber < 1 - 1e-9) return `f/${Number(fNumber.toFixed(2))}`;
  const s = nearestStop(APERTURE_SCALE, fNumber);
  if (Math.abs(2 * Math.log2(s.value / fNumber)) <= 1 / 6 + 1e-9) return s.label;
  return `f/${fNumber.toFixed(1)}`;
}
