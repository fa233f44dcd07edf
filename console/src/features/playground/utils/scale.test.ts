import { describe, expect, it } from 'vitest';
import { linePath, linearScale, niceExtent, niceTicks } from './scale';

describe('chart scales', () => {
  it('maps a domain onto a pixel range and back, including inverted axes', () => {
    const y = linearScale([-18, 6], [200, 0]);
    expect(y(6)).toBe(0);
    expect(y(-18)).toBe(200);
    expect(y(-6)).toBe(100);
    expect(y.invert(150)).toBe(-12);
  });

  // Heckbert (1990): ticks step by 1, 2 or 5 x 10^k and cover the data range.
  it('picks 1-2-5 steps that land on round numbers', () => {
    expect(niceTicks(-18, 6, 5)).toEqual([-15, -10, -5, 0, 5]);
    expect(niceTicks(0, 1, 6)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(niceTicks(3.2, 11.9, 5)).toEqual([4, 6, 8, 10]);
    expect(niceTicks(5, 5)).toEqual([5]);
  });

  it('widens the domain to whole steps so every value stays on the axis', () => {
    const { domain, ticks } = niceExtent(-18.4, 6, 6);
    expect(domain).toEqual([-20, 10]);
    expect(ticks).toEqual([-20, -15, -10, -5, 0, 5, 10]);
    expect(niceExtent(-9.7, 11.2, 6).domain).toEqual([-10, 15]);
  });

  it('draws a path with gaps where values are missing', () => {
    expect(
      linePath([
        [0, 0],
        [1, 1],
        [2, Number.NaN],
        [3, 3],
      ]),
    ).toBe('M0.0,0.0L1.0,1.0M3.0,3.0');
  });
});
