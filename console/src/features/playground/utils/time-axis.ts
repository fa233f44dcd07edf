/** Time-axis helpers for charts over an evening (presentation only). */

/** Minutes since local midnight of an ISO 8601 local time with offset ("...T21:09:24+01:00"). */
export function localMinutes(iso: string): number {
  const match = /T(\d{2}):(\d{2})(?::(\d{2}))?/.exec(iso);
  if (!match) return Number.NaN;
  return Number(match[1]) * 60 + Number(match[2]) + Number(match[3] ?? 0) / 60;
}

/**
 * Epoch times of round local clock ticks (every `everyMinutes`) between the first and last
 * sample, with their "HH:MM" labels. Assumes one UTC offset across the span (an evening).
 */
export function clockTicks(
  firstIso: string,
  lastIso: string,
  everyMinutes: number,
): { epoch: number; label: string }[] {
  const start = Date.parse(firstIso);
  const end = Date.parse(lastIso);
  const startLocal = localMinutes(firstIso);
  if (!Number.isFinite(start) || !Number.isFinite(end) || !Number.isFinite(startLocal)) return [];
  const ticks: { epoch: number; label: string }[] = [];
  let local = Math.ceil(startLocal / everyMinutes - 1e-9) * everyMinutes;
  for (; ; local += everyMinutes) {
    const epoch = start + (local - startLocal) * 60_000;
    if (epoch > end + 1) break;
    const wrapped = ((Math.round(local) % 1440) + 1440) % 1440;
    const label = `${String(Math.floor(wrapped / 60)).padStart(2, '0')}:${String(wrapped % 60).padStart(2, '0')}`;
    ticks.push({ epoch, label });
  }
  return ticks;
}

/** 16-point compass name for an azimuth in degrees clockwise from north (22.5° per point). */
export function compassPoint(azimuthDeg: number): string {
  const names = [
    'N',
    'NNE',
    'NE',
    'ENE',
    'E',
    'ESE',
    'SE',
    'SSE',
    'S',
    'SSW',
    'SW',
    'WSW',
    'W',
    'WNW',
    'NW',
    'NNW',
  ];
  const index = Math.round((((azimuthDeg % 360) + 360) % 360) / 22.5) % 16;
  return names[index]!;
}

/**
 * Minutes until the ambient light has moved by `stepStops` at the current drift.
 * Common practice, no source: re-meter the background each third of a stop.
 */
export function minutesPerStep(stopsPer10Min: number, stepStops = 1 / 3): number | null {
  if (!Number.isFinite(stopsPer10Min) || Math.abs(stopsPer10Min) < 1e-6) return null;
  return (stepStops / Math.abs(stopsPer10Min)) * 10;
}
