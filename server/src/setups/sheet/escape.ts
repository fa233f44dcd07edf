/** Escapes text for HTML and SVG content and attribute values. */
export function esc(value: unknown): string {
  return String(value ?? '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** Local clock time from an ISO 8601 string with offset ("…T20:12:08+01:00" → "20:12"). */
export function clock(iso: string | null | undefined): string {
  const m = iso ? /T(\d{2}:\d{2})/.exec(iso) : null;
  return m ? m[1]! : '—';
}

export const fmt = (n: number | null | undefined, digits = 1): string =>
  typeof n === 'number' && Number.isFinite(n)
    ? String(Math.round(n * 10 ** digits) / 10 ** digits)
    : '—';
