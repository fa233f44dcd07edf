import { LightingInputError } from '@lumenwright/shared';
import { useMemo } from 'react';

export type Preview<I, R> =
  | { state: 'empty' }
  | { state: 'ok'; input: I; result: R }
  | { state: 'invalid'; input: I; field: string; reason: string }
  | { state: 'failed'; input: I; message: string };

/**
 * Run a shared/ function on the form's current input, client-side, for an instant result.
 * Bad input comes back as the field and reason the shared function named.
 */
export function usePreview<I, R>(compute: (input: I) => R, input: I | undefined): Preview<I, R> {
  const key = input === undefined ? undefined : JSON.stringify(input);
  return useMemo(() => {
    if (input === undefined) return { state: 'empty' };
    try {
      return { state: 'ok', input, result: compute(input) };
    } catch (error) {
      if (error instanceof LightingInputError) {
        return { state: 'invalid', input, field: error.field, reason: error.reason };
      }
      return {
        state: 'failed',
        input,
        message: error instanceof Error ? error.message : 'The calculation failed',
      };
    }
    // `key` stands in for `input`: forms hand over a new object on every render.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [compute, key]);
}
