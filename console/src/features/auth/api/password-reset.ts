import { useMutation } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type PasswordResetConfirmBody = components['schemas']['PasswordResetConfirmRequestDto'];

/** POST /v1/auth/password-reset: e-mails a single-use link (the answer never says if the address exists). */
export function requestPasswordReset(email: string): Promise<unknown> {
  return unwrap(client.POST('/v1/auth/password-reset', { body: { email } }));
}

/** POST /v1/auth/password-reset/confirm: sets the new password with the e-mailed token. */
export function confirmPasswordReset(body: PasswordResetConfirmBody): Promise<unknown> {
  return unwrap(client.POST('/v1/auth/password-reset/confirm', { body }));
}

/** POST /v1/auth/email-change/confirm: completes an e-mail change with the e-mailed token. */
export function confirmEmailChange(token: string): Promise<unknown> {
  return unwrap(client.POST('/v1/auth/email-change/confirm', { body: { token } }));
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}

export function useConfirmEmailChange() {
  return useMutation({ mutationFn: confirmEmailChange });
}
