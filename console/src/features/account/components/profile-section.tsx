import { Card } from '@/components/ui/card';
import { NameForm } from '@/components/ui/name-form';
import { Notice } from '@/components/ui/notice';
import { Segmented } from '@/components/ui/segmented';
import { problemMessage } from '@/lib/form-errors';
import type { Session } from '@/lib/session';
import { useUpdateMe } from '../api/account';
import { nameSchema } from '../schemas';

type LengthUnit = Session['preferences']['lengthUnit'];

const units = [
  { value: 'm', label: 'Metres', title: 'Metres' },
  { value: 'ft', label: 'Feet', title: 'Feet' },
] as const satisfies readonly { value: LengthUnit; label: string; title: string }[];

/** Your name (what teammates see on keys, invites and the audit log) and your distance unit. */
export function ProfileSection({ session }: { session: Session }) {
  const saveName = useUpdateMe();
  const saveUnit = useUpdateMe();

  // While a save is on its way show the choice made; the server's answer then replaces it.
  const unit = saveUnit.isPending
    ? (saveUnit.variables.preferences?.lengthUnit ?? session.preferences.lengthUnit)
    : session.preferences.lengthUnit;

  return (
    <Card aria-labelledby="profile-heading">
      <h2 id="profile-heading" className="text-title font-semibold">
        Profile
      </h2>
      <div className="mt-4">
        <NameForm
          name={session.user.name}
          schema={nameSchema}
          label="Your name"
          autoComplete="name"
          hint="Teammates see it on keys, invitations and the audit log."
          submitLabel="Save name"
          savedMessage="Your name is saved."
          onSave={async (name) => (await saveName.mutateAsync({ name })).user.name}
        />
      </div>
      <div className="mt-6 flex flex-col gap-2 border-t border-edge pt-4">
        <Segmented
          label="Distances in"
          value={unit}
          onChange={(lengthUnit) => saveUnit.mutate({ preferences: { lengthUnit } })}
          options={units}
          className="flex-wrap"
        />
        <p className="text-caption text-ink-muted">
          Used by the playground and saved setups on every device you sign in on.
        </p>
        {saveUnit.isError ? (
          <Notice tone="fault">Not saved: {problemMessage(saveUnit.error)}</Notice>
        ) : null}
      </div>
    </Card>
  );
}
