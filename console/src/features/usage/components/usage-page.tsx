import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CursorPager } from '@/components/ui/cursor-pager';
import { DataTable, type DataColumn } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { PageLoading } from '@/components/ui/page-loading';
import { formatCount, formatDateTime } from '@/lib/format';
import {
  ENDPOINTS,
  usageCsvHref,
  useUsageEvents,
  useUsageSummary,
  type UsageEvent,
  type UsageSummary,
} from '../api/usage';
import { daysBetween, filterFromParams, ignoredParams, summaryFromParams } from '../filters';
import { CallsChart, toDayBars } from './calls-chart';
import { firstPageParams } from '@/lib/pagination';
import { LoadError } from '@/components/ui/load-error';

/** A key as the usage page labels it (names come from the keys list, composed by the app). */
export interface UsageKeyLabel {
  id: string;
  name: string;
  environment: string;
}

/** The key's name when this member can see it, else the start of its id. */
function keyLabel(keyId: string | null, keys: Map<string, UsageKeyLabel>): string {
  if (!keyId) return '—';
  return keys.get(keyId)?.name ?? `${keyId.slice(0, 8)}…`;
}

const eventColumns = (keys: Map<string, UsageKeyLabel>): DataColumn<UsageEvent>[] => [
  { id: 'when', header: 'When', accessorFn: (e) => formatDateTime(e.occurredAt) },
  { id: 'endpoint', header: 'Endpoint', accessorFn: (e) => e.endpoint },
  {
    id: 'status',
    header: 'Status',
    cell: ({ row }) => (
      <span className={row.original.status >= 400 ? 'font-semibold text-fault' : ''}>
        {row.original.status}
      </span>
    ),
  },
  { id: 'source', header: 'Source', accessorFn: (e) => e.source },
  // A cell, not an accessor: accessor values are cached per row, and names arrive after the rows.
  { id: 'key', header: 'Key', cell: ({ row }) => keyLabel(row.original.keyId, keys) },
  { id: 'latency', header: 'Latency (ms)', accessorFn: (e) => e.latencyMs },
  { id: 'units', header: 'Billable', accessorFn: (e) => e.billableUnits },
];

type EndpointRow = UsageSummary['byEndpoint'][number];
const endpointColumns: DataColumn<EndpointRow>[] = [
  { id: 'endpoint', header: 'Endpoint', accessorFn: (r) => r.endpoint },
  { id: 'calls', header: 'Calls', accessorFn: (r) => formatCount(r.calls) },
  { id: 'errors', header: 'Errors', accessorFn: (r) => formatCount(r.errors) },
  { id: 'units', header: 'Billable', accessorFn: (r) => formatCount(r.billableUnits) },
  {
    id: 'latency',
    header: 'Mean latency (ms)',
    accessorFn: (r) => (r.meanLatencyMs === null ? '—' : r.meanLatencyMs.toFixed(1)),
  },
];

const controlClass =
  'rounded-control border border-edge-strong bg-panel px-3 py-2 text-body text-ink';

const NO_KEYS: UsageKeyLabel[] = [];

