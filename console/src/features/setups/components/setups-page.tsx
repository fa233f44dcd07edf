import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { CursorPager } from '@/components/ui/cursor-pager';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { TextField } from '@/components/ui/text-field';
import { problemMessage } from '@/lib/form-errors';
import { formatDate } from '@/lib/format';
import { useCan } from '@/lib/session';
import { shootingWindow } from '../window';
import { currentCursor, firstPageParams } from '@/lib/pagination';
import {
  useDeleteSetup,
  useDuplicateSetup,
  useSetups,
  type SavedSetupSummary,
} from '../api/setups';
import { SetupLinks } from './setup-links';
import { SaveSetupDialog } from './save-setup-dialog';
import { LoadError } from '@/components/ui/load-error';

export function SetupsPage() {
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  const setups = useSetups({ q, cursor: currentCursor(params) });
  const duplicate = useDuplicateSetup();
  const remove = useDeleteSetup();
  const [saving, setSaving] = useState(false);
  const [deleting, setDeleting] = useState<SavedSetupSummary | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  // Reading roles (developers) open setups and sheets; only `setups:manage` changes them.
  const canManage = useCan('setups:manage');

  const columns = useMemo<DataColumn<SavedSetupSummary>[]>(
    () => [
      { id: 'name', header: 'Name', cell: ({ row }) => <strong>{row.original.name}</strong> },
      { id: 'venue', header: 'Venue', accessorFn: (s) => s.venue ?? '—' },
      { id: 'date', header: 'Date', accessorFn: (s) => formatDate(s.date) },
      {
        id: 'window',
        header: 'Shooting window',
        // In the shoot's own time zone: that is where the light happens.
        accessorFn: (s) => shootingWindow(s) ?? '—',
      },
      { id: 'by', header: 'Saved by', accessorFn: (s) => s.createdBy?.name ?? '—' },
      {
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => {
          const setup = row.original;
          return (
            <div className="flex flex-wrap gap-2">
              <SetupLinks setup={setup} />
              {canManage ? (
                <>
                  <Button
                    variant="secondary"
                    size="sm"
                    aria-label={`Duplicate ${setup.name}`}
                    onClick={() => {
                      setActionError(null);
                      duplicate.mutate(
                        { id: setup.id, name: `${setup.name} (copy)`.slice(0, 100) },
                        { onError: (error) => setActionError(problemMessage(error)) },
                      );
                    }}
                  >
                    Duplicate
                  </Button>
                  <Button
                    variant="danger"
                    size="sm"
                    aria-label={`Delete ${setup.name}`}
                    onClick={() => setDeleting(setup)}
                  >
                    Delete
                  </Button>
                </>
              ) : null}
            </div>
          );
        },
      },
    ],
    // eslint-disable-next-line react-hooks/exhaustive-deps -- the mutation object is stable
    [canManage],
  );

  const closeDelete = () => {
    setDeleting(null);
    remove.reset();
  };

  return (
    <>
      <div className="mb-4 flex flex-wrap items-end justify-between gap-4">
        <form
          role="search"
          className="w-full max-w-sm"
          onSubmit={(event) => {
            event.preventDefault();
            const value = new FormData(event.currentTarget).get('q');
            const next = firstPageParams(params);
            if (typeof value === 'string' && value.trim()) next.set('q', value.trim());
            else next.delete('q');
            setParams(next);
          }}
        >
          <TextField
            label="Search setups"
            name="q"
            type="search"
            defaultValue={q}
            hint="Name, venue or notes; press Enter."
          />
        </form>
        {canManage ? <Button onClick={() => setSaving(true)}>Save a setup</Button> : null}
      </div>
      {canManage ? null : (
        <Notice className="mb-4">
          Your role can open saved setups and their shot sheets. Saving, duplicating and deleting
          are for photographers, admins and owners.
        </Notice>
      )}
      {actionError ? (
        <Notice tone="fault" className="mb-4">
          {actionError}
        </Notice>
      ) : null}
      {setups.isPending ? (
        <PageLoading />
      ) : setups.isError ? (
        <LoadError error={setups.error} onRetry={setups.refetch} retrying={setups.isRefetching} />
      ) : (
        <DataTable
          caption="Saved setups"
          columns={columns}
          data={setups.data.data}
          getRowId={(s) => s.id}
          empty={q ? `No setups match “${q}”.` : 'No saved setups yet.'}
          footer={<CursorPager nextCursor={setups.data.nextCursor} label="Setups" />}
        />
      )}
      {canManage ? <SaveSetupDialog open={saving} onClose={() => setSaving(false)} /> : null}
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete “${deleting?.name ?? ''}”?`}
        description="The setup and its shot sheet are removed for everyone in the studio."
        confirmLabel="Delete setup"
        pending={remove.isPending}
        error={remove.isError ? problemMessage(remove.error) : null}
        onClose={closeDelete}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: closeDelete })}
      />
    </>
  );
}
