import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { problemMessage } from '@/lib/form-errors';
import { formatCount, formatDate, formatMoney } from '@/lib/format';
import {
  useBilling,
  useCancelSubscription,
  useInvoices,
  usePlans,
  useStartCheckout,
  type Invoice,
  type Plan,
} from '../api/billing';
import { LoadError } from '@/components/ui/load-error';

const invoiceColumns: DataColumn<Invoice>[] = [
  { id: 'issued', header: 'Issued', accessorFn: (i) => formatDate(i.issuedAt) },
  {
    id: 'period',
    header: 'Period',
    accessorFn: (i) =>
      i.periodStart ? `${formatDate(i.periodStart)} – ${formatDate(i.periodEnd)}` : '—',
  },
  {
    id: 'lines',
    header: 'Lines',
    cell: ({ row }) => (
      <ul>
        {row.original.lines.map((line, index) => (
          <li key={index}>
            {line.description} × {line.quantity}:{' '}
            {formatMoney(line.amountCents, row.original.currency)}
          </li>
        ))}
      </ul>
    ),
  },
  { id: 'total', header: 'Total', accessorFn: (i) => formatMoney(i.totalCents, i.currency) },
  { id: 'status', header: 'Status', accessorFn: (i) => i.status },
];

/** Where a plan sits relative to the current one, by monthly price. */
function changeLabel(plan: Plan, current: Plan | undefined): string {
  if (!current) return 'Choose';
  return plan.monthlyPriceCents > current.monthlyPriceCents ? 'Upgrade' : 'Downgrade';
}

/** What cancelling means, seats included: members beyond them stay, but nobody new can join. */
function cancelDescription(free: Plan | undefined): string {
  const base = 'Your studio moves to the free plan now, with its lower limits.';
  if (!free) return base;
  return `${base} It has ${free.features.seats} seats: members beyond them keep their access, but nobody new can be invited or join until the team fits.`;
}

/** The payment provider's subscription states in words (its own status names as keys). */
function subscriptionState(status: string): string {
  const words: Record<string, string> = {
    active: 'Subscription active.',
    trialing: 'Subscription in its trial.',
    past_due: 'A payment is overdue: update the card on the payments page to keep the plan.',
    unpaid: 'Payments failed: the plan stays until the provider gives up retrying.',
    incomplete: 'The first payment is still being confirmed.',
    incomplete_expired: 'The first payment was never confirmed; no plan was started.',
    canceled: 'Subscription cancelled.',
    paused: 'Subscription paused.',
  };
  return words[status] ?? `Subscription ${status.replace(/_/g, ' ')}.`;
}

