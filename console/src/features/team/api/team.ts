import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type Member = components['schemas']['MemberResponseDto'];
export type Invite = components['schemas']['InviteResponseDto'];
export type TeamRole = Member['role'];
export type CreateInviteBody = components['schemas']['CreateInviteRequestDto'];
export type Seats = components['schemas']['SeatsResponseDto'];

/** Query keys for the team; every mutation invalidates `teamKeys.all`. */
export const teamKeys = {
  all: ['team'] as const,
  members: () => [...teamKeys.all, 'members'] as const,
  invites: () => [...teamKeys.all, 'invites'] as const,
};

/** GET /v1/team/members */
export function listMembers(signal?: AbortSignal) {
  return unwrap(client.GET('/v1/team/members', { signal }));
}
export function membersQueryOptions() {
  return queryOptions({
    queryKey: teamKeys.members(),
    queryFn: ({ signal }) => listMembers(signal),
  });
}
export function useMembers() {
  return useQuery(membersQueryOptions());
}

/** GET /v1/team/invites */
export function listInvites(signal?: AbortSignal) {
  return unwrap(client.GET('/v1/team/invites', { signal }));
}
export function invitesQueryOptions() {
  return queryOptions({
    queryKey: teamKeys.invites(),
    queryFn: ({ signal }) => listInvites(signal),
  });
}
export function useInvites() {
  return useQuery(invitesQueryOptions());
}

function useTeamMutation<TInput, TResult>(fn: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}

/** POST /v1/team/invites: e-mails an invitation valid for 7 days; 409 when the seats are full. */
export function createInvite(body: CreateInviteBody): Promise<Invite> {
  return unwrap(client.POST('/v1/team/invites', { body }));
}
/** A refusal refreshes the team too: the seats may have been taken from another tab or person. */
export function useCreateInvite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createInvite,
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }),
  });
}

/** Every seat is taken: members plus pending invitations reach the plan's seats. */
export const seatsFull = (seats: Seats) => seats.used >= seats.limit;

/** POST /v1/team/invites/{id}/resend: a fresh link and a fresh 7 days. */
export function resendInvite(id: string): Promise<Invite> {
  return unwrap(client.POST('/v1/team/invites/{id}/resend', { params: { path: { id } } }));
}
export const useResendInvite = () => useTeamMutation(resendInvite);

/** DELETE /v1/team/invites/{id}: the link stops working. */
export function cancelInvite(id: string): Promise<Invite> {
  return unwrap(client.DELETE('/v1/team/invites/{id}', { params: { path: { id } } }));
}
export const useCancelInvite = () => useTeamMutation(cancelInvite);

/** PATCH /v1/team/members/{userId}: not your own (403); the last owner can't be demoted (409). */
export function changeMemberRole(input: { userId: string; role: TeamRole }): Promise<Member> {
  return unwrap(
    client.PATCH('/v1/team/members/{userId}', {
      params: { path: { userId: input.userId } },
      body: { role: input.role },
    }),
  );
}
export const useChangeMemberRole = () => useTeamMutation(changeMemberRole);

/** DELETE /v1/team/members/{userId}: the last owner can't be removed (409). */
export function removeMember(userId: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/team/members/{userId}', { params: { path: { userId } } }));
}
export const useRemoveMember = () => useTeamMutation(removeMember);
