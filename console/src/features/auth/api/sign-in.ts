import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import { authKeys, type Me } from './me';

export type SignInBody = components['schemas']['SignInRequestDto'];

/** POST /v1/auth/sign-in: starts a session (a new cookie) and answers like GET /v1/me. */
export function signIn(body: SignInBody): Promise<Me> {
  return unwrap(client.POST('/v1/auth/sign-in', { body }));
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (me) => {
      // Another account may have been cached in this tab: start clean, then seed /v1/me.
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
