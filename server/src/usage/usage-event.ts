// One metered compute call, as the batch writer buffers it.
export type UsageSource = 'live' | 'test' | 'console';

export interface UsageEvent {
  occurredAt: Date;
  organizationId: string;
  keyId: string | null;
  userId: string | null;
  source: UsageSource;
  endpoint: string;
  status: number;
  latencyMs: number;
  billableUnits: number;
  requestId: string;
}

let isoSecond = NaN;
let isoPrefix = '';

/**
 * `d.toISOString()` for the dates events carry (years 1970–9999), formatting only the
 * milliseconds per call: the rest is reused within the same second. Every metered call formats
 * its timestamp, and Date#toISOString costs about a microsecond here.
 */
export function isoTimestamp(d: Date): string {
  const ms = d.getTime();
  if (!(ms >= 0 && ms < 253402300800000)) return d.toISOString(); // outside 1970–9999 (or invalid)
  const second = Math.floor(ms / 1000);
  if (second !== isoSecond) {
    isoPrefix = new Date(second * 1000).toISOString().slice(0, 20); // YYYY-MM-DDTHH:MM:SS.
    isoSecond = second;
  }
  const frac = ms - second * 1000;
  return isoPrefix + (frac < 10 ? '00' : frac < 100 ? '0' : '') + frac + 'Z';
}

/** What the limits guard leaves on the request for the metering hook. */
export interface MeteredRequestExtras {
  /** Gives the call back to the monthly quota when it did not succeed. */
  quotaRefund?: () => void;
  /** An Idempotency-Key replay: the stored answer sent again, not metered (src/idempotency). */
  idempotentReplay?: boolean;
}
