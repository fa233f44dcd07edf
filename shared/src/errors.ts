/**
 * The one error every exported function throws for bad input. The server maps it to a 422
 * problem+json response naming `field`.
 */
export class LightingInputError extends Error {
  /** Path of the offending input field, e.g. `latitude` or `gels[2].miredShift`. */
  readonly field: string;
  /** Human-readable reason, e.g. `must be between -90 and 90`. */
  readonly reason: string;
  readonly code = 'invalid_input';

  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.name = 'LightingInputError';
    this.field = field;
    this.reason = reason;
  }
}
