// The runs of usable minutes in a dusk plan. The notion of a run (a maximal stretch of
// neighbouring slots on a regular grid that all pass) is common practice, no source; the checks
// below compare the function with hand-made sequences and with a second, plain construction.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { describeUsableSpans, usableSpans } from '../src/setup/usable-spans.js';

/** An evening minute, local time at UTC-4, `m` minutes after 19:00 (fractions allowed). */
const at = (m: number, jitterSeconds = 0) => {
  const s = Math.round(m * 60) + jitterSeconds;
  const hh = 19 + Math.floor(s / 3600);
  const mm = Math.floor((s % 3600) / 60);
  const ss = s % 60;
  const two = (n: number) => String(n).padStart(2, '0');
  return `2026-09-20T${two(hh)}:${two(mm)}:${two(ss)}-04:00`;
};

/** Minutes on a `step` grid from 19:57 (minute 57), usable where `pattern` has a 'U'. */
const sequence = (pattern: string, step: number) =>
  [...pattern].map((c, i) => ({ time: at(57 + i * step), usable: c === 'U' }));

describe('usableSpans', () => {
  it('splits at an unusable minute: 19:57–19:58 and 20:00–20:02 at a 1-minute step', () => {
    expect(usableSpans(sequence('UU.UUU', 1), 1)).toEqual([
      { start: at(57), end: at(58), lengthMinutes: 1 },
      { start: at(60), end: at(62), lengthMinutes: 2 },
    ]);
  });

  it('counts a single usable minute as a run of length 0', () => {
    expect(usableSpans(sequence('.U..UU.', 1), 1)).toEqual([
      { start: at(58), end: at(58), lengthMinutes: 0 },
      { start: at(61), end: at(62), lengthMinutes: 1 },
    ]);
  });

  it('joins minutes that are consecutive at the plan step (2 minutes here)', () => {
    // 19:57, 19:59, 20:01 are neighbours on a 2-minute timeline: one run of 4 minutes.
    expect(usableSpans(sequence('UUU.U', 2), 2)).toEqual([
      { start: at(57), end: at(61), lengthMinutes: 4 },
      { start: at(65), end: at(65), lengthMinutes: 0 },
    ]);
  });

  it('breaks a run where a minute is missing from the timeline (left out as too dark)', () => {
    // 19:57, 19:58, then 20:00: the 19:59 slot is absent, so the runs do not join.
    const minutes = [57, 58, 60].map((m) => ({ time: at(m), usable: true }));
    expect(usableSpans(minutes, 1)).toEqual([
      { start: at(57), end: at(58), lengthMinutes: 1 },
      { start: at(60), end: at(60), lengthMinutes: 0 },
    ]);
  });

  it('keeps neighbours together when their times are a second off the grid (rounded times)', () => {
    const minutes = [
      { time: at(57, 0), usable: true },
      { time: at(58, 1), usable: true },
      { time: at(59, 0), usable: true },
    ];
    expect(usableSpans(minutes, 1)).toEqual([{ start: at(57), end: at(59), lengthMinutes: 2 }]);
  });

  it('takes half-minute steps', () => {
    expect(usableSpans(sequence('UU.U', 0.5), 0.5)).toEqual([
      { start: at(57), end: at(57.5), lengthMinutes: 0.5 },
      { start: at(58.5), end: at(58.5), lengthMinutes: 0 },
    ]);
  });

  it('is empty with no usable minute or no minute at all', () => {
    expect(usableSpans(sequence('....', 2), 2)).toEqual([]);
    expect(usableSpans([], 2)).toEqual([]);
  });

  it('matches a plain construction: the runs of "U" in a string of slots', () => {
    // Reference: write one character per grid slot (U usable, . unusable, _ missing) and read the
    // runs with a regular expression; start/end are the slot indices of each match.
    const slot = fc.constantFrom('U', '.', '_');
    fc.assert(
      fc.property(
        fc.array(slot, { maxLength: 60 }),
        fc.constantFrom(0.5, 1, 2, 5),
        (slots, step) => {
          const minutes = slots.flatMap((c, i) =>
            c === '_' ? [] : [{ time: at(i * step), usable: c === 'U' }],
          );
          const expected = [...slots.join('').matchAll(/U+/g)].map((m) => ({
            start: at(m.index * step),
            end: at((m.index + m[0].length - 1) * step),
            lengthMinutes: (m[0].length - 1) * step,
          }));
          expect(usableSpans(minutes, step)).toEqual(expected);
        },
      ),
    );
  });
});

describe('describeUsableSpans', () => {
  // English list punctuation for the runs (common practice, no source); the clock is the caller's.
  const hhmm = (iso: string) => iso.slice(11, 16);
  const at = (t: string) => `2026-09-20T${t}:00-04:00`;
  it('joins runs with commas and a final "and", a one-minute run as that minute', () => {
    const spans = [
      { start: at('19:14'), end: at('19:14') },
      { start: at('19:16'), end: at('19:20') },
      { start: at('19:24'), end: at('19:30') },
    ];
    expect(describeUsableSpans(spans, hhmm)).toBe('19:14, 19:16\u201319:20 and 19:24\u201319:30');
    expect(describeUsableSpans(spans.slice(1, 2), hhmm)).toBe('19:16\u201319:20');
  });
  it('answers null when no minute is usable', () => {
    expect(describeUsableSpans([], hhmm)).toBeNull();
  });
});
