import { useMutation, useQueryClient } from '@tanstack/react-query';
import { client, unwrap } from '@/lib/api';
import { keyKeys, type ApiKey } from './keys';

/** DELETE /v1/keys/{id}: the key stops working on the very next request. */
export function revokeKey(id: string): Promise<ApiKey> {
  return unwrap(client.DELETE('/v1/keys/{id}', { params: { path: { id } } }));
}

export function useRevokeKey() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeKey,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: keyKeys.all }),
  });
}
