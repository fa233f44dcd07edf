import { describe, expect, it } from 'vitest';
import { clockTime, fixed, minutesBetween, signed, stops } from './format';

describe('playground formatting', () => {
  it('reads the local wall clock from an ISO time with offset, rounding to the minute', () => {
    expect(clockTime('2026-06-21T21:09:24+01:00')).toBe('21:09');
    expect(clockTime('2026-06-21T21:09:30+01:00')).toBe('21:10');
    expect(clockTime('2026-06-21T23:59:45-05:00')).toBe('00:00');
    expect(clockTime(null)).toBe('—');
  });

  it('counts minutes between instants across offsets', () => {
    // 20:00 at +02:00 is 18:00 UTC; 19:30 at +01:00 is 18:30 UTC.
    expect(minutesBetween('2026-06-21T20:00:00+02:00', '2026-06-21T19:30:00+01:00')).toBe(30);
  });

  it('writes signed values with a true minus sign and singular for one stop', () => {
    expect(signed(0.66)).toBe('+0.7');
    expect(signed(-1.25, 2)).toBe('\u22121.25');
    expect(signed(-0.01)).toBe('0.0');
    expect(stops(-1)).toBe('\u22121.0 stop');
    expect(stops(2.34)).toBe('+2.3 stops');
    expect(fixed(-3.14159, 2)).toBe('\u22123.14');
  });
});
