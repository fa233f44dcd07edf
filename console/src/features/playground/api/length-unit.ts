import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meQueryKey, savePreferences, type Me } from '@/lib/me';
import type { DisplayUnit } from '../hooks/use-length-unit';

const mutationKey = ['me', 'preferences', 'lengthUnit'] as const;

/**
 * PATCH /v1/me `{preferences: {lengthUnit}}`, shown at once (optimistic) in the cached /v1/me and
 * rolled back if the server refuses. Saves run one after another (`scope`), and only the last one
 * to finish writes the server's answer, so quick toggling never flickers back.
 */
export function useSaveLengthUnit() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationKey,
    scope: { id: 'me-preferences' },
    mutationFn: (lengthUnit: DisplayUnit) => savePreferences({ lengthUnit }),
    onMutate: async (lengthUnit) => {
      await queryClient.cancelQueries({ queryKey: meQueryKey });
      const before = queryClient.getQueryData<Me>(meQueryKey);
      if (before) {
        queryClient.setQueryData<Me>(meQueryKey, {
          ...before,
          preferences: { ...before.preferences, lengthUnit },
        });
      }
      return { before };
    },
    onError: (_error, _unit, context) => {
      if (context?.before) queryClient.setQueryData(meQueryKey, context.before);
    },
    onSuccess: (me) => {
      if (queryClient.isMutating({ mutationKey }) <= 1) queryClient.setQueryData(meQueryKey, me);
    },
  });
}
