import { useMutation, useQueryClient } from '@tanstack/react-query';
import { client, unwrap } from '@/lib/api';

/** POST /v1/auth/sign-out: ends this session. */
export function signOut(): Promise<unknown> {
  return unwrap(client.POST('/v1/auth/sign-out'));
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Nothing of the old session may linger in the cache for the next person at this screen.
    onSettled: () => queryClient.clear(),
  });
}
