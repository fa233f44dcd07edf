import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import { meQueryKey, type Me } from '@/lib/me';

export type Organization = components['schemas']['OrganizationResponseDto'];
export type StudioMember = components['schemas']['MemberResponseDto'];

export const studioKeys = {
  all: ['studio'] as const,
  members: () => [...studioKeys.all, 'members'] as const,
};

/** PATCH /v1/organization `{name}` (owner): the renamed studio, copied into the cached /v1/me. */
export function renameStudio(name: string): Promise<Organization> {
  return unwrap(client.PATCH('/v1/organization', { body: { name } }));
}
export function useRenameStudio() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: renameStudio,
    onSuccess: async (organization) => {
      queryClient.setQueryData<Me>(meQueryKey, (me) => (me ? { ...me, organization } : me));
      // Lists that name the studio (your studios on the account page) read it again.
      await queryClient.invalidateQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
    },
  });
}

/** GET /v1/team/members: who ownership can go to (the owner holds `team:manage`). */
export function listStudioMembers(signal?: AbortSignal) {
  return unwrap(client.GET('/v1/team/members', { signal }));
}
export function studioMembersQueryOptions() {
  return queryOptions({
    queryKey: studioKeys.members(),
    queryFn: ({ signal }) => listStudioMembers(signal),
  });
}
export function useStudioMembers() {
  return useQuery(studioMembersQueryOptions());
}

/** POST /v1/organization/transfer-ownership `{userId}` (owner): they become owner, you admin. */
export function transferOwnership(userId: string): Promise<unknown> {
  return unwrap(client.POST('/v1/organization/transfer-ownership', { body: { userId } }));
}
export function useTransferOwnership() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: transferOwnership,
    // Your role and permissions changed, and so did the team's roles: read everything again.
    onSuccess: () => queryClient.invalidateQueries(),
  });
}

/** DELETE /v1/organization `{confirmName}` (owner): the studio and this session end. */
export function deleteStudio(confirmName: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/organization', { body: { confirmName } }));
}
export function useDeleteStudio() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteStudio,
    onSuccess: () => queryClient.clear(),
  });
}
