import { clockOf } from '@lumenwright/shared';
/** Escapes text for HTML and SVG content and attribute values. */
export function esc(value: unknown): string {
  return String(value ?? '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** Local clock time from an ISO 8601 string with offset, to the nearest minute (shared with the console). */
export function clock(iso: string | null | undefined): string {
  return iso && /T\d{2}:\d{2}/.test(iso) ? clockOf(iso) : '—';
}

export const fmt = (n: number | null | undefined, digits = 1): string =>
  typeof n === 'number' && Number.isFinite(n)
    ? String(Math.round(n * 10 ** digits) / 10 ** digits)
    : '—';
