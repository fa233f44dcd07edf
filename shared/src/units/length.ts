import { requireOneOf } from './validate.js';

/** Metres in one international foot (exact by definition, 1959 international yard). */
export const METRES_PER_FOOT = 0.3048;

export type LengthUnit = 'm' | 'ft';
export const LENGTH_UNITS: readonly LengthUnit[] = ['m', 'ft'];

/** Convert a length in `unit` to metres. */
export function toMetres(value: number, unit: LengthUnit): number {
  return unit === 'ft' ? value * METRES_PER_FOOT : value;
}

/** Convert metres to `unit`. */
export function fromMetres(metres: number, unit: LengthUnit): number {
  return unit === 'ft' ? metres / METRES_PER_FOOT : metres;
}

/** Validate a length-unit field; default metres. */
export function requireLengthUnit(field: string, value: unknown): LengthUnit {
  return requireOneOf(field, value, LENGTH_UNITS, 'm');
}
