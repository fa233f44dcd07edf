import { round } from '../units/math.js';

/** One unbroken run of usable minutes at the plan's step. */
export interface UsableSpan {
  /** First usable minute of the run (ISO 8601 local time with offset). */
  start: string;
  /** Last usable minute of the run; equal to `start` for a run of one planned minute. */
  end: string;
  /** Minutes from `start` to `end`: (planned minutes in the run − 1) × step; 0 for one minute. */
  lengthMinutes: number;
}

/**
 * The runs of usable minutes, in time order. Two usable minutes belong to one run when they are
 * neighbours on the timeline: the second comes one step after the first (to within half a step,
 * since the planned times are rounded to the second). A minute that is unusable, or missing from
 * the list (left out as too dark), breaks the run.
 */
export function usableSpans(
  minutes: ReadonlyArray<{ time: string; usable: boolean }>,
  stepMinutes: number,
): UsableSpan[] {
  const stepMs = stepMinutes * 60_000;
  const spans: UsableSpan[] = [];
  let run: { start: string; end: string; endMs: number; count: number } | null = null;
  const close = () => {
    if (run)
      spans.push({
        start: run.start,
        end: run.end,
        lengthMinutes: round((run.count - 1) * stepMinutes, 2),
      });
    run = null;
  };
  for (const m of minutes) {
    if (!m.usable) {
      close();
      continue;
    }
    const t = Date.parse(m.time);
    if (run && t - run.endMs <= 1.5 * stepMs) {
      run.end = m.time;
      run.endMs = t;
      run.count++;
    } else {
      close();
      run = { start: m.time, end: m.time, endMs: t, count: 1 };
    }
  }
  close();
  return spans;
}

/**
 * The runs in words for a reader: "19:57–20:01 and 20:05–20:07", a run of one planned minute as
 * that minute, `null` when there is none. `clock` formats an instant (in the shoot's time zone).
 */
export function describeUsableSpans(
  spans: ReadonlyArray<Pick<UsableSpan, 'start' | 'end'>>,
  clock: (iso: string) => string,
): string | null {
  const runs = spans.map((r) => {
    const a = clock(r.start);
    const b = clock(r.end);
    return a === b ? a : `${a}–${b}`;
  });
  const last = runs.pop();
  if (last === undefined) return null;
  return runs.length ? `${runs.join(', ')} and ${last}` : last;
}
