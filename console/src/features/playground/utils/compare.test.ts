import { describe, expect, it } from 'vitest';
import { resultDifferences } from './compare';

describe('resultDifferences', () => {
  it('accepts float noise but names real differences by path', () => {
    const preview = { power: 0.125, label: '1/8', fixes: null, points: [{ ev: 3.1 }, { ev: 2.2 }] };
    expect(resultDifferences(preview, { ...preview, power: 0.125 + 1e-12 })).toEqual([]);
    expect(
      resultDifferences(preview, {
        ...preview,
        label: '1/8 +0.3',
        points: [{ ev: 3.1 }, { ev: 2.5 }],
      }),
    ).toEqual(['label', 'points[1].ev']);
    expect(resultDifferences(preview, { ...preview, extra: 1 })).toEqual(['extra']);
    expect(resultDifferences([1, 2], [1])).toEqual(['.length']);
  });
});
