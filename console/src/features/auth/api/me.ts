import { queryOptions, useQuery } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type Me = components['schemas']['MeResponseDto'];

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
  invite: (token: string) => [...authKeys.all, 'invite', token] as const,
};

/** GET /v1/me: who is signed in, in which organisation, with which role. */
export function getMe(signal?: AbortSignal): Promise<Me> {
  return unwrap(client.GET('/v1/me', { signal }));
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
    retry: false,
  });
}

export function useMe() {
  return useQuery(meQueryOptions());
}
