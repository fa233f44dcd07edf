import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type OpenedSetup = components['schemas']['SavedSetupResponseDto'];
export type SavedSetupInputs = components['schemas']['SavedSetupInputsDto'];
export type NewSavedSetup = components['schemas']['CreateSavedSetupRequestDto'];

/** Keys under `['setups']`, so saving here also refreshes the Setups page's list. */
export const savedSetupKeys = {
  all: ['setups'] as const,
  detail: (id: string) => [...savedSetupKeys.all, 'detail', id] as const,
};

/** GET /v1/setups/{id}: one saved setup with its inputs, to reopen in the playground. */
export function fetchSavedSetup(id: string, signal?: AbortSignal): Promise<OpenedSetup> {
  return unwrap(client.GET('/v1/setups/{id}', { params: { path: { id } }, signal }));
}

export function savedSetupQueryOptions(id: string) {
  return queryOptions({
    queryKey: savedSetupKeys.detail(id),
    queryFn: ({ signal }) => fetchSavedSetup(id, signal),
    retry: false,
    staleTime: Infinity,
    refetchOnWindowFocus: false,
  });
}

/** Runs only when `id` is set (the URL named a setup). */
export function useSavedSetup(id: string | null) {
  return useQuery({ ...savedSetupQueryOptions(id ?? ''), enabled: !!id });
}

/** POST /v1/setups: the server plans the setup from the inputs and stores both. */
export function saveSetup(body: NewSavedSetup): Promise<OpenedSetup> {
  return unwrap(client.POST('/v1/setups', { body }));
}

export function useSaveSetup() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveSetup,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: savedSetupKeys.all }),
  });
}
