import { describe, expect, it } from 'vitest';
import { usageCsvHref } from './api/usage';
import { niceCeiling, ticks } from './chart-scale';
import {
  daysBetween,
  filterFromParams,
  ignoredParams,
  nextDay,
  summaryFromParams,
} from './filters';

describe('usage filters from the URL', () => {
  it('keeps valid filters, drops malformed ones, and makes "to" exclusive', () => {
    const filter = filterFromParams(
      new URLSearchParams(
        'endpoint=flash&status=429&from=2026-12-01&to=2026-12-31&keyId=k1&cursor=abc&bogus=1',
      ),
    );
    expect(filter).toEqual({
      limit: 50,
      endpoint: 'flash',
      status: 429,
      from: '2026-12-01',
      to: '2027-01-01',
      keyId: 'k1',
      cursor: 'abc',
    });
    expect(
      filterFromParams(new URLSearchParams('endpoint=teleport&status=99&from=yesterday')),
    ).toEqual({ limit: 50 });
  });

  it('nextDay crosses month and leap-day boundaries', () => {
    expect(nextDay('2028-02-28')).toBe('2028-02-29');
    expect(nextDay('2027-02-28')).toBe('2027-03-01');
  });

  it('the summary takes the same filters as the list, as inclusive days', () => {
    expect(summaryFromParams(new URLSearchParams('from=2026-12-01&to=soon'))).toEqual({
      from: '2026-12-01',
    });
    expect(
      summaryFromParams(
        new URLSearchParams('from=2026-12-01&to=2026-12-31&endpoint=flash&status=429&keyId=k1'),
      ),
    ).toEqual({
      from: '2026-12-01',
      to: '2026-12-31',
      endpoint: 'flash',
      status: 429,
      keyId: 'k1',
    });
  });

  it('says which address filters it left out, and drops a range that ends before it starts', () => {
    const params = new URLSearchParams(
      'endpoint=teleport&status=99&from=2026-12-10&to=2026-12-01&keyId=k1',
    );
    expect(ignoredParams(params)).toEqual([
      'endpoint “teleport” is not one of ours',
      'status “99” is not an HTTP status',
      'the range 2026-12-10 to 2026-12-01 ends before it starts',
    ]);
    expect(summaryFromParams(params)).toEqual({ keyId: 'k1' });
    expect(filterFromParams(params)).toEqual({ limit: 50, keyId: 'k1' });
    // 31 November is not a day, though it has the shape of one.
    expect(ignoredParams(new URLSearchParams('from=2026-11-31'))).toEqual([
      'from “2026-11-31” is not a YYYY-MM-DD day',
    ]);
    expect(ignoredParams(new URLSearchParams('from=2026-11-30&endpoint=flash'))).toEqual([]);
    const failed = new URLSearchParams('outcome=error');
    expect(summaryFromParams(failed)).toEqual({ outcome: 'error' });
    expect(filterFromParams(failed)).toEqual({ limit: 50, outcome: 'error' });
    expect(ignoredParams(new URLSearchParams('outcome=maybe'))).toEqual([
      'outcome “maybe” is neither ok nor error',
    ]);
  });

  it('daysBetween lists every day inclusive', () => {
    expect(daysBetween('2026-11-29', '2026-12-02')).toEqual([
      '2026-11-29',
      '2026-11-30',
      '2026-12-01',
      '2026-12-02',
    ]);
  });

  it('the CSV link carries the filters but not the page position', () => {
    expect(usageCsvHref({ limit: 50, endpoint: 'flash', cursor: 'abc', status: 500 })).toBe(
      '/v1/usage/events.csv?endpoint=flash&status=500',
    );
    expect(usageCsvHref({ limit: 50 })).toBe('/v1/usage/events.csv');
  });
});

describe('chart scale', () => {
  it('rounds the axis top up to 1, 2 or 5 × 10^n', () => {
    expect([0, 1, 3, 7, 10, 11, 180, 201, 999].map(niceCeiling)).toEqual([
      1, 1, 5, 10, 10, 20, 200, 500, 1000,
    ]);
  });

  it('ticks are round whole numbers from 0 to the top', () => {
    expect(ticks(200)).toEqual([0, 50, 100, 150, 200]);
    expect(ticks(1)).toEqual([0, 1]);
    // Steps of 1, 2 or 5 × 10^n, never 2.5 rounded to 3 and 8 (common practice, no source).
    expect(ticks(10)).toEqual([0, 2, 4, 6, 8, 10]);
    expect(ticks(2)).toEqual([0, 1, 2]);
    expect(ticks(20)).toEqual([0, 5, 10, 15, 20]);
    for (const top of [1, 2, 5, 10, 20, 50, 100, 200, 500, 1000]) {
      const t = ticks(top);
      expect(t[0]).toBe(0);
      expect(t[t.length - 1]).toBe(top);
      expect(t.every(Number.isInteger)).toBe(true);
    }
  });
});