export function BillingPage() {
  const plans = usePlans();
  const billing = useBilling();
  const invoices = useInvoices();
  const checkout = useStartCheckout();
  const cancel = useCancelSubscription();
  const [confirmCancel, setConfirmCancel] = useState(false);
  const [params] = useSearchParams();
  const status = params.get('checkout');

  const current = billing.data?.plan;
  const go = (planCode: string) =>
    checkout.mutate(planCode, {
      // The hosted checkout is another site: a full navigation, not a fetch.
      onSuccess: (session) => globalThis.location.assign(session.url),
    });

  return (
    <div className="flex flex-col gap-8">
      {status === 'complete' ? (
        <Notice tone="ok">
          Payment approved. Your plan changes as soon as the payment is confirmed.
        </Notice>
      ) : status === 'cancelled' ? (
        <Notice tone="caution">Checkout was cancelled; nothing changed.</Notice>
      ) : null}
      {billing.isError ? (
        <LoadError
          error={billing.error}
          onRetry={billing.refetch}
          retrying={billing.isRefetching}
        />
      ) : null}
      {checkout.isError ? <Notice tone="fault">{problemMessage(checkout.error)}</Notice> : null}
      {/* A container: the plans sit side by side only where three fit (not beside the rail on a tablet). */}
      <section aria-labelledby="plans-heading" className="@container">
        <h2 id="plans-heading" className="mb-3 text-title font-semibold">
          Plans
        </h2>
        {plans.isPending || billing.isPending ? (
          <PageLoading />
        ) : plans.isError ? (
          <LoadError error={plans.error} onRetry={plans.refetch} retrying={plans.isRefetching} />
        ) : (
          <ul className="grid gap-4 @3xl:grid-cols-3">
            {plans.data.data.map((plan) => {
              const isCurrent = plan.code === current?.code;
              return (
                <li key={plan.code}>
                  <Card as="article" className={`h-full ${isCurrent ? 'border-accent' : ''}`}>
                    <h3 className="text-lead font-semibold">
                      {plan.name}{' '}
                      {isCurrent ? <span className="text-small text-accent">(current)</span> : null}
                    </h3>
                    <p className="text-display font-semibold tabular-nums">
                      {formatMoney(plan.monthlyPriceCents)}
                      <span className="text-small font-normal text-ink-muted"> / month</span>
                    </p>
                    <p className="mt-1 text-small text-ink-muted">{plan.description}</p>
                    <ul className="mt-3 space-y-1 text-small">
                      <li>{formatCount(plan.includedCallsPerMonth)} live calls a month</li>
                      <li>{formatCount(plan.testCallsPerMonth)} test calls a month</li>
                      <li>
                        {plan.overagePricePer1000Cents === null
                          ? 'No overage: calls stop at the limit'
                          : `Overage ${formatMoney(plan.overagePricePer1000Cents)} per 1,000 calls`}
                      </li>
                      <li>
                        {formatCount(plan.ratePerSecond)} calls/s (bursts of{' '}
                        {formatCount(plan.burst)})
                      </li>
                      <li>
                        Test keys: {formatCount(plan.testKeyRatePerSecond)} calls/s (bursts of{' '}
                        {formatCount(plan.testKeyBurst)})
                      </li>
                      <li>{plan.features.seats} seats</li>
                      <li>
                        {plan.features.savedSetups === null
                          ? 'Unlimited saved setups'
                          : `${plan.features.savedSetups} saved setups`}
                      </li>
                      <li>
                        {plan.features.uploads ? 'Test-frame uploads' : 'No test-frame uploads'}
                      </li>
                    </ul>
                    {!isCurrent && plan.monthlyPriceCents > 0 ? (
                      <Button
                        className="mt-4"
                        disabled={checkout.isPending}
                        onClick={() => go(plan.code)}
                      >
                        {changeLabel(plan, current)} to {plan.name}
                      </Button>
                    ) : null}
                    {!isCurrent && plan.monthlyPriceCents === 0 && billing.data?.subscription ? (
                      <Button
                        variant="secondary"
                        className="mt-4"
                        onClick={() => setConfirmCancel(true)}
                      >
                        Cancel subscription
                      </Button>
                    ) : null}
                  </Card>
                </li>
              );
            })}
          </ul>
        )}
        {current && current.monthlyPriceCents > 0 && billing.data && !billing.data.subscription ? (
          // A paid plan set on the studio directly (no payments subscription): nothing to cancel.
          <p className="mt-3 text-small text-ink-muted">
            {current.name} is set on this studio without a subscription, so nothing is billed here
            and there is nothing to cancel. Choosing another paid plan starts a subscription.
          </p>
        ) : null}
        {billing.data?.subscription ? (
          <p className="mt-3 text-small text-ink-muted">
            {subscriptionState(billing.data.subscription.status)} The current billing period ends{' '}
            {formatDate(billing.data.subscription.currentPeriodEnd)}.
          </p>
        ) : null}
        <p className="mt-2 text-caption text-ink-muted">
          Changing plan opens the payments page; you come back here when it’s done.
        </p>
      </section>
      <section aria-labelledby="invoices-heading">
        <h2 id="invoices-heading" className="mb-3 text-title font-semibold">
          Invoices
        </h2>
        {invoices.isPending ? (
          <PageLoading />
        ) : invoices.isError ? (
          <Notice tone="fault">{problemMessage(invoices.error)}</Notice>
        ) : (
          <DataTable
            caption="Invoices"
            columns={invoiceColumns}
            data={invoices.data.data}
            getRowId={(i) => i.id}
            empty="No invoices yet."
            narrow="scroll"
          />
        )}
      </section>
      <ConfirmDialog
        open={confirmCancel}
        title="Cancel the subscription?"
        description={cancelDescription(
          plans.data?.data.find((plan) => plan.monthlyPriceCents === 0),
        )}
        confirmLabel="Cancel subscription"
        pending={cancel.isPending}
        error={cancel.isError ? problemMessage(cancel.error) : null}
        onClose={() => setConfirmCancel(false)}
        onConfirm={() => cancel.mutate(undefined, { onSuccess: () => setConfirmCancel(false) })}
      />
    </div>
  );
}
