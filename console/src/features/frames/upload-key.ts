// The Idempotency-Key of an upload: one random UUID per upload, sent again when the same upload
// is retried after it got no usable answer, so the server stores the frame (and bills it) once.
import { v4 as uuidv4 } from 'uuid';
import { ApiProblem } from '@/lib/api';
import type { PixelRect } from './patch';

export interface UploadAttempt {
  key: string;
  file: File;
  patch: PixelRect | null;
  cameraKelvin?: number;
}

const samePatch = (a: PixelRect | null, b: PixelRect | null) =>
  a === b ||
  (!!a && !!b && a.x === b.x && a.y === b.y && a.width === b.width && a.height === b.height);

/**
 * The attempt to send: the previous one's key when it is the same upload (the same file object,
 * patch and white balance) still waiting for an answer, otherwise a new random key.
 */
export function nextAttempt(
  previous: UploadAttempt | null,
  input: Omit<UploadAttempt, 'key'>,
  newKey: () => string = uuidv4,
): UploadAttempt {
  const same =
    previous !== null &&
    previous.file === input.file &&
    samePatch(previous.patch, input.patch) &&
    previous.cameraKelvin === input.cameraKelvin;
  return { ...input, key: same ? previous.key : newKey() };
}

/**
 * Whether a failed upload may be retried with the same key: no answer reached us (network),
 * the server failed or was busy (5xx, 429), or the first attempt is still running (409). The
 * server stores none of those answers, so the retry runs (or replays the first success). After
 * any other answer the upload is over, and a new attempt is a new upload with a new key.
 */
export function keepKeyAfter(error: unknown): boolean {
  if (!(error instanceof ApiProblem)) return false;
  return error.status === 0 || error.status >= 500 || error.status === 409 || error.status === 429;
}
