import { describe, expect, it } from 'vitest';
import { clockTicks, compassPoint, localMinutes, minutesPerStep } from './time-axis';

describe('evening time axis', () => {
  it('reads local minutes from an ISO time with offset', () => {
    expect(localMinutes('2026-06-21T21:09:30+01:00')).toBe(21 * 60 + 9.5);
  });

  it('places half-hour ticks at local clock times, across midnight', () => {
    const ticks = clockTicks('2026-06-21T22:47:10+02:00', '2026-06-22T00:05:00+02:00', 30);
    expect(ticks.map((tick) => tick.label)).toEqual(['23:00', '23:30', '00:00']);
    // 23:00 local is 12 min 50 s after the first sample.
    expect(ticks[0]!.epoch - Date.parse('2026-06-21T22:47:10+02:00')).toBe(770_000);
  });

  // 16-point compass rose: 22.5 degrees per point, N at 0, clockwise.
  it('names compass points', () => {
    expect(compassPoint(0)).toBe('N');
    expect(compassPoint(247.5)).toBe('WSW');
    expect(compassPoint(301)).toBe('WNW');
    expect(compassPoint(-10)).toBe('N');
    expect(compassPoint(359)).toBe('N');
  });

  it('turns drift into minutes per third of a stop (common practice, no source)', () => {
    expect(minutesPerStep(-1)).toBeCloseTo(10 / 3, 9);
    expect(minutesPerStep(0.5, 1)).toBe(20);
    expect(minutesPerStep(0)).toBeNull();
  });
});
