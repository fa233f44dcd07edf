import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiProblem, api } from '@/lib/api';

/** Terminus-style health report from GET /v1/health. */
export interface HealthReport {
  status: 'ok' | 'error' | 'shutting_down';
  info?: Record<string, { status: 'up' | 'down'; [detail: string]: unknown }>;
  error?: Record<string, { status: 'up' | 'down'; [detail: string]: unknown }>;
  details?: Record<string, { status: 'up' | 'down'; [detail: string]: unknown }>;
}

export type ApiStatus = { state: 'up' } | { state: 'down'; reason: string };

/** Any non-2xx, an unreachable server, or a down dependency counts as down. */
export async function getApiStatus(signal?: AbortSignal): Promise<ApiStatus> {
  try {
    const report = await api.get<HealthReport>('/v1/health', { signal });
    const downChecks = Object.entries({ ...report?.details, ...report?.info, ...report?.error })
      .filter(([, check]) => check?.status !== 'up')
      .map(([name]) => name);
    if (report?.status !== 'ok' || downChecks.length > 0) {
      return {
        state: 'down',
        reason: downChecks.length ? `${downChecks.join(', ')} down` : 'unhealthy',
      };
    }
    return { state: 'up' };
  } catch (error) {
    if (error instanceof ApiProblem) {
      return { state: 'down', reason: error.unreachable ? 'unreachable' : `HTTP ${error.status}` };
    }
    throw error;
  }
}

export const healthKeys = {
  all: ['health'] as const,
  status: () => [...healthKeys.all, 'status'] as const,
};

export const HEALTH_REFRESH_MS = 30_000;

export function apiStatusQueryOptions() {
  return queryOptions({
    queryKey: healthKeys.status(),
    queryFn: ({ signal }) => getApiStatus(signal),
    refetchInterval: HEALTH_REFRESH_MS,
    staleTime: 10_000,
    retry: false,
  });
}

export function useApiStatus() {
  return useQuery(apiStatusQueryOptions());
}
