import { Link } from 'react-router-dom';
import { Card } from '@/components/ui/card';
import { PageLoading } from '@/components/ui/page-loading';
import { paths } from '@/config/paths';
import { daysAway, formatDate, todayIso } from '@/lib/format';
import { useUpcomingSetups } from '../api/setups';
import { shootingWindow } from '../window';
import { SetupLinks } from './setup-links';
import { LoadError } from '@/components/ui/load-error';

/** The studio's next saved shoots, soonest first, each with its window in the shoot's zone. */
export function UpcomingShoots() {
  const upcoming = useUpcomingSetups(3);
  const today = todayIso();
  return (
    <Card aria-labelledby="upcoming-heading">
      <h2 id="upcoming-heading" className="text-title font-semibold">
        Coming up
      </h2>
      {upcoming.isPending ? (
        <PageLoading />
      ) : upcoming.isError ? (
        <LoadError
          error={upcoming.error}
          onRetry={upcoming.refetch}
          retrying={upcoming.isRefetching}
        />
      ) : upcoming.data.data.length === 0 ? (
        <p className="mt-2 text-ink-muted">
          No shoots ahead. Plan one in the <Link to={paths.playground}>playground</Link> and save it
          as a setup to see it here.
        </p>
      ) : (
        <ul className="mt-3 divide-y divide-edge" data-testid="upcoming-shoots">
          {upcoming.data.data.map((s) => (
            <li key={s.id} className="flex flex-wrap items-start justify-between gap-3 py-3">
              <div className="min-w-0">
                <p className="font-semibold">{s.name}</p>
                <p className="text-small text-ink-muted">
                  {formatDate(s.date)} ({daysAway(s.date, today)}){s.venue ? ` · ${s.venue}` : ''}
                </p>
                <p className="text-small">
                  {shootingWindow(s) ?? 'No shooting window that day (polar day or night)'}
                </p>
              </div>
              <div className="flex gap-2">
                <SetupLinks setup={s} />
              </div>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
