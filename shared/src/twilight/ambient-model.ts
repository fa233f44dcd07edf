/**
 * Incident ambient light from the sun's altitude: the USNO Circular No. 171 model
 * (Janiczek & DeYoung 1987), horizontal illuminance in lux under a clear sky.
 */

/** Sky conditions and the divisor the circular applies to the clear-sky value. */
export type SkyCondition = 'clear' | 'partly-cloudy' | 'overcast';
export const SKY_CONDITIONS: readonly SkyCondition[] = ['clear', 'partly-cloudy', 'overcast'];

const SKY_DIVISOR: Record<SkyCondition, number> = {
  clear: 1,
  'partly-cloudy': 3, // "average cloud", USNO Circular 171
  overcast: 10, // "dark overcast", USNO Circular 171
};

/**
 * Stated model uncertainty in stops. Clear: the model against observed clear-sky ranges is a
 * factor of 2 (AMS Glossary of Meteorology, "twilight"). Cloud: common practice, no source —
 * real cloud cover varies far more than the circular's fixed divisors.
 */
export const MODEL_UNCERTAINTY_STOPS: Record<SkyCondition, number> = {
  clear: 1,
  'partly-cloudy': 1.5,
  overcast: 2,
};

/**
 * Starlight + airglow, lux (REFERENCES: ~0.0005 lx): the least the sky gives. The circular's
 * last band already ends at about this level at -18°, so the floor is a minimum, not an addition.
 */
export const NIGHT_SKY_FLOOR_LUX = 0.0005;

/** Incident-light meter calibration constant C for a flat receptor (ISO 2720:1974). */
export const INCIDENT_CONSTANT_FLAT = 250;

/** [lower altitude bound (exclusive), L0, L1, L2, L3]; log10 E = L0 + L1 x + L2 x^2 + L3 x^3. */
const BANDS: ReadonlyArray<readonly [number, number, number, number, number]> = [
  [20, 3.74, 3.97, -4.07, 1.47],
  [5, 3.05, 13.28, -45.98, 64.33],
  [-0.8, 2.88, 22.26, -207.64, 1034.3],
  [-5, 2.88, 21.81, -258.11, -858.36],
  [-12, 2.7, 12.17, -431.69, -1899.83],
  [-18, 13.84, 262.72, 1447.42, 2797.93],
];

/**
 * Clear-sky horizontal illuminance from the sun (lux) at geometric altitude `altitudeDeg`
 * (-90..90), USNO Circular 171 polynomial in x = altitude / 90; 0 below -18°.
 */
export function sunIlluminanceClearLux(altitudeDeg: number): number {
  const x = altitudeDeg / 90;
  for (const [lower, l0, l1, l2, l3] of BANDS) {
    if (altitudeDeg > lower) return 10 ** (l0 + x * (l1 + x * (l2 + x * l3)));
  }
  return 0;
}

/** Ambient illuminance (lux) under `sky`, never below the night-sky floor. */
export function ambientIlluminanceLux(altitudeDeg: number, sky: SkyCondition): number {
  return Math.max(sunIlluminanceClearLux(altitudeDeg) / SKY_DIVISOR[sky], NIGHT_SKY_FLOOR_LUX);
}

/** Incident EV at ISO 100: log2(E * 100 / C), C = 250 (ISO 2720), i.e. log2(E / 2.5). */
export function ev100FromLux(lux: number): number {
  return Math.log2((lux * 100) / INCIDENT_CONSTANT_FLAT);
}

/** Inverse of {@link ev100FromLux}: lux for an incident EV100. */
export function luxFromEv100(ev100: number): number {
  return (2 ** ev100 * INCIDENT_CONSTANT_FLAT) / 100;
}
