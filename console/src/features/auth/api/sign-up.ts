import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import { authKeys, type Me } from './me';

export type SignUpBody = components['schemas']['SignUpRequestDto'];

/** POST /v1/auth/sign-up: creates the user, the studio and the owner membership, signs in. */
export function signUp(body: SignUpBody): Promise<Me> {
  return unwrap(client.POST('/v1/auth/sign-up', { body }));
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
