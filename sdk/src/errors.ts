import type { components } from './generated/schema.js';

/** An RFC 9457 problem as the API sends it. */
export type Problem = components['schemas']['Problem'] & Record<string, unknown>;

/**
 * Thrown for any call that did not succeed: `kind` says whether the server answered with a
 * problem (`status` and `problem` are set), the call timed out, or the network failed.
 */
export class LumenwrightError extends Error {
  readonly kind: 'problem' | 'timeout' | 'network';
  /** HTTP status, or 0 when there was no response. */
  readonly status: number;
  readonly problem: Problem | null;
  /** The X-Request-Id to quote to support. */
  readonly requestId: string | null;
  /** Seconds the server asked us to wait (429/503), if it said. */
  readonly retryAfterSeconds: number | null;

  constructor(init: {
    kind: LumenwrightError['kind'];
    status: number;
    message: string;
    problem?: Problem | null;
    requestId?: string | null;
    retryAfterSeconds?: number | null;
    cause?: unknown;
  }) {
    super(init.message, { cause: init.cause });
    this.name = 'LumenwrightError';
    this.kind = init.kind;
    this.status = init.status;
    this.problem = init.problem ?? null;
    this.requestId = init.requestId ?? null;
    this.retryAfterSeconds = init.retryAfterSeconds ?? null;
  }

  /** The problem type's last segment, e.g. `invalid-input`, `rate-limited`, `quota-exceeded`. */
  get code(): string | null {
    return this.problem?.type ? (this.problem.type.split('/').pop() ?? null) : null;
  }
}
