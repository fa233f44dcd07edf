import { clockOf } from '@lumenwright/shared';
/** Presentation helpers for playground results. No lighting math lives here. */

const MINUS = '\u2212';

/** Wall-clock "HH:MM" of an ISO 8601 local time with offset, rounded to the nearest minute. */
export function clockTime(iso: string | null | undefined): string {
  // The shared rounding (nearest minute, 24-hour), so the console and the shot sheet agree.
  return iso ? clockOf(iso) : '—';
}

/** Minutes from `from` to `to` (both ISO instants); negative when `to` is earlier. */
export function minutesBetween(from: string, to: string): number {
  return (Date.parse(to) - Date.parse(from)) / 60_000;
}

/** A signed number with a true minus sign: "+0.7", "−1.3", "0". */
export function signed(value: number, digits = 1): string {
  const rounded = Number(value.toFixed(digits));
  if (rounded === 0) return (0).toFixed(digits);
  return `${rounded > 0 ? '+' : MINUS}${Math.abs(rounded).toFixed(digits)}`;
}

/** "1.0 stop", "−2.3 stops". */
export function stops(value: number, digits = 1): string {
  const text = signed(value, digits);
  return `${text} ${Math.abs(Number(value.toFixed(digits))) === 1 ? 'stop' : 'stops'}`;
}

/** A number with fixed decimals and a true minus sign. */
export function fixed(value: number, digits = 1): string {
  const text = value.toFixed(digits);
  return text.startsWith('-') ? `${MINUS}${text.slice(1)}` : text;
}
