// Billing rows as API responses.
import { toPlanDto } from '../plans/plans.dto.js';
import type { PlanEntity } from '../plans/plan.entity.js';
import type {
  BillingCheckoutEntity,
  BillingInvoiceEntity,
  BillingSubscriptionEntity,
} from './billing.entities.js';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export const toSubscriptionDto = (s: BillingSubscriptionEntity) => ({
  id: s.id,
  planCode: s.planCode,
  status: s.status,
  currentPeriodStart: iso(s.currentPeriodStart),
  currentPeriodEnd: iso(s.currentPeriodEnd),
});

export const toCheckoutDto = (c: BillingCheckoutEntity) => ({
  id: c.id,
  planCode: c.planCode,
  status: c.status,
  url: c.url,
  createdAt: c.createdAt.toISOString(),
});

export const toInvoiceDto = (i: BillingInvoiceEntity) => ({
  id: i.id,
  status: i.status,
  billingReason: i.billingReason,
  currency: i.currency,
  totalCents: i.totalCents,
  amountPaidCents: i.amountPaidCents,
  periodStart: iso(i.periodStart),
  periodEnd: iso(i.periodEnd),
  lines: i.lines,
  issuedAt: i.issuedAt.toISOString(),
});

export const toBillingDto = (o: {
  plan: PlanEntity;
  subscription: BillingSubscriptionEntity | null;
  checkout: BillingCheckoutEntity | null;
}) => ({
  plan: toPlanDto(o.plan),
  subscription: o.subscription ? toSubscriptionDto(o.subscription) : null,
  openCheckout: o.checkout ? toCheckoutDto(o.checkout) : null,
});
