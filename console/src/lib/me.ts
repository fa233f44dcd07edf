import { queryOptions } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from './api';

/**
 * GET /v1/me lives here, below the features, because more than one feature reads it: the auth
 * feature (who is signed in) and the playground (the user's saved length unit).
 */
export type Me = components['schemas']['MeResponseDto'];
export type UserPreferences = Me['preferences'];

export const meQueryKey = ['auth', 'me'] as const;

/** GET /v1/me: who is signed in, in which organisation, with which role and preferences. */
export function getMe(signal?: AbortSignal): Promise<Me> {
  return unwrap(client.GET('/v1/me', { signal }));
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
    retry: false,
  });
}

/** PATCH /v1/me with new preferences; answers like GET /v1/me. */
export function savePreferences(preferences: UserPreferences): Promise<Me> {
  return unwrap(client.PATCH('/v1/me', { body: { preferences } }));
}
