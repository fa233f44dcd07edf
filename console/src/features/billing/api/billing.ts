import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type Plan = components['schemas']['PlanListResponseDto']['data'][number];
export type Invoice = components['schemas']['InvoiceResponseDto'];
export type Checkout = components['schemas']['CheckoutResponseDto'];

/**
 * GET /v1/billing has no response schema in the spec; this is the shape the server's mapper
 * (toBillingDto) sends.
 */
export interface BillingOverview {
  plan: Plan;
  subscription: {
    id: string;
    planCode: string;
    status: string;
    currentPeriodStart: string | null;
    currentPeriodEnd: string | null;
  } | null;
  openCheckout: Omit<Checkout, 'change'> | null;
}

/** Query keys for billing; every mutation invalidates billing and the current plan. */
export const billingKeys = {
  all: ['billing'] as const,
  overview: () => [...billingKeys.all, 'overview'] as const,
  invoices: () => [...billingKeys.all, 'invoices'] as const,
  plans: () => ['plans', 'list'] as const,
};

export const plansQueryOptions = () =>
  queryOptions({
    queryKey: billingKeys.plans(),
    queryFn: ({ signal }) => unwrap(client.GET('/v1/plans', { signal })),
    staleTime: 5 * 60_000,
  });
export const usePlans = () => useQuery(plansQueryOptions());

export const billingQueryOptions = () =>
  queryOptions({
    queryKey: billingKeys.overview(),
    queryFn: async ({ signal }) =>
      (await unwrap(client.GET('/v1/billing', { signal }))) as unknown as BillingOverview,
  });
export const useBilling = () => useQuery(billingQueryOptions());

export const invoicesQueryOptions = () =>
  queryOptions({
    queryKey: billingKeys.invoices(),
    queryFn: ({ signal }) => unwrap(client.GET('/v1/billing/invoices', { signal })),
  });
export const useInvoices = () => useQuery(invoicesQueryOptions());

/** POST /v1/billing/checkout: a hosted checkout page for the new plan. */
export function startCheckout(planCode: string): Promise<Checkout> {
  return unwrap(client.POST('/v1/billing/checkout', { body: { planCode } }));
}
export function useStartCheckout() {
  return useMutation({ mutationFn: startCheckout });
}

/** POST /v1/billing/cancel: back to the free plan. */
export function cancelSubscription() {
  return unwrap(client.POST('/v1/billing/cancel'));
}
export function useCancelSubscription() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelSubscription,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: billingKeys.all });
      await queryClient.invalidateQueries({ queryKey: ['plans'] });
    },
  });
}
