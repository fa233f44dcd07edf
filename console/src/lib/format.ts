import { clockIn } from '@lumenwright/shared';
/** Dates and numbers as the console shows them (the visitor's locale and time zone). */
export function formatDateTime(iso: string | null | undefined, empty = '—'): string {
  if (!iso) return empty;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return empty;
  return date.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

export function formatDate(iso: string | null | undefined, empty = '—'): string {
  if (!iso) return empty;
  // Plain dates (YYYY-MM-DD) are calendar days, not instants: don't shift them by time zone.
  const date = /^\d{4}-\d{2}-\d{2}$/.test(iso) ? new Date(`${iso}T12:00:00`) : new Date(iso);
  if (Number.isNaN(date.getTime())) return empty;
  return date.toLocaleDateString(undefined, { dateStyle: 'medium' });
}

export function formatCount(value: number | null | undefined): string {
  return value === null || value === undefined ? '—' : value.toLocaleString();
}

export function formatMoney(cents: number, currency = 'usd'): string {
  return (cents / 100).toLocaleString(undefined, {
    style: 'currency',
    currency: currency.toUpperCase(),
  });
}

/** Today as YYYY-MM-DD in the visitor's time zone. */
export function todayIso(now = new Date()): string {
  const y = now.getFullYear();
  const m = String(now.getMonth() + 1).padStart(2, '0');
  const d = String(now.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

/**
 * A time of day in the given IANA zone (a shoot's own zone, not the visitor's): 24-hour, to the
 * nearest minute, as the playground and the shot sheet print the evening's times.
 */
export function formatTimeIn(iso: string, timeZone: string): string {
  return clockIn(iso, timeZone);
}

/** "today", "tomorrow", "in 3 days", "yesterday"… from `today` to a calendar day (YYYY-MM-DD). */
export function daysAway(day: string, today: string): string {
  const ms = Date.parse(`${day}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`);
  const days = Math.round(ms / 86_400_000);
  return new Intl.RelativeTimeFormat(undefined, { numeric: 'auto' }).format(days, 'day');
}
