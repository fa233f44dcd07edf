import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { ApiProblem } from '@/lib/api';
import { problemMessage } from '@/lib/form-errors';
import type { OpenedSetup } from '../../api/saved-setups';
import type { useOpenedSetup } from './use-opened-setup';
import type { CarriedInputs } from './saved-inputs';

function openFailure(error: unknown): string {
  if (error instanceof ApiProblem && error.status === 404)
    return 'That saved setup was not found: it may have been deleted, or it belongs to another organisation.';
  if (error instanceof ApiProblem && error.status === 403)
    return 'Your role may not open saved setups. Ask an owner or admin.';
  return `The saved setup could not be opened. ${problemMessage(error)}`;
}

export function describeSetup(setup: Pick<OpenedSetup, 'name' | 'venue' | 'date'>): string {
  return `${setup.name} (${setup.venue ? `${setup.venue}, ` : ''}${setup.date})`;
}

const setupsLink = (
  <Link to={paths.setups} className="font-medium text-accent underline">
    Back to setups
  </Link>
);

/** Opening, failed to open, or opened: with the saved values the form has no field for. */
export function OpenedSetupNotice({
  setupId,
  opened,
  carried,
  onDropCarried,
  links,
}: Pick<ReturnType<typeof useOpenedSetup>, 'setupId' | 'opened'> & {
  carried: CarriedInputs;
  onDropCarried: () => void;
  links: readonly string[];
}) {
  return (
    <>
      {setupId && opened.isPending ? <Notice>Opening the saved setup…</Notice> : null}
      {setupId && opened.isError ? (
        <Notice tone="fault">
          {openFailure(opened.error)} {setupsLink}
        </Notice>
      ) : null}
      {opened.data ? (
        <Notice tone="ok">
          Opened saved setup {describeSetup(opened.data)}. {setupsLink}
          {carried.described.length ? (
            <span className="mt-1 block text-ink-muted">
              Also planned with these saved values, which have no field here:{' '}
              {carried.described.join('; ')}.{' '}
              <Button variant="quiet" className="px-0 py-0" onClick={onDropCarried}>
                Plan without them
              </Button>
            </span>
          ) : null}
          {links.length ? (
            <span className="mt-1 block text-ink-muted">
              This setup was saved with links to studio gear; it reopens with the values it was
              planned with, not the links.
            </span>
          ) : null}
        </Notice>
      ) : null}
    </>
  );
}
