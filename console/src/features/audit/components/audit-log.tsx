import { useSearchParams } from 'react-router-dom';
import { CursorPager } from '@/components/ui/cursor-pager';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { PageLoading } from '@/components/ui/page-loading';
import { TextField } from '@/components/ui/text-field';
import { formatDateTime } from '@/lib/format';
import { currentCursor, firstPageParams } from '@/lib/pagination';
import { useAudit, type AuditEvent } from '../api/list-audit';
import { LoadError } from '@/components/ui/load-error';

const columns: DataColumn<AuditEvent>[] = [
  { id: 'when', header: 'When', accessorFn: (e) => formatDateTime(e.createdAt) },
  { id: 'action', header: 'Action', cell: ({ row }) => <code>{row.original.action}</code> },
  {
    id: 'actor',
    header: 'Who',
    accessorFn: (e) => e.actor.name ?? (e.actor.keyId ? `key ${e.actor.keyId.slice(0, 8)}` : '—'),
  },
  {
    id: 'target',
    header: 'Target',
    accessorFn: (e) => (e.targetType ? `${e.targetType} ${e.targetId?.slice(0, 8) ?? ''}` : '—'),
  },
  { id: 'ip', header: 'From', accessorFn: (e) => e.ip ?? '—' },
];

export function AuditLog() {
  const [params, setParams] = useSearchParams();
  const action = params.get('action') ?? '';
  const audit = useAudit({ cursor: currentCursor(params), action });

  return (
    <>
      <form
        role="search"
        className="mb-4 max-w-sm"
        onSubmit={(event) => {
          event.preventDefault();
          const value = new FormData(event.currentTarget).get('action');
          const next = firstPageParams(params);
          if (typeof value === 'string' && value.trim()) next.set('action', value.trim());
          else next.delete('action');
          setParams(next);
        }}
      >
        <TextField
          label="Action"
          name="action"
          defaultValue={action}
          hint="e.g. key.created or auth.sign_in; press Enter to filter."
        />
      </form>
      {audit.isPending ? (
        <PageLoading />
      ) : audit.isError ? (
        <LoadError error={audit.error} onRetry={audit.refetch} retrying={audit.isRefetching} />
      ) : (
        <DataTable
          caption="Audit events"
          columns={columns}
          data={audit.data.data}
          getRowId={(e) => e.id}
          empty={
            action
              ? `No ${action} events. Clear the Action box to see every event.`
              : 'Nothing recorded yet. Sign-ins, API key and team changes, and deleted setups and frames appear here.'
          }
          footer={<CursorPager nextCursor={audit.data.nextCursor} label="Audit" />}
        />
      )}
    </>
  );
}
