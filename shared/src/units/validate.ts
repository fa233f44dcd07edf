import { LightingInputError } from '../errors.js';

/** Bounds for a numeric input; both ends inclusive unless `exclusiveMin` is set. */
export interface NumberRange {
  min?: number;
  max?: number;
  exclusiveMin?: boolean;
  integer?: boolean;
}

/** "between 0.7 and 128", "at least 0", "more than 0 and at most 8": words, not operators. */
function describe(range: NumberRange): string {
  const { min, max, exclusiveMin } = range;
  if (min !== undefined && max !== undefined && !exclusiveMin) return `between ${min} and ${max}`;
  const lo = min === undefined ? '' : `${exclusiveMin ? 'more than' : 'at least'} ${min}`;
  const hi = max === undefined ? '' : `at most ${max}`;
  return [lo, hi].filter(Boolean).join(' and ');
}

/** A finite number within `range`, or a LightingInputError naming `field`. */
export function requireNumber(field: string, value: unknown, range: NumberRange = {}): number {
  if (value === undefined || value === null) throw new LightingInputError(field, 'is required');
  if (typeof value !== 'number') throw new LightingInputError(field, 'must be a number');
  if (!Number.isFinite(value)) throw new LightingInputError(field, 'must be a finite number');
  const tooLow =
    range.min !== undefined && (range.exclusiveMin ? value <= range.min : value < range.min);
  const tooHigh = range.max !== undefined && value > range.max;
  if (tooLow || tooHigh) throw new LightingInputError(field, `must be ${describe(range)}`);
  if (range.integer && !Number.isInteger(value)) {
    throw new LightingInputError(field, 'must be an integer');
  }
  return value;
}

/** Like {@link requireNumber}, but `undefined`/`null` give `fallback`. */
export function optionalNumber(
  field: string,
  value: unknown,
  fallback: number,
  range: NumberRange = {},
): number {
  return value === undefined || value === null ? fallback : requireNumber(field, value, range);
}

/** Like {@link requireNumber}, but `undefined`/`null` give `undefined`. */
export function maybeNumber(
  field: string,
  value: unknown,
  range: NumberRange = {},
): number | undefined {
  return value === undefined || value === null ? undefined : requireNumber(field, value, range);
}

/** One of the allowed string values (or `fallback` when absent). */
export function requireOneOf<T extends string>(
  field: string,
  value: unknown,
  allowed: readonly T[],
  fallback?: T,
): T {
  if ((value === undefined || value === null) && fallback !== undefined) return fallback;
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new LightingInputError(field, `must be one of ${allowed.join(', ')}`);
  }
  return value as T;
}

/** A plain object (the single input of every exported function). */
export function requireObject(field: string, value: unknown): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new LightingInputError(field, 'must be an object');
  }
  return value as Record<string, unknown>;
}

/** Optional boolean. */
export function optionalBoolean(field: string, value: unknown, fallback: boolean): boolean {
  if (value === undefined || value === null) return fallback;
  if (typeof value !== 'boolean') throw new LightingInputError(field, 'must be true or false');
  return value;
}

/** Non-empty string of at most `maxLength` characters. */
export function requireString(field: string, value: unknown, maxLength = 100): string {
  if (typeof value !== 'string' || value.trim() === '' || value.length > maxLength) {
    throw new LightingInputError(field, `must be a non-empty string of at most ${maxLength} chars`);
  }
  return value;
}

/** An array of at most `maxItems` entries. */
export function requireArray(field: string, value: unknown, maxItems: number): unknown[] {
  if (!Array.isArray(value)) throw new LightingInputError(field, 'must be an array');
  if (value.length > maxItems) {
    throw new LightingInputError(field, `must have at most ${maxItems} entries`);
  }
  return value;
}
