import { describe, expect, it } from 'vitest';
import { inDenominators } from './use-calculation-form';

describe('inDenominators', () => {
  it('restates limits on seconds as limits on x of 1/x s', () => {
    // The shared library's flash-sync range, 1/16000 s .. 1 s (setup-input.ts).
    expect(inDenominators('must be between 0.0000625 and 1')).toBe('must be between 1 and 16000');
    // At most 30 s means x at least 1/30; at least 1/8000 s means x at most 8000.
    expect(inDenominators('must be at most 30')).toBe('must be at least 0.03333');
    expect(inDenominators('must be at least 0.000125')).toBe('must be at most 8000');
    expect(inDenominators('must be at least 0.000125 and at most 30')).toBe(
      'must be at most 8000 and at least 0.03333',
    );
    expect(inDenominators('is required')).toBe('is required');
  });
});
