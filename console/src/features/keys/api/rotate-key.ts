import { useMutation, useQueryClient } from '@tanstack/react-query';
import { client, unwrap } from '@/lib/api';
import { keyKeys, type ApiKeyCreated } from './keys';

/** POST /v1/keys/{id}/rotate: a new secret; the old one keeps working for the grace period. */
export function rotateKey(input: {
  id: string;
  gracePeriodSeconds: number;
}): Promise<ApiKeyCreated> {
  return unwrap(
    client.POST('/v1/keys/{id}/rotate', {
      params: { path: { id: input.id } },
      body: { gracePeriodSeconds: input.gracePeriodSeconds },
    }),
  );
}

export function useRotateKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: rotateKey,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: keyKeys.all }),
  });
}
