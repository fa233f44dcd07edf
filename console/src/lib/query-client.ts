import { QueryClient } from '@tanstack/react-query';
import { ApiProblem } from './api';

/** Client errors (4xx) won't succeed on a retry; network trouble and 5xx might. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiProblem && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { staleTime: 30_000, retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
}