export function UsagePage({ keys = NO_KEYS }: { keys?: UsageKeyLabel[] }) {
  const [params, setParams] = useSearchParams();
  const keyMap = useMemo(() => new Map(keys.map((k) => [k.id, k])), [keys]);
  const columns = useMemo(() => eventColumns(keyMap), [keyMap]);
  const chosenKey = params.get('keyId') ?? '';
  const summaryFilter = summaryFromParams(params);
  const filter = filterFromParams(params);
  const summary = useUsageSummary(summaryFilter);
  const events = useUsageEvents(filter);
  const ignored = ignoredParams(params);
  const narrowed = ['endpoint', 'status', 'outcome', 'keyId'].some((k) => k in summaryFilter);
  const [rangeError, setRangeError] = useState<string | null>(null);

  const applyFilters = (form: HTMLFormElement) => {
    const data = new FormData(form);
    const from = data.get('from');
    const to = data.get('to');
    if (typeof from === 'string' && typeof to === 'string' && from && to && from > to) {
      setRangeError(`“From” (${from}) is after “To” (${to}): pick a From day on or before it.`);
      return;
    }
    setRangeError(null);
    const next = firstPageParams(params);
    for (const name of ['from', 'to', 'endpoint', 'status', 'outcome', 'keyId']) {
      const value = data.get(name);
      if (typeof value === 'string' && value.trim()) next.set(name, value.trim());
      else next.delete(name);
    }
    setParams(next);
  };

  return (
    <div className="flex flex-col gap-6">
      <form
        aria-label="Usage filters"
        key={params.toString()}
        className="grid gap-3 sm:grid-cols-3 xl:grid-cols-6"
        onSubmit={(event) => {
          event.preventDefault();
          applyFilters(event.currentTarget);
        }}
      >
        <label className="flex flex-col gap-1 text-small font-medium">
          From (UTC day)
          <input
            type="date"
            name="from"
            defaultValue={params.get('from') ?? ''}
            className={controlClass}
          />
        </label>
        <label className="flex flex-col gap-1 text-small font-medium">
          To (UTC day)
          <input
            type="date"
            name="to"
            defaultValue={params.get('to') ?? ''}
            className={controlClass}
          />
        </label>
        <label className="flex flex-col gap-1 text-small font-medium">
          Endpoint
          <select
            name="endpoint"
            defaultValue={params.get('endpoint') ?? ''}
            className={controlClass}
          >
            <option value="">All</option>
            {ENDPOINTS.map((endpoint) => (
              <option key={endpoint} value={endpoint}>
                {endpoint}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-small font-medium">
          Status
          <input
            name="status"
            inputMode="numeric"
            pattern="[1-5][0-9][0-9]"
            placeholder="e.g. 429"
            defaultValue={params.get('status') ?? ''}
            className={controlClass}
          />
        </label>
        <label className="flex flex-col gap-1 text-small font-medium">
          Result
          <select
            name="outcome"
            defaultValue={summaryFilter.outcome ?? ''}
            className={controlClass}
          >
            <option value="">All</option>
            <option value="error">Failed (4xx, 5xx)</option>
            <option value="ok">Answered</option>
          </select>
        </label>
        {keys.length ? (
          <label className="flex flex-col gap-1 text-small font-medium">
            Key
            <select name="keyId" defaultValue={chosenKey} className={controlClass}>
              <option value="">All</option>
              {keys.map((k) => (
                <option key={k.id} value={k.id}>
                  {k.name} ({k.environment})
                </option>
              ))}
              {chosenKey && !keyMap.has(chosenKey) ? (
                <option value={chosenKey}>{chosenKey.slice(0, 8)}…</option>
              ) : null}
            </select>
          </label>
        ) : (
          <label className="flex flex-col gap-1 text-small font-medium">
            Key id
            <input name="keyId" defaultValue={chosenKey} className={controlClass} />
          </label>
        )}
        {/* Their own row under the filters: beside them the buttons had too little room and wrapped. */}
        <div className="flex flex-wrap gap-2 sm:col-span-3 xl:col-span-6">
          <Button type="submit">Apply</Button>
          <a
            href={usageCsvHref(filter)}
            download
            className="rounded-control border border-edge-strong px-4 py-2 font-medium whitespace-nowrap text-ink no-underline"
          >
            Export CSV
          </a>
        </div>
      </form>

      {rangeError ? <Notice tone="fault">{rangeError}</Notice> : null}
      {ignored.length ? (
        <Notice tone="caution">
          Left out of the filters from this page’s address: {ignored.join('; ')}.
        </Notice>
      ) : null}
      <Card aria-labelledby="usage-chart-heading">
        <h2 id="usage-chart-heading" className="text-title font-semibold">
          Calls by day{narrowed ? ' (filtered)' : ''}
        </h2>
        {summary.isPending ? (
          <PageLoading />
        ) : summary.isError ? (
          <LoadError
            error={summary.error}
            onRetry={summary.refetch}
            retrying={summary.isRefetching}
          />
        ) : (
          <>
            <p className="mt-1 text-small text-ink-muted" data-testid="usage-total">
              {formatCount(summary.data.totals.calls)} calls,{' '}
              {formatCount(summary.data.totals.errors)} errors,{' '}
              {formatCount(summary.data.totals.billableUnits)} billable, {summary.data.from} to{' '}
              {summary.data.to}
            </p>
            <div className="mt-3">
              <CallsChart
                title="Calls by day"
                days={toDayBars(
                  summary.data.byDay,
                  daysBetween(summary.data.from, summary.data.to),
                )}
              />
            </div>
            <h3 className="mt-6 mb-2 text-lead font-semibold">By endpoint</h3>
            <DataTable
              caption="Calls by endpoint"
              columns={endpointColumns}
              data={summary.data.byEndpoint}
              getRowId={(r) => r.endpoint}
              empty="No calls in this range."
              narrow="scroll"
            />
          </>
        )}
      </Card>

      <section aria-labelledby="events-heading">
        <h2 id="events-heading" className="mb-3 text-title font-semibold">
          Calls
        </h2>
        {events.isPending ? (
          <PageLoading />
        ) : events.isError ? (
          <LoadError error={events.error} onRetry={events.refetch} retrying={events.isRefetching} />
        ) : (
          <DataTable
            caption="Calls"
            columns={columns}
            data={events.data.data}
            getRowId={(e) => e.id}
            empty="No calls match these filters."
            footer={<CursorPager nextCursor={events.data.nextCursor} label="Calls" />}
          />
        )}
      </section>
    </div>
  );
}
