// Demo scenario: invented API traffic for the demo studio's keys over the days they have existed,
// so the usage pages, the overview and the CSV export show a working studio. A fixed-seed
// generator: the same day always gets the same calls. Invented data, for the demo only.
import seedrandom from 'seedrandom';
import type { UsageEvent } from './usage-event.js';

export interface DemoKey {
  id: string;
  environment: 'live' | 'test';
  /** Calls on a typical weekday. */
  perWeekday: number;
  /** Share of calls that fail validation (422). */
  invalidShare: number;
  /** No calls before the key existed or after it was revoked (null: still active). */
  activeFrom?: Date;
  activeUntil?: Date | null;
}

/** Rough shape of a booking or shot-planning app's calls (common practice, no source). */
const ENDPOINTS: [string, number, number][] = [
  // endpoint, share of calls, typical latency in ms
  ['twilight', 0.28, 6],
  ['timeline', 0.06, 7],
  ['setup', 0.24, 22],
  ['balance', 0.16, 3],
  ['exposure', 0.1, 2],
  ['flash', 0.09, 2],
  ['falloff', 0.04, 1.5],
  ['backlight', 0.03, 1.5],
];

const hex = (rnd: () => number, n: number) =>
  Array.from({ length: n }, () => Math.floor(rnd() * 16).toString(16)).join('');

/**
 * Every call of the last `days` whole UTC days plus today up to `now`, oldest first. Weekends
 * are busier for a wedding studio's booking site; test keys are quieter at weekends.
 */
export function demoTraffic(
  organizationId: string,
  keys: DemoKey[],
  now: Date,
  days: number,
): UsageEvent[] {
  const out: UsageEvent[] = [];
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  for (let d = days; d >= 0; d--) {
    const dayStart = today - d * 86_400_000;
    const weekday = new Date(dayStart).getUTCDay();
    const weekend = weekday === 0 || weekday === 6 || weekday === 5;
    keys.forEach((key, k) => {
      const rnd = seedrandom(`${dayStart / 86_400_000}:${k}`);
      const factor = key.environment === 'live' ? (weekend ? 1.6 : 1) : weekend ? 0.2 : 1;
      const calls = Math.round(key.perWeekday * factor * (0.7 + 0.6 * rnd()));
      for (let i = 0; i < calls; i++) {
        // Working hours in Europe, 07:00–22:00 UTC, busiest in the evening.
        const at = dayStart + (7 + 15 * Math.sqrt(rnd())) * 3_600_000;
        if (at > now.getTime()) continue;
        if (key.activeFrom && at < key.activeFrom.getTime()) continue;
        if (key.activeUntil && at > key.activeUntil.getTime()) continue;
        let pick = rnd();
        const [endpoint, , ms] =
          ENDPOINTS.find(([, share]) => (pick -= share) < 0) ?? ENDPOINTS[0]!;
        const r = rnd();
        const status = r < key.invalidShare ? 422 : r < key.invalidShare + 0.004 ? 429 : 200;
        const latencyMs =
          Math.round((status === 200 ? ms * (0.6 + 1.2 * rnd()) : 0.4 + rnd()) * 100) / 100;
        out.push({
          occurredAt: new Date(at),
          organizationId,
          keyId: key.id,
          userId: null,
          source: key.environment,
          endpoint,
          status,
          latencyMs,
          billableUnits: key.environment === 'live' && status === 200 ? 1 : 0,
          requestId: `${hex(rnd, 8)}-${hex(rnd, 4)}-4${hex(rnd, 3)}-a${hex(rnd, 3)}-${hex(rnd, 12)}`,
        });
      }
    });
  }
  return out.sort((a, b) => a.occurredAt.getTime() - b.occurredAt.getTime());
}
