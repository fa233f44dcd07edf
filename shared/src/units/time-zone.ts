import { LightingInputError } from '../errors.js';

const MS_PER_MINUTE = 60_000;
/** Cache size cap: names come from callers, so an unbounded map could be grown at will. */
const CACHE_LIMIT = 1024;
const formatters = new Map<string, Intl.DateTimeFormat>();
const canonicalNames = new Map<string, string>();

function newFormatter(timeZone: string): Intl.DateTimeFormat {
  return new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: 'numeric',
    day: 'numeric',
    hour: 'numeric',
    minute: 'numeric',
    second: 'numeric',
  });
}

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = newFormatter(timeZone);
    if (formatters.size < CACHE_LIMIT) formatters.set(timeZone, f);
  }
  return f;
}

/** The example zone name refusals give. */
export const TIME_ZONE_EXAMPLE = 'Europe/Zurich';
const NEEDS_IANA = `must be an IANA time zone name such as ${TIME_ZONE_EXAMPLE}`;
/** "+02:00", "-0530", "UTC+2", "GMT-03:00": a fixed offset, not a zone (no daylight saving). */
const OFFSET_LIKE = /^(?:UTC|GMT|Z)?\s*[+\-\u2212]\s*\d{1,2}(?::?\d{2})?$/i;
/** Each part of a name spelled the IANA way starts with a capital then a small letter. */
const IANA_CASED = /^[A-Z][a-z][^/]*(?:\/[A-Z][a-z][^/]*)*$/;

/**
 * The name to answer with for a zone the runtime accepts. Intl matches names without regard to
 * case and reports its canonical spelling (`europe/zurich` → `Europe/Zurich`). For some IANA
 * names ICU's canonical ID is an older link (on Node 20 `Asia/Kolkata` → `Asia/Calcutta`,
 * `Europe/Kyiv` → `Europe/Kiev`): a name the caller spelled the IANA way is then kept as sent,
 * and only a mis-cased one (no capitals, say) takes Intl's spelling.
 */
function canonicalName(value: string, resolved: string): string {
  if (resolved.toLowerCase() === value.toLowerCase()) return resolved;
  return IANA_CASED.test(value) ? value : resolved;
}

/**
 * Validate an IANA time-zone name (e.g. `Europe/London`, `Asia/Kathmandu`) via Intl and return
 * its canonical spelling (see {@link canonicalName}). Fixed UTC offsets (`+02:00`) are refused:
 * a zone name follows the place's daylight-saving changes, an offset does not.
 */
export function requireTimeZone(field: string, value: unknown): string {
  if (typeof value !== 'string' || value.length === 0 || value.length > 64) {
    throw new LightingInputError(field, NEEDS_IANA);
  }
  const known = canonicalNames.get(value);
  if (known !== undefined) return known;
  if (OFFSET_LIKE.test(value.trim())) {
    throw new LightingInputError(
      field,
      `is a UTC offset ("${value}"); it ${NEEDS_IANA}, which follows the place's daylight-saving changes`,
    );
  }
  let resolved: string;
  try {
    resolved = newFormatter(value).resolvedOptions().timeZone;
  } catch {
    throw new LightingInputError(field, `"${value}" is not a known time zone; it ${NEEDS_IANA}`);
  }
  const name = canonicalName(value, resolved);
  if (canonicalNames.size < CACHE_LIMIT) canonicalNames.set(value, name);
  return name;
}

/**
 * UTC offset in whole minutes of `timeZone` at the instant `epochMs` (DST-aware, from the
 * runtime's time-zone database). Positive east of Greenwich, e.g. +345 for Asia/Kathmandu.
 */
export function offsetMinutes(epochMs: number, timeZone: string): number {
  const whole = Math.floor(epochMs / 1000) * 1000;
  const p: Record<string, number> = {};
  for (const part of formatterFor(timeZone).formatToParts(whole)) {
    if (part.type !== 'literal') p[part.type] = Number(part.value);
  }
  const asUtc = Date.UTC(p.year ?? 0, (p.month ?? 1) - 1, p.day, p.hour, p.minute, p.second);
  return Math.round((asUtc - whole) / MS_PER_MINUTE);
}

