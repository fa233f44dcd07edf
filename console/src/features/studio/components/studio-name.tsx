import { Card } from '@/components/ui/card';
import { NameForm } from '@/components/ui/name-form';
import { formatDate } from '@/lib/format';
import type { Session } from '@/lib/session';
import { useRenameStudio } from '../api/studio';
import { studioNameSchema } from '../schemas';

/** The studio's name, plan and age; the owner can rename it, everyone else reads it. */
export function StudioName({
  organization,
  canRename,
}: {
  organization: Session['organization'];
  canRename: boolean;
}) {
  const rename = useRenameStudio();
  return (
    <Card aria-labelledby="studio-name-heading">
      <h2 id="studio-name-heading" className="text-title font-semibold">
        Studio
      </h2>
      <p className="mt-1 text-small text-ink-muted">
        On the {organization.planCode} plan since {formatDate(organization.createdAt)}.
      </p>
      {canRename ? (
        <div className="mt-4">
          <NameForm
            name={organization.name}
            schema={studioNameSchema}
            label="Studio name"
            autoComplete="organization"
            hint="Members see it in their menu and in invitation emails."
            submitLabel="Save studio name"
            savedMessage="The studio’s name is saved."
            onSave={async (name) => (await rename.mutateAsync(name)).name}
          />
        </div>
      ) : (
        <>
          <p className="mt-4 text-lead font-medium break-words text-ink">{organization.name}</p>
          <p className="mt-2 text-small text-ink-muted">Only the owner can rename the studio.</p>
        </>
      )}
    </Card>
  );
}
