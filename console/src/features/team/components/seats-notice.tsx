import { Link } from 'react-router-dom';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { useCan } from '@/lib/session';
import { seatsFull, type Seats } from '../api/team';

const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** "3 of 10 seats used": members plus pending invitations against the plan's seats. */
export function SeatsSummary({ seats }: { seats: Seats }) {
  return (
    <p className="text-small text-ink-muted" data-testid="seats-summary">
      <span className="font-semibold text-ink tabular-nums">
        {seats.used} of {count(seats.limit, 'seat')} used
      </span>{' '}
      ({count(seats.members, 'member')}, {count(seats.pendingInvites, 'pending invitation')}) on the{' '}
      {seats.planName} plan.
    </p>
  );
}

/** Why the invitation form is closed, and the way out. */
export function SeatsFullNotice({ seats, id }: { seats: Seats; id?: string }) {
  const canChangePlan = useCan('billing:manage');
  if (!seatsFull(seats)) return null;
  const over = seats.members - seats.limit;
  return (
    <div id={id}>
      <Notice tone="caution">
        <strong>
          {over > 0
            ? `Your studio has ${count(seats.members, 'member')}, more than the ${count(seats.limit, 'seat')} of the ${seats.planName} plan.`
            : `All ${count(seats.limit, 'seat')} of the ${seats.planName} plan are taken.`}
        </strong>{' '}
        {over > 0
          ? `Everyone keeps access, but nobody new can join until ${count(over + 1, 'member')} ${over + 1 === 1 ? 'is' : 'are'} removed or the plan changes.`
          : 'To invite someone, remove a member or cancel a pending invitation, or change plan.'}{' '}
        {canChangePlan ? (
          <>
            Plans are on the <Link to={paths.billing}>Billing</Link> page.
          </>
        ) : (
          'An owner can change the plan on the Billing page.'
        )}
      </Notice>
    </div>
  );
}
