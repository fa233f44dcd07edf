import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { problemMessage } from '@/lib/form-errors';
import type { ApiKey, ApiKeyCreated } from '../api/keys';
import { useRotateKey } from '../api/rotate-key';
import { GRACE_PERIODS } from '../schemas';
import { SecretReveal } from './secret-reveal';

export function RotateKeyDialog({
  apiKey,
  onClose,
}: {
  apiKey: ApiKey | null;
  onClose: () => void;
}) {
  const rotate = useRotateKey();
  const [grace, setGrace] = useState<string>('86400');
  const [rotated, setRotated] = useState<ApiKeyCreated | null>(null);

  const close = () => {
    setRotated(null);
    rotate.reset();
    onClose();
  };
  const submit = () => {
    if (!apiKey) return;
    rotate.mutate(
      { id: apiKey.id, gracePeriodSeconds: Number(grace) },
      { onSuccess: (result) => setRotated(result) },
    );
  };

  return (
    <Dialog
      open={apiKey !== null}
      onClose={rotated ? () => undefined : close}
      title={rotated ? 'New secret issued' : `Rotate “${apiKey?.name ?? ''}”`}
      description={
        rotated
          ? undefined
          : 'A new secret replaces the old one. Keep the old one working for a while so your apps can switch without downtime.'
      }
    >
      {rotated ? (
        <SecretReveal secret={rotated.secret} onDone={close} />
      ) : (
        <div className="flex flex-col gap-4">
          <SelectField
            label="Old secret keeps working for"
            options={GRACE_PERIODS}
            value={grace}
            onChange={(event) => setGrace(event.target.value)}
          />
          {rotate.isError ? <Notice tone="fault">{problemMessage(rotate.error)}</Notice> : null}
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button onClick={submit} disabled={rotate.isPending}>
              Rotate
            </Button>
          </div>
        </div>
      )}
    </Dialog>
  );
}
