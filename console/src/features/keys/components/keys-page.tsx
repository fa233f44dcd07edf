import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { CursorPager } from '@/components/ui/cursor-pager';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { problemMessage } from '@/lib/form-errors';
import { formatDateTime } from '@/lib/format';
import { currentCursor } from '@/lib/pagination';
import type { ApiKey } from '../api/keys';
import { useKeys } from '../api/list-keys';
import { useRevokeKey } from '../api/revoke-key';
import { CreateKeyDialog } from './create-key-dialog';
import { RotateKeyDialog } from './rotate-key-dialog';

const statusTone: Record<ApiKey['status'], string> = {
  active: 'text-ok',
  revoked: 'text-fault',
  expired: 'text-caution',
};

export function KeysPage() {
  const [params] = useSearchParams();
  const keys = useKeys(currentCursor(params));
  const revoke = useRevokeKey();
  const [creating, setCreating] = useState(false);
  const [revoking, setRevoking] = useState<ApiKey | null>(null);
  const [rotating, setRotating] = useState<ApiKey | null>(null);

  const columns = useMemo<DataColumn<ApiKey>[]>(
    () => [
      { id: 'name', header: 'Name', accessorFn: (key) => key.name },
      {
        id: 'prefix',
        header: 'Key',
        cell: ({ row }) => <code className="font-mono">{row.original.prefix}…</code>,
      },
      { id: 'environment', header: 'Environment', accessorFn: (key) => key.environment },
      { id: 'creator', header: 'Created by', accessorFn: (key) => key.createdBy?.name ?? '—' },
      { id: 'created', header: 'Created', accessorFn: (key) => formatDateTime(key.createdAt) },
      {
        id: 'lastUsed',
        header: 'Last used',
        accessorFn: (key) => formatDateTime(key.lastUsedAt, 'Never'),
      },
      {
        id: 'status',
        header: 'Status',
        cell: ({ row }) => (
          <span className={`font-medium ${statusTone[row.original.status]}`}>
            {row.original.status}
            {row.original.previousSecretExpiresAt &&
            new Date(row.original.previousSecretExpiresAt) > new Date()
              ? ` (old secret until ${formatDateTime(row.original.previousSecretExpiresAt)})`
              : ''}
          </span>
        ),
      },
      {
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) =>
          row.original.status === 'active' ? (
            <div className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                onClick={() => setRotating(row.original)}
                aria-label={`Rotate ${row.original.name}`}
              >
                Rotate
              </Button>
              <Button
                variant="danger"
                size="sm"
                onClick={() => setRevoking(row.original)}
                aria-label={`Revoke ${row.original.name}`}
              >
                Revoke
              </Button>
            </div>
          ) : null,
      },
    ],
    [],
  );

  const closeRevoke = () => {
    setRevoking(null);
    revoke.reset();
  };

  return (
    <>
      <div className="mb-4 flex justify-end">
        <Button onClick={() => setCreating(true)}>Create key</Button>
      </div>
      {keys.isPending ? (
        <PageLoading />
      ) : keys.isError ? (
        <Notice tone="fault">{problemMessage(keys.error)}</Notice>
      ) : (
        <DataTable
          caption="API keys"
          columns={columns}
          data={keys.data.data}
          getRowId={(key) => key.id}
          empty="No keys yet. Create one for each app that calls the API."
          footer={<CursorPager nextCursor={keys.data.nextCursor} label="Keys" />}
        />
      )}
      <CreateKeyDialog open={creating} onClose={() => setCreating(false)} />
      <RotateKeyDialog apiKey={rotating} onClose={() => setRotating(null)} />
      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke “${revoking?.name ?? ''}”?`}
        description="Apps using this key get 401 from their very next call. This can’t be undone."
        confirmLabel="Revoke key"
        pending={revoke.isPending}
        error={revoke.isError ? problemMessage(revoke.error) : null}
        onClose={closeRevoke}
        onConfirm={() => revoking && revoke.mutate(revoking.id, { onSuccess: closeRevoke })}
      />
    </>
  );
}
