// The plan's `seats`: members plus pending invitations (not accepted, not canceled, not expired).
// Checked with the organisation's row locked, so two invitations or two acceptances racing for the
// last seat serialise and only one of them gets it; a plan change (webhook) waits on the same lock.
import type { DataSource, EntityManager } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';

export interface SeatUsage {
  /** The plan's seats. */
  seats: number;
  planCode: string;
  planName: string;
  members: number;
  /** Invitations that can still be accepted. */
  pendingInvites: number;
  /** members + pendingInvites. */
  used: number;
}

interface SeatRow {
  code: string;
  name: string;
  seats: number;
  members: number;
  pending: number;
}

/**
 * Where the organisation stands. With `lock` (inside a transaction) the organisation's row is held
 * until commit; `exceptInviteId` leaves one invitation out of the pending count.
 */
export async function seatUsage(
  em: EntityManager | DataSource,
  organizationId: string,
  opts: { lock?: boolean; exceptInviteId?: string } = {},
): Promise<SeatUsage> {
  // FOR NO KEY UPDATE conflicts with itself and with plan changes, but not with the key-share
  // locks that inserts of keys, setups or usage take on the organisation.
  if (opts.lock) {
    await em.query(`SELECT id FROM organizations WHERE id = $1 FOR NO KEY UPDATE`, [
      organizationId,
    ]);
  }
  const rows: SeatRow[] = await em.query(
    `SELECT p.code, p.name, p.seats,
            (SELECT count(*)::int FROM memberships WHERE organization_id = $1) AS members,
            (SELECT count(*)::int FROM invites
              WHERE organization_id = $1 AND accepted_at IS NULL AND canceled_at IS NULL
                AND expires_at > now() AND id IS DISTINCT FROM $2::uuid) AS pending
       FROM plans p
      WHERE p.code = coalesce((SELECT plan_code FROM organizations WHERE id = $1), 'free')
         OR p.code = 'free'
      ORDER BY (p.code = 'free')
      LIMIT 1`,
    [organizationId, opts.exceptInviteId ?? null],
  );
  const r = rows[0];
  if (!r) throw new Error('the plans table has no free plan');
  return {
    seats: r.seats,
    planCode: r.code,
    planName: r.name,
    members: r.members,
    pendingInvites: r.pending,
    used: r.members + r.pending,
  };
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** The problem's machine-readable part, shared by every seat refusal. */
const seatFields = (u: SeatUsage) => ({
  limit: 'seats',
  limitValue: u.seats,
  count: u.used,
  members: u.members,
  pendingInvites: u.pendingInvites,
  planCode: u.planCode,
});

/** A new pending invitation needs a free seat (members + pending invitations < seats). */
export function assertSeatForInvite(u: SeatUsage): void {
  if (u.used < u.seats) return;
  throw new DomainError(
    'conflict',
    `Your plan has ${plural(u.seats, 'seat')}: ${plural(u.members, 'member')} and ${plural(u.pendingInvites, 'pending invite')}. Remove a member, cancel an invite or change plan.`,
    [],
    {},
    seatFields(u),
  );
}

/**
 * Accepting turns the caller's own pending invitation into a member, so only members count here:
 * the seat is refused when the members already fill the plan (e.g. the plan was lowered since).
 */
export function assertSeatForAccept(u: SeatUsage, organizationName: string, until: Date): void {
  if (u.members < u.seats) return;
  throw new DomainError(
    'conflict',
    `${organizationName} has no free seat: its plan has ${plural(u.seats, 'seat')} and ${plural(u.members, 'member')}. Ask the person who invited you to free a seat or change plan; this invitation stays valid until ${until.toUTCString()}.`,
    [],
    {},
    seatFields(u),
  );
}

/** A plan change asked for from the console must leave every member a seat. */
export function assertSeatsForPlan(
  u: SeatUsage,
  target: { code: string; name: string; seats: number },
): void {
  if (u.members <= target.seats) return;
  const over = u.members - target.seats;
  throw new DomainError(
    'conflict',
    `The ${target.name} plan has ${plural(target.seats, 'seat')} and your studio has ${plural(u.members, 'member')}. Remove ${plural(over, 'member')} before changing to ${target.name}.`,
    [{ field: 'planCode', reason: `has ${plural(target.seats, 'seat')}, fewer than your members` }],
    {},
    { ...seatFields(u), limitValue: target.seats, planCode: target.code, removeMembers: over },
  );
}
