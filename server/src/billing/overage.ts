// Metered overage for a billing period, from the daily usage roll-ups (usage_daily): billable
// units (successful live-key calls) over the plan's included calls, priced per 1,000 calls and
// rounded up to the next cent.
import type { DataSource } from 'typeorm';
import type { PlanEntity } from '../plans/plan.entity.js';

export interface Overage {
  billableCalls: number;
  includedCalls: number;
  overCalls: number;
  pricePer1000Cents: number;
  amountCents: number;
  from: string;
  to: string;
}

/** Whole UTC days [from, to): the roll-ups are daily, so a period is counted by its days. */
export async function overageFor(
  ds: DataSource,
  organizationId: string,
  plan: PlanEntity,
  periodStart: Date,
  periodEnd: Date,
): Promise<Overage | null> {
  if (plan.overagePricePer1000Cents === null) return null;
  const from = periodStart.toISOString().slice(0, 10);
  const to = periodEnd.toISOString().slice(0, 10);
  const rows: { units: string | null }[] = await ds.query(
    `SELECT SUM(billable_units)::bigint AS units FROM usage_daily
     WHERE organization_id = $1 AND day >= $2::date AND day < $3::date`,
    [organizationId, from, to],
  );
  const billableCalls = Number(rows[0]?.units ?? 0);
  const overCalls = Math.max(0, billableCalls - plan.includedCallsPerMonth);
  return {
    billableCalls,
    includedCalls: plan.includedCallsPerMonth,
    overCalls,
    pricePer1000Cents: plan.overagePricePer1000Cents,
    amountCents: Math.ceil((overCalls * plan.overagePricePer1000Cents) / 1000),
    from,
    to,
  };
}
