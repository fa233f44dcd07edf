import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type SavedSetupSummary = components['schemas']['SavedSetupSummaryDto'];
export type SavedSetup = components['schemas']['SavedSetupResponseDto'];
export type SavedSetupPage = components['schemas']['SavedSetupPageResponseDto'];
export type CreateSavedSetupBody = components['schemas']['CreateSavedSetupRequestDto'];
export type UpcomingSetups = components['schemas']['UpcomingSetupsResponseDto'];

export interface SetupListFilter {
  q?: string;
  cursor?: string;
}

/** Query keys for saved setups; every mutation invalidates `setupKeys.all`. */
export const setupKeys = {
  all: ['setups'] as const,
  list: (filter: SetupListFilter) => [...setupKeys.all, 'list', filter] as const,
  upcoming: (limit: number) => [...setupKeys.all, 'upcoming', limit] as const,
};

/** GET /v1/setups: newest first; `q` searches name, venue and notes. */
export function listSetups(filter: SetupListFilter, signal?: AbortSignal): Promise<SavedSetupPage> {
  return unwrap(
    client.GET('/v1/setups', {
      params: { query: { limit: 20, q: filter.q || undefined, cursor: filter.cursor } },
      signal,
    }),
  );
}
export function setupsQueryOptions(filter: SetupListFilter) {
  return queryOptions({
    queryKey: setupKeys.list(filter),
    queryFn: ({ signal }) => listSetups(filter, signal),
    placeholderData: keepPreviousData,
  });
}
export function useSetups(filter: SetupListFilter) {
  return useQuery(setupsQueryOptions(filter));
}

/** GET /v1/setups/upcoming: the next shoots, soonest first. */
export function useUpcomingSetups(limit = 3) {
  return useQuery({
    queryKey: setupKeys.upcoming(limit),
    queryFn: ({ signal }) =>
      unwrap(client.GET('/v1/setups/upcoming', { params: { query: { limit } }, signal })),
  });
}

function useSetupMutation<TInput, TResult>(fn: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupKeys.all }),
  });
}

/** POST /v1/setups: the server plans the setup from the inputs and stores both. */
export function createSetup(body: CreateSavedSetupBody): Promise<SavedSetup> {
  return unwrap(client.POST('/v1/setups', { body }));
}
export const useCreateSetup = () => useSetupMutation(createSetup);

/** POST /v1/setups/{id}/duplicate */
export function duplicateSetup(input: { id: string; name: string }): Promise<SavedSetup> {
  return unwrap(
    client.POST('/v1/setups/{id}/duplicate', {
      params: { path: { id: input.id } },
      body: { name: input.name },
    }),
  );
}
export const useDuplicateSetup = () => useSetupMutation(duplicateSetup);

/** DELETE /v1/setups/{id} */
export function deleteSetup(id: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/setups/{id}', { params: { path: { id } } }));
}
export const useDeleteSetup = () => useSetupMutation(deleteSetup);

/** The printable shot sheet (server-rendered HTML), opened in its own tab. */
export function setupSheetHref(id: string): string {
  return `/v1/setups/${encodeURIComponent(id)}/sheet`;
}