const pad = (n: number, width = 2): string => String(n).padStart(width, '0');

/**
 * ISO 8601 local time with offset, to the second: `2026-06-21T21:09:24+01:00`.
 * Pass `knownOffset` (minutes) to skip the time-zone lookup when the caller already has it.
 */
export function toLocalIso(epochMs: number, timeZone: string, knownOffset?: number): string {
  const rounded = Math.round(epochMs / 1000) * 1000;
  const offset = knownOffset ?? offsetMinutes(rounded, timeZone);
  const local = new Date(rounded + offset * MS_PER_MINUTE);
  const sign = offset < 0 ? '-' : '+';
  const abs = Math.abs(offset);
  return (
    `${pad(local.getUTCFullYear(), 4)}-${pad(local.getUTCMonth() + 1)}-${pad(local.getUTCDate())}` +
    `T${pad(local.getUTCHours())}:${pad(local.getUTCMinutes())}:${pad(local.getUTCSeconds())}` +
    `${sign}${pad(Math.floor(abs / 60))}:${pad(abs % 60)}`
  );
}

/** Calendar date parts of a validated `YYYY-MM-DD`. */
export interface CalendarDate {
  year: number;
  month: number;
  day: number;
}

/** Validate a `YYYY-MM-DD` calendar date between 1900 and 2100 (suncalc's ΔT fit range). */
export function requireDate(field: string, value: unknown): CalendarDate {
  const m = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value) : null;
  if (!m) throw new LightingInputError(field, 'must be a date as YYYY-MM-DD');
  const [year, month, day] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const probe = new Date(Date.UTC(year, month - 1, day));
  if (probe.getUTCMonth() !== month - 1 || probe.getUTCDate() !== day) {
    throw new LightingInputError(field, 'is not a real calendar date');
  }
  if (year < 1900 || year > 2100) {
    throw new LightingInputError(field, 'year must be between 1900 and 2100');
  }
  return { year, month, day };
}

/** The UTC instant of a local wall-clock time on `date` in `timeZone` (two-pass offset fix). */
export function localToEpoch(date: CalendarDate, hour: number, timeZone: string): number {
  const wall = Date.UTC(date.year, date.month - 1, date.day, hour);
  let guess = wall - offsetMinutes(wall, timeZone) * MS_PER_MINUTE;
  guess = wall - offsetMinutes(guess, timeZone) * MS_PER_MINUTE;
  return guess;
}

/** Parse an ISO 8601 instant that carries an offset or `Z`; throws LightingInputError. */
export function requireInstant(field: string, value: unknown): number {
  const ok =
    typeof value === 'string' &&
    /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/.test(value);
  const ms = ok ? Date.parse(value) : NaN;
  if (!Number.isFinite(ms)) {
    throw new LightingInputError(field, 'must be an ISO 8601 time with offset or Z');
  }
  return ms;
}

/**
 * "20:12" from a local ISO 8601 time with offset ("2026-06-20T20:11:42+02:00"), rounded to the
 * nearest minute (30 s and over go up), 24-hour: one way to print the evening's times everywhere.
 */
export function clockOf(iso: string): string {
  const m = /T(\d{2}):(\d{2})(?::(\d{2}))?/.exec(iso);
  if (!m) throw new LightingInputError('time', 'must be an ISO 8601 time');
  const total = (Number(m[1]) * 60 + Number(m[2]) + (Number(m[3] ?? 0) >= 30 ? 1 : 0)) % 1440;
  return `${String(Math.floor(total / 60)).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}`;
}

/** {@link clockOf} for an instant ("…Z" or any offset) as seen in `timeZone`. */
export function clockIn(iso: string, timeZone: string): string {
  return clockOf(toLocalIso(requireInstant('time', iso), timeZone));
}
