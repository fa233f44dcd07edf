import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageLoading } from '@/components/ui/page-loading';
import { formatCount, formatDateTime } from '@/lib/format';
import { useCurrentPlan, useUsageEvents, useUsageSummary } from '../api/usage';
import { daysBetween } from '../filters';
import { CallsChart, toDayBars } from './calls-chart';
import { LoadError } from '@/components/ui/load-error';

/** This month's calls against the plan, calls by day, and the latest errors. */
export function OverviewUsage({ usageHref }: { usageHref: string }) {
  const plan = useCurrentPlan();
  const summary = useUsageSummary({});
  // The latest failed calls, however many successful ones came after them.
  const recent = useUsageEvents({ limit: 8, outcome: 'error' });

  const included = plan.data?.plan.includedCallsPerMonth ?? 0;
  const used = plan.data?.usage.billableUnits ?? 0;
  const share = included > 0 ? Math.min(1, used / included) : 0;
  const errors = recent.data?.data ?? [];

  return (
    <div className="grid gap-4 lg:grid-cols-3">
      <Card aria-labelledby="plan-heading">
        <h2 id="plan-heading" className="text-title font-semibold">
          This month
        </h2>
        {plan.isPending ? (
          <PageLoading />
        ) : plan.isError ? (
          <LoadError error={plan.error} onRetry={plan.refetch} retrying={plan.isRefetching} />
        ) : (
          <>
            <p className="mt-2 text-display font-semibold tabular-nums" data-testid="month-calls">
              {formatCount(used)}
            </p>
            <p className="text-small text-ink-muted">
              billable calls of {formatCount(included)} included in the{' '}
              {plan.data.plan.name ?? plan.data.plan.code} plan
            </p>
            <div
              role="meter"
              aria-label="Share of the plan used"
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={Math.round(share * 100)}
              className="mt-3 h-2 overflow-hidden rounded-full bg-raised"
            >
              <div
                className={`h-full ${share >= 0.9 ? 'bg-fault' : 'bg-accent'}`}
                style={{ width: `${share * 100}%` }}
              />
            </div>
            <dl className="mt-3 grid grid-cols-3 gap-2 text-small">
              <div>
                <dt className="text-ink-muted">Live</dt>
                <dd className="tabular-nums">{formatCount(plan.data.usage.liveCalls)}</dd>
              </div>
              <div>
                <dt className="text-ink-muted">Test</dt>
                <dd className="tabular-nums">{formatCount(plan.data.usage.testCalls)}</dd>
              </div>
              <div>
                <dt className="text-ink-muted">Console</dt>
                <dd className="tabular-nums">{formatCount(plan.data.usage.consoleCalls)}</dd>
              </div>
            </dl>
            <p className="mt-2 text-caption text-ink-muted">
              Console and test calls are not billed. Resets {formatDateTime(plan.data.resetsAt)}.
            </p>
          </>
        )}
      </Card>
      <Card aria-labelledby="by-day-heading" className="lg:col-span-2">
        <h2 id="by-day-heading" className="text-title font-semibold">
          Calls by day
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
          <div className="mt-3">
            <CallsChart
              title="Calls by day this month"
              days={toDayBars(summary.data.byDay, daysBetween(summary.data.from, summary.data.to))}
            />
          </div>
        )}
      </Card>
      <Card aria-labelledby="errors-heading" className="lg:col-span-3">
        <h2 id="errors-heading" className="text-title font-semibold">
          Recent errors
        </h2>
        {recent.isPending ? (
          <PageLoading />
        ) : recent.isError ? (
          <LoadError error={recent.error} onRetry={recent.refetch} retrying={recent.isRefetching} />
        ) : errors.length === 0 ? (
          <p className="mt-2 text-ink-muted">No failed calls recorded.</p>
        ) : (
          <ul className="mt-2 divide-y divide-edge">
            {errors.map((event) => (
              <li key={event.id} className="flex flex-wrap gap-x-4 py-2 text-small tabular-nums">
                <span className="font-semibold text-fault">{event.status}</span>
                <span>{event.endpoint}</span>
                <span className="text-ink-muted">{formatDateTime(event.occurredAt)}</span>
                <span className="text-ink-muted">{event.source}</span>
                <code className="text-caption text-ink-muted">{event.requestId}</code>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-3 text-small">
          <Link to={`${usageHref}?outcome=error`}>All failed calls</Link> ·{' '}
          <Link to={usageHref}>All usage</Link>
        </p>
      </Card>
    </div>
  );
}
