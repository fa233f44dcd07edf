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
  if (!session) return null;
  return (
    <div className="grid min-w-0 gap-6 lg:grid-cols-2">
      <StudioName organization={session.organization} canRename={canRename} />
      {canTransfer ? (
        <TransferOwnership studioName={session.organization.name} myId={session.user.id} />
      ) : null}
      {canDelete ? <DeleteStudio organization={session.organization} /> : null}
    </div>
  );
}
