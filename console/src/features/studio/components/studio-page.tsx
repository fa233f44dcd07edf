import { useState } from 'react';
import { Notice } from '@/components/ui/notice';
import { useCan, useSession } from '@/lib/session';
import { DeleteStudio } from './delete-studio';
import { StudioName } from './studio-name';
import { TransferOwnership } from './transfer-ownership';

/** Studio settings: everyone reads them; the owner renames, transfers and deletes. */
export function StudioPage() {
  const session = useSession();
  const canRename = useCan('organization:manage');
  const canTransfer = useCan('organization:transfer');
  const canDelete = useCan('organization:delete');
  // Kept here, above the owner's cards: once the session says you are an admin they are gone.
  const [newOwner, setNewOwner] = useState<string | null>(null);
  if (!session) return null;
  return (
    <div className="grid min-w-0 gap-6 lg:grid-cols-2">
      {newOwner ? (
        <Notice tone="ok" className="lg:col-span-2">
          {newOwner} now owns {session.organization.name}. You are an admin.
        </Notice>
      ) : null}
      <StudioName organization={session.organization} canRename={canRename} />
      {canTransfer ? (
        <TransferOwnership
          studioName={session.organization.name}
          myId={session.user.id}
          onTransferred={setNewOwner}
        />
      ) : null}
      {canDelete ? <DeleteStudio organization={session.organization} /> : null}
    </div>
  );
}
