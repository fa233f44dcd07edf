import { describe, expect, it } from 'vitest';
import { ApiProblem } from '@/lib/api';
import { keepKeyAfter, nextAttempt } from './upload-key';

const UUID_V4 = /^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/;

describe('the Idempotency-Key of an upload', () => {
  const file = new File(['x'], 'card.png', { type: 'image/png' });
  const patch = { x: 1, y: 2, width: 3, height: 4 };

  it('is a fresh random UUID (RFC 9562 version 4) for a new upload', () => {
    const a = nextAttempt(null, { file, patch });
    const b = nextAttempt(null, { file, patch });
    expect(a.key).toMatch(UUID_V4);
    expect(b.key).toMatch(UUID_V4);
    expect(a.key).not.toBe(b.key);
  });

  it('is reused for the same file, patch (compared by value) and white balance', () => {
    const first = nextAttempt(null, { file, patch, cameraKelvin: 5600 });
    const again = nextAttempt(first, { file, patch: { ...patch }, cameraKelvin: 5600 });
    expect(again.key).toBe(first.key);
  });

  it('is new when the file, the patch or the white balance changed', () => {
    const first = nextAttempt(null, { file, patch, cameraKelvin: 5600 });
    const other = new File(['x'], 'card.png', { type: 'image/png' });
    expect(nextAttempt(first, { file: other, patch, cameraKelvin: 5600 }).key).not.toBe(first.key);
    expect(nextAttempt(first, { file, patch: null, cameraKelvin: 5600 }).key).not.toBe(first.key);
    expect(nextAttempt(first, { file, patch, cameraKelvin: 3200 }).key).not.toBe(first.key);
  });

  it('is kept after no answer, a server failure, a busy key or a rate limit; not after a refusal', () => {
    const p = (status: number) => new ApiProblem(status, { status });
    expect([0, 500, 503, 409, 429].map((s) => keepKeyAfter(p(s)))).toEqual([
      true,
      true,
      true,
      true,
      true,
    ]);
    expect([400, 403, 413, 415, 422].map((s) => keepKeyAfter(p(s)))).toEqual([
      false,
      false,
      false,
      false,
      false,
    ]);
    expect(keepKeyAfter(new Error('not from the API'))).toBe(false);
  });
});
