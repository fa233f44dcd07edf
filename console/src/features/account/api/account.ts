import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import { meQueryKey, type Me } from '@/lib/me';

export type UpdateProfileBody = components['schemas']['UpdateProfileRequestDto'];
export type EmailChangeBody = components['schemas']['EmailChangeRequestDto'];
export type ChangePasswordBody = components['schemas']['ChangePasswordRequestDto'];
export type MyOrganization = components['schemas']['MyOrganizationResponseDto'];

export const accountKeys = {
  all: ['account'] as const,
  organizations: () => [...accountKeys.all, 'organizations'] as const,
};

/** PATCH /v1/me: a new name and/or preferences; answers like GET /v1/me, which it replaces. */
export function updateMe(body: UpdateProfileBody): Promise<Me> {
  return unwrap(client.PATCH('/v1/me', { body }));
}
export function useUpdateMe() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateMe,
    scope: { id: 'me-preferences' },
    onSuccess: (me) => queryClient.setQueryData(meQueryKey, me),
  });
}

export type EmailState = components['schemas']['EmailStateResponseDto'];

/** GET /v1/me/email: the sign-in address and a change still waiting for its link, if any. */
export function getEmailState(signal?: AbortSignal): Promise<EmailState> {
  return unwrap(client.GET('/v1/me/email', { signal }));
}
export function useEmailState() {
  return useQuery({
    queryKey: [...accountKeys.all, 'email'],
    queryFn: ({ signal }) => getEmailState(signal),
  });
}

/** POST /v1/me/email: a confirmation link goes to the new address; nothing changes until it is opened. */
export function requestEmailChange(body: EmailChangeBody) {
  return unwrap(client.POST('/v1/me/email', { body }));
}
export function useRequestEmailChange() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: requestEmailChange,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...accountKeys.all, 'email'] }),
  });
}

/** POST /v1/me/password: the current password and a new one; the account's other sessions end. */
export function changePassword(body: ChangePasswordBody): Promise<unknown> {
  return unwrap(client.POST('/v1/me/password', { body }));
}
export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}

/** POST /v1/auth/sign-out-everywhere: every session of the account ends, this one included. */
export function signOutEverywhere(): Promise<unknown> {
  return unwrap(client.POST('/v1/auth/sign-out-everywhere'));
}
export function useSignOutEverywhere() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOutEverywhere,
    // This session is over too: nothing of it may stay in the cache.
    onSuccess: () => queryClient.clear(),
  });
}

/** GET /v1/me/organizations: every studio the user belongs to, the role in each, which is current. */
export function listMyOrganizations(signal?: AbortSignal) {
  return unwrap(client.GET('/v1/me/organizations', { signal }));
}
export function myOrganizationsQueryOptions() {
  return queryOptions({
    queryKey: accountKeys.organizations(),
    queryFn: ({ signal }) => listMyOrganizations(signal),
  });
}
export function useMyOrganizations() {
  return useQuery(myOrganizationsQueryOptions());
}

/** POST /v1/me/organization: this session now acts for another studio the user belongs to. */
export function switchOrganization(organizationId: string): Promise<Me> {
  return unwrap(client.POST('/v1/me/organization', { body: { organizationId } }));
}
export function useSwitchOrganization() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: switchOrganization,
    onSuccess: async (me) => {
      queryClient.setQueryData(meQueryKey, me);
      // Everything else cached belongs to the studio left behind: drop it, refetching what is shown.
      await queryClient.resetQueries({
        predicate: (query) => query.queryKey[0] !== meQueryKey[0],
      });
    },
  });
}
