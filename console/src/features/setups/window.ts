import { formatTimeIn } from '@/lib/format';

interface WithWindow {
  windowStart: string | null;
  windowEnd: string | null;
  timeZone: string;
}

/**
 * The shooting window as times of day in the shoot's own zone, e.g. "16:15–16:47 GMT";
 * null when the day has none (polar day or night).
 */
export function shootingWindow(s: WithWindow): string | null {
  if (!s.windowStart || !s.windowEnd) return null;
  const end = formatTimeIn(s.windowEnd, s.timeZone);
  const zone =
    new Intl.DateTimeFormat(undefined, { timeZone: s.timeZone, timeZoneName: 'short' })
      .formatToParts(new Date(s.windowEnd))
      .find((p) => p.type === 'timeZoneName')?.value ?? s.timeZone;
  return `${formatTimeIn(s.windowStart, s.timeZone)}–${end} ${zone}`;
}
