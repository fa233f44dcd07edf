import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { SelectField } from '@/components/ui/select-field';
import { paths } from '@/config/paths';
import { problemMessage } from '@/lib/form-errors';
import { useStudioMembers, useTransferOwnership } from '../api/studio';

/** The owner hands the studio to another member and becomes an admin, after a named question. */
export function TransferOwnership({
  studioName,
  myId,
  onTransferred,
}: {
  studioName: string;
  myId: string;
  /** Told the new owner's name; this card then goes (you are no longer the owner). */
  onTransferred: (newOwner: string) => void;
}) {
  const members = useStudioMembers();
  const transfer = useTransferOwnership();
  const [chosen, setChosen] = useState('');
  const [asking, setAsking] = useState(false);

  const others = (members.data?.data ?? []).filter((m) => m.userId !== myId);
  const target = others.find((m) => m.userId === chosen);

  const close = () => {
    setAsking(false);
    transfer.reset();
  };
  const confirm = () => {
    if (!target) return;
    transfer.mutate(target.userId, {
      onSuccess: () => {
        setAsking(false);
        onTransferred(target.name);
      },
    });
  };

  return (
    <Card aria-labelledby="transfer-heading">
      <h2 id="transfer-heading" className="text-title font-semibold">
        Transfer ownership
      </h2>
      <p className="mt-1 text-small text-ink-muted">
        Make another member the owner. You stay in the studio as an admin.
      </p>
      {members.isPending ? (
        <PageLoading />
      ) : members.isError ? (
        <Notice tone="fault" className="mt-4">
          {problemMessage(members.error)}
        </Notice>
      ) : others.length === 0 ? (
        <p className="mt-4 text-small">
          Nobody else is in this studio yet. <Link to={paths.team}>Invite someone</Link> first.
        </p>
      ) : (
        <div className="mt-4 flex flex-wrap items-end gap-3">
          <SelectField
            label="New owner"
            className="min-w-0 flex-1 basis-56"
            value={chosen}
            onChange={(event) => setChosen(event.target.value)}
            options={[
              { value: '', label: 'Choose a member' },
              ...others.map((m) => ({ value: m.userId, label: `${m.name} (${m.role})` })),
            ]}
          />
          <Button variant="danger" disabled={!target} onClick={() => setAsking(true)}>
            Transfer ownership
          </Button>
        </div>
      )}
      <ConfirmDialog
        open={asking && !!target}
        onClose={close}
        title={target ? `Make ${target.name} the owner of ${studioName}?` : 'Transfer ownership?'}
        description={
          target ? (
            <>
              {target.name} ({target.email}) becomes the owner: the plan and billing, renaming and
              deleting the studio, and passing ownership on are theirs. You become an admin: you
              keep the team, every key, the audit log and the gear list, but lose billing, renaming
              and deleting. Only {target.name} can make you owner again.
            </>
          ) : null
        }
        confirmLabel={target ? `Make ${target.name} owner` : 'Transfer ownership'}
        onConfirm={confirm}
        pending={transfer.isPending}
        error={transfer.isError ? problemMessage(transfer.error) : null}
      />
    </Card>
  );
}
