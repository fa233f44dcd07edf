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

/** A key's name and environment, for labelling usage by key. */
export interface KeyLabel {
  id: string;
  name: string;
  environment: string;
  status: string;
}

// Module-level, so the labels keep their identity between renders while the data is unchanged.
const toLabels = (page: ApiKeyPage): KeyLabel[] =>
  page.data.map((k) => ({ id: k.id, name: k.name, environment: k.environment, status: k.status }));

/**
 * The keys this member may see (owners and admins: all; developers: their own), up to 100, as
 * labels. Usage by other members' keys stays labelled by id.
 */
export function useKeyLabels(enabled = true) {
  return useQuery({
    queryKey: [...keyKeys.lists(), 'labels'] as const,
    queryFn: ({ signal }) =>
      unwrap(client.GET('/v1/keys', { params: { query: { limit: 100 } }, signal })),
    select: toLabels,
    enabled,
  });
}
