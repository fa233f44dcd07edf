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

/** UTC calendar day, YYYY-MM-DD. */
export const utcDay = (d: Date) => d.toISOString().slice(0, 10);

/** What the limits guard leaves on the request for the metering hook. */
export interface MeteredRequestExtras {
  /** Gives the call back to the monthly quota when it did not succeed. */
  quotaRefund?: () => void;
}
