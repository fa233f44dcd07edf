import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { components, paths } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type UsageSummary = components['schemas']['UsageSummaryResponseDto'];
export type UsageEvent = UsageEventPage['data'][number];
export type CurrentPlan = components['schemas']['CurrentPlanResponseDto'];
export type UsageEventFilter = NonNullable<paths['/v1/usage/events']['get']['parameters']['query']>;
export type UsageSummaryFilter = NonNullable<
  paths['/v1/usage/summary']['get']['parameters']['query']
>;
export type Endpoint = NonNullable<UsageEventFilter['endpoint']>;
type UsageEventPageRaw = components['schemas']['UsageEventPageResponseDto'];
// The spec gives nextCursor as string[] (a 3.1 type list read as 3.0); the server sends string | null.
export type UsageEventPage = Omit<UsageEventPageRaw, 'nextCursor'> & { nextCursor: string | null };

// Every metered endpoint the spec lists, in the filter's order: a new one in the spec fails the
// typecheck here until it is placed.
const ENDPOINT_ORDER = {
  twilight: 1,
  timeline: 2,
  exposure: 3,
  flash: 4,
  falloff: 5,
  backlight: 6,
  balance: 7,
  setup: 8,
  frames: 9,
} satisfies Record<Endpoint, number>;

export const ENDPOINTS = (Object.keys(ENDPOINT_ORDER) as Endpoint[]).sort(
  (a, b) => ENDPOINT_ORDER[a] - ENDPOINT_ORDER[b],
);

export const usageKeys = {
  all: ['usage'] as const,
  summary: (filter: UsageSummaryFilter) => [...usageKeys.all, 'summary', filter] as const,
  events: (filter: UsageEventFilter) => [...usageKeys.all, 'events', filter] as const,
  currentPlan: () => ['plans', 'current'] as const,
};

/**
 * GET /v1/usage/summary: totals by day, endpoint, key, status and source over a UTC range,
 * optionally for one key, endpoint or status.
 */
export function getUsageSummary(filter: UsageSummaryFilter, signal?: AbortSignal) {
  return unwrap(client.GET('/v1/usage/summary', { params: { query: filter }, signal }));
}
export function usageSummaryQueryOptions(filter: UsageSummaryFilter) {
  return queryOptions({
    queryKey: usageKeys.summary(filter),
    queryFn: ({ signal }) => getUsageSummary(filter, signal),
    placeholderData: keepPreviousData,
  });
}
export function useUsageSummary(filter: UsageSummaryFilter) {
  return useQuery(usageSummaryQueryOptions(filter));
}

/** GET /v1/usage/events: newest first, filtered, cursor-paged. */
export async function listUsageEvents(
  filter: UsageEventFilter,
  signal?: AbortSignal,
): Promise<UsageEventPage> {
  const page = await unwrap(client.GET('/v1/usage/events', { params: { query: filter }, signal }));
  return page as unknown as UsageEventPage;
}
export function usageEventsQueryOptions(filter: UsageEventFilter) {
  return queryOptions({
    queryKey: usageKeys.events(filter),
    queryFn: ({ signal }) => listUsageEvents(filter, signal),
    placeholderData: keepPreviousData,
  });
}
export function useUsageEvents(filter: UsageEventFilter) {
  return useQuery(usageEventsQueryOptions(filter));
}

/** GET /v1/plans/current: the plan and this month's calls against it. */
export function getCurrentPlan(signal?: AbortSignal) {
  return unwrap(client.GET('/v1/plans/current', { signal }));
}
export function currentPlanQueryOptions() {
  return queryOptions({
    queryKey: usageKeys.currentPlan(),
    queryFn: ({ signal }) => getCurrentPlan(signal),
  });
}
export function useCurrentPlan() {
  return useQuery(currentPlanQueryOptions());
}

/** The CSV export's address with the same filters (a plain link: the browser downloads it). */
export function usageCsvHref(filter: UsageEventFilter): string {
  const query = new URLSearchParams();
  for (const [name, value] of Object.entries(filter)) {
    if (value !== undefined && value !== '' && name !== 'cursor' && name !== 'limit') {
      query.set(name, String(value));
    }
  }
  const search = query.toString();
  return `/v1/usage/events.csv${search ? `?${search}` : ''}`;
}
