import { useMutation, useQueryClient } from '@tanstack/react-query';
import { client, unwrap } from '@/lib/api';
import { keyKeys, type ApiKeyCreated, type CreateApiKeyBody } from './keys';

/** POST /v1/keys: the answer carries the secret, the only time it is ever sent. */
export function createKey(body: CreateApiKeyBody): Promise<ApiKeyCreated> {
  return unwrap(client.POST('/v1/keys', { body }));
}

export function useCreateKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createKey,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: keyKeys.all }),
  });
}
