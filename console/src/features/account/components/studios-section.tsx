import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { problemMessage } from '@/lib/form-errors';
import { useMyOrganizations, useSwitchOrganization } from '../api/account';
import { LoadError } from '@/components/ui/load-error';

/** The studios you belong to, your role in each, and a way to work in another one. */
export function StudiosSection() {
  const list = useMyOrganizations();
  const switcher = useSwitchOrganization();
  const [switchedTo, setSwitchedTo] = useState<string | null>(null);

  const onSwitch = (id: string) => {
    setSwitchedTo(null);
    switcher.mutate(id, { onSuccess: (me) => setSwitchedTo(me.organization.name) });
  };

  return (
    <Card aria-labelledby="studios-heading">
      <h2 id="studios-heading" className="text-title font-semibold">
        Your studios
      </h2>
      <p className="mt-1 text-small text-ink-muted">
        Keys, team, setups and gear belong to a studio; the console shows the one you work in.
      </p>
      {switchedTo ? (
        <Notice tone="ok" className="mt-3">
          You now work in {switchedTo}.
        </Notice>
      ) : null}
      {switcher.isError ? (
        <Notice tone="fault" className="mt-3">
          {problemMessage(switcher.error)}
        </Notice>
      ) : null}
      {list.isPending ? (
        <PageLoading />
      ) : list.isError ? (
        <LoadError
          className="mt-3"
          error={list.error}
          onRetry={list.refetch}
          retrying={list.isRefetching}
        />
      ) : (
        <ul className="mt-3 divide-y divide-edge">
          {list.data.data.map(({ organization, role, current }) => (
            <li
              key={organization.id}
              className="flex flex-wrap items-center justify-between gap-2 py-3"
            >
              <div className="min-w-0">
                <p className="font-medium break-words text-ink">{organization.name}</p>
                <p className="text-caption text-ink-muted">
                  {role} · {organization.planCode} plan
                </p>
              </div>
              {current ? (
                <span className="text-small font-medium text-ok">Current</span>
              ) : (
                <Button
                  variant="secondary"
                  aria-label={`Switch to ${organization.name}`}
                  disabled={switcher.isPending}
                  onClick={() => onSwitch(organization.id)}
                >
                  Switch
                </Button>
              )}
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
