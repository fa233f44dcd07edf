// Domain errors carry a stable code; the problem filter maps each code to an HTTP status.
// Every 422 that names fields is 'invalid_input' (…/problems/invalid-input): a body field out of
// range, a patch outside the image and an upload that is not a readable image are all "this
// field's value cannot be used", so callers branch on one type and read `errors`. The two
// Idempotency-Key refusals have their own types: a client branches on them to tell "wait and
// retry" (…/idempotency-key-in-use, 409) from "this key belongs to another request"
// (…/idempotency-key-reused, 422).
export type DomainErrorCode =
  | 'invalid_input'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'idempotency_key_in_use'
  | 'idempotency_key_reused'
  | 'rate_limited'
  | 'quota_exceeded'
  | 'payload_too_large'
  | 'unsupported_media_type'
  | 'unavailable';

export const STATUS_BY_CODE: Record<DomainErrorCode, number> = {
  invalid_input: 422,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  idempotency_key_in_use: 409,
  idempotency_key_reused: 422,
  rate_limited: 429,
  quota_exceeded: 429,
  payload_too_large: 413,
  unsupported_media_type: 415,
  unavailable: 503,
};

export interface FieldProblem {
  field: string;
  reason: string;
}

export class DomainError extends Error {
  constructor(
    readonly code: DomainErrorCode,
    message: string,
    readonly errors: FieldProblem[] = [],
    readonly headers: Record<string, string> = {},
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }
}

/**
 * The 422 for field problems, worded the same on every route: the first problem is the detail
 * ("cameraKelvin is required (and 2 more)."), every one is in `errors`.
 */
export function invalidInput(problems: FieldProblem[]): DomainError {
  const first = problems[0];
  if (!first) return new DomainError('invalid_input', 'Some fields are missing or invalid.');
  const more = problems.length > 1 ? ` (and ${problems.length - 1} more)` : '';
  return new DomainError('invalid_input', `${first.field} ${first.reason}${more}.`, problems);
}
