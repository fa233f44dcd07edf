import type { MembershipEntity } from '../organizations/membership.entity.js';
import type { InviteResponseDto, MemberResponseDto, SeatsResponseDto } from './dto/team.dto.js';
import type { InviteEntity } from './invite.entity.js';
import type { SeatUsage } from './seats.js';

export function inviteStatus(i: InviteEntity, now = new Date()): InviteResponseDto['status'] {
  if (i.acceptedAt) return 'accepted';
  if (i.canceledAt) return 'canceled';
  return i.expiresAt <= now ? 'expired' : 'pending';
}

export const toInviteDto = (i: InviteEntity): InviteResponseDto => ({
  id: i.id,
  email: i.email,
  role: i.role,
  status: inviteStatus(i),
  invitedBy: i.invitedBy?.name ?? null,
  expiresAt: i.expiresAt.toISOString(),
  lastSentAt: i.lastSentAt.toISOString(),
  createdAt: i.createdAt.toISOString(),
});

export const toMemberDto = (m: MembershipEntity): MemberResponseDto => ({
  userId: m.userId,
  name: m.user?.name ?? '',
  email: m.user?.email ?? '',
  role: m.role,
  joinedAt: m.createdAt.toISOString(),
});

export const toSeatsDto = (u: SeatUsage): SeatsResponseDto => ({
  limit: u.seats,
  used: u.used,
  members: u.members,
  pendingInvites: u.pendingInvites,
  planCode: u.planCode,
  planName: u.planName,
});
