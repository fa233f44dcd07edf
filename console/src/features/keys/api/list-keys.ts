import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { client, unwrap } from '@/lib/api';
import { KEYS_PAGE_SIZE, keyKeys, type ApiKeyPage } from './keys';

/** GET /v1/keys: one page of keys (never their secrets), newest first. */
export function listKeys(cursor: string | undefined, signal?: AbortSignal): Promise<ApiKeyPage> {
  return unwrap(
    client.GET('/v1/keys', { params: { query: { limit: KEYS_PAGE_SIZE, cursor } }, signal }),
  );
}

export function keysQueryOptions(cursor: string | undefined) {
  return queryOptions({
    queryKey: keyKeys.list(cursor),
    queryFn: ({ signal }) => listKeys(cursor, signal),
    placeholderData: keepPreviousData,
  });
}

export function useKeys(cursor: string | undefined) {
  return useQuery(keysQueryOptions(cursor));
}
