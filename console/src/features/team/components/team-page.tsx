import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { paths } from '@/config/paths';
import { problemMessage } from '@/lib/form-errors';
import { formatDate, formatDateTime } from '@/lib/format';
import { useSession } from '@/lib/session';
import {
  useCancelInvite,
  useChangeMemberRole,
  useInvites,
  useMembers,
  useRemoveMember,
  useResendInvite,
  type Invite,
  type Member,
  type TeamRole,
} from '../api/team';
import { InviteForm } from './invite-form';
import { ROLE_LABELS, roleOptions } from './roles';
import { SeatsSummary } from './seats-notice';
import { LoadError } from '@/components/ui/load-error';

const article = (role: TeamRole | undefined) => (role === 'owner' || role === 'admin' ? 'an' : 'a');

export function TeamPage() {
  const session = useSession();
  const isOwner = session?.role === 'owner';
  const myId = session?.user.id;
  const members = useMembers();
  const invites = useInvites();
  const changeRole = useChangeMemberRole();
  const remove = useRemoveMember();
  const resend = useResendInvite();
  const cancel = useCancelInvite();
  const [removing, setRemoving] = useState<Member | null>(null);
  // A role change is asked first: it widens or narrows what someone may do at once.
  const [changing, setChanging] = useState<{ member: Member; role: TeamRole } | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const onError = (error: unknown) => setActionError(problemMessage(error));

  const memberColumns = useMemo<DataColumn<Member>[]>(
    () => [
      { id: 'name', header: 'Name', accessorFn: (m) => m.name },
      { id: 'email', header: 'Email', accessorFn: (m) => m.email },
      {
        id: 'role',
        header: 'Role',
        cell: ({ row }) => {
          const member = row.original;
          // Nobody changes their own role (the server refuses it too): say who can.
          if (member.userId === myId) {
            return (
              <div className="flex flex-col gap-0.5">
                <span>{member.role}</span>
                <span className="text-small text-ink-muted">
                  {isOwner ? (
                    <>
                      Another owner can change your role, or you can hand the studio over with{' '}
                      <Link to={paths.studio}>Transfer ownership</Link> on the Studio page.
                    </>
                  ) : (
                    'Another admin or an owner can change your role.'
                  )}
                </span>
              </div>
            );
          }
          // Only owners may grant or take away the owner role.
          const editable = isOwner || member.role !== 'owner';
          if (!editable) return member.role;
          return (
            <select
              aria-label={`Role of ${member.name}`}
              value={member.role}
              className="rounded-control border border-edge-strong bg-panel px-2 py-1 text-small text-ink"
              onChange={(event) => {
                setActionError(null);
                setChanging({ member, role: event.target.value as TeamRole });
              }}
            >
              {roleOptions(isOwner).map((option) => (
                <option key={option.value} value={option.value}>
                  {option.value}
                </option>
              ))}
            </select>
          );
        },
      },
      { id: 'joined', header: 'Joined', accessorFn: (m) => formatDate(m.joinedAt) },
      {
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          row.original.userId === myId ? (
            <span className="text-ink-muted">You</span>
          ) : row.original.role === 'owner' && !isOwner ? (
            // Only owners may remove an owner; the server refuses it too.
            <span className="text-ink-muted">Owner</span>
          ) : (
            <Button
              variant="danger"
              size="sm"
              onClick={() => setRemoving(row.original)}
              aria-label={`Remove ${row.original.name}`}
            >
              Remove
            </Button>
          ),
      },
    ],
    [isOwner, myId],
  );

  const inviteColumns = useMemo<DataColumn<Invite>[]>(
    () => [
      { id: 'email', header: 'Email', accessorFn: (i) => i.email },
      { id: 'role', header: 'Role', accessorFn: (i) => i.role },
      { id: 'status', header: 'Status', accessorFn: (i) => i.status },
      { id: 'sent', header: 'Last sent', accessorFn: (i) => formatDateTime(i.lastSentAt) },
      { id: 'expires', header: 'Expires', accessorFn: (i) => formatDateTime(i.expiresAt) },
      {
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          row.original.status === 'pending' || row.original.status === 'expired' ? (
            <div className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                aria-label={`Resend invitation to ${row.original.email}`}
                onClick={() => {
                  setActionError(null);
                  resend.mutate(row.original.id, { onError });
                }}
              >
                Resend
              </Button>
              <Button
                variant="danger"
                size="sm"
                aria-label={`Cancel invitation to ${row.original.email}`}
                onClick={() => {
                  setActionError(null);
                  cancel.mutate(row.original.id, { onError });
                }}
              >
                Cancel
              </Button>
            </div>
          ) : null,
      },
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the mutation objects are stable
    [],
  );

  const closeChange = () => {
    setChanging(null);
    changeRole.reset();
  };

  const closeRemove = () => {
    setRemoving(null);
    remove.reset();
  };

  return (
    <div className="flex flex-col gap-8">
      {actionError ? <Notice tone="fault">{actionError}</Notice> : null}
      <section aria-labelledby="members-heading">
        <h2 id="members-heading" className="mb-1 text-title font-semibold">
          Members
        </h2>
        {members.data ? (
          <div className="mb-3">
            <SeatsSummary seats={members.data.seats} />
          </div>
        ) : null}
        {members.isPending ? (
          <PageLoading />
        ) : members.isError ? (
          <LoadError
            error={members.error}
            onRetry={members.refetch}
            retrying={members.isRefetching}
          />
        ) : (
          <DataTable
            caption="Members"
            columns={memberColumns}
            data={members.data.data}
            getRowId={(m) => m.userId}
          />
        )}
      </section>
      <section aria-labelledby="invite-heading">
        <h2 id="invite-heading" className="mb-3 text-title font-semibold">
          Invite someone
        </h2>
        <Card>
          <InviteForm canGrantOwner={isOwner} seats={members.data?.seats} />
        </Card>
      </section>
      <section aria-labelledby="invites-heading">
        <h2 id="invites-heading" className="mb-3 text-title font-semibold">
          Invitations
        </h2>
        {invites.isPending ? (
          <PageLoading />
        ) : invites.isError ? (
          <LoadError
            error={invites.error}
            onRetry={invites.refetch}
            retrying={invites.isRefetching}
          />
        ) : (
          <DataTable
            caption="Invitations"
            columns={inviteColumns}
            data={invites.data.data}
            getRowId={(i) => i.id}
            empty="No invitations."
          />
        )}
      </section>
      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.name ?? ''}?`}
        description="They lose access to this studio at once."
        confirmLabel="Remove member"
        pending={remove.isPending}
        error={remove.isError ? problemMessage(remove.error) : null}
        onClose={closeRemove}
        onConfirm={() => removing && remove.mutate(removing.userId, { onSuccess: closeRemove })}
      />
      <ConfirmDialog
        open={changing !== null}
        title={`Make ${changing?.member.name ?? ''} ${article(changing?.role)} ${changing?.role ?? ''}?`}
        description={
          changing ? (
            <>
              From {changing.member.role} to {changing.role}, at once. {ROLE_LABELS[changing.role]}.
            </>
          ) : null
        }
        confirmLabel="Change role"
        pending={changeRole.isPending}
        error={changeRole.isError ? problemMessage(changeRole.error) : null}
        onClose={closeChange}
        onConfirm={() =>
          changing &&
          changeRole.mutate(
            { userId: changing.member.userId, role: changing.role },
            { onSuccess: closeChange },
          )
        }
      />
    </div>
  );
}
