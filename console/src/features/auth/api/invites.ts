import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import { authKeys, type Me } from './me';

export type InvitePreview = components['schemas']['InvitePreviewResponseDto'];
export type AcceptInviteBody = components['schemas']['AcceptInviteRequestDto'];

/** POST /v1/invites/preview: which studio, role and address an invite token is for. */
export function previewInvite(token: string, signal?: AbortSignal): Promise<InvitePreview> {
  return unwrap(client.POST('/v1/invites/preview', { body: { token }, signal }));
}

export function invitePreviewQueryOptions(token: string) {
  return queryOptions({
    queryKey: authKeys.invite(token),
    queryFn: ({ signal }) => previewInvite(token, signal),
    retry: false,
  });
}

export function useInvitePreview(token: string) {
  return useQuery({ ...invitePreviewQueryOptions(token), enabled: token !== '' });
}

/** POST /v1/invites/accept: joins the studio (creating the account when needed) and signs in. */
export function acceptInvite(body: AcceptInviteBody): Promise<Me> {
  return unwrap(client.POST('/v1/invites/accept', { body }));
}

export function useAcceptInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvite,
    onSuccess: (me) => {
      queryClient.clear();
      queryClient.setQueryData(authKeys.me(), me);
    },
  });
}
