import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { ApiProblem } from '@/lib/api';
import { problemMessage } from '@/lib/form-errors';
import type { OpenedSetup } from '../../api/saved-setups';
import type { useOpenedSetup } from './use-opened-setup';
import { listed, type RestoredGear } from './restore-gear';
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

const note = 'mt-1 block text-ink-muted';

/** What became of the studio gear the setup named by id. The boxes hold the saved values. */
function GearLinkNotes({ gear }: { gear: RestoredGear }) {
  const { missing, changed, unknown } = gear;
  return (
    <>
      {missing.length ? (
        <span className={note} data-testid="gear-missing">
          {capital(listed(missing))} this setup was saved with {missing.length === 1 ? 'is' : 'are'}{' '}
          no longer in your studio’s gear. The boxes keep the values it was planned with; saving
          again keeps those values, without the {missing.length === 1 ? 'link' : 'links'}.
        </span>
      ) : null}
      {changed.length ? (
        <span className={note} data-testid="gear-changed">
          {capital(listed(changed))} {changed.length === 1 ? 'has' : 'have'} changed since this
          setup was saved. The boxes keep the saved values; pick{' '}
          {changed.length === 1 ? 'it' : 'them'} again from your gear to plan with{' '}
          {changed.length === 1 ? 'its' : 'their'} values now.
        </span>
      ) : null}
      {unknown.length ? (
        <span className={note} data-testid="gear-unknown">
          Your studio’s gear could not be loaded, so the links to {listed(unknown)} were not
          restored. The boxes keep the saved values.
        </span>
      ) : null}
    </>
  );
}

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** Opening, failed to open, or opened: with the saved values the form has no field for. */
export function OpenedSetupNotice({
  setupId,
  opened,
  carried,
  onDropCarried,
  restored,
}: Pick<ReturnType<typeof useOpenedSetup>, 'setupId' | 'opened'> & {
  carried: CarriedInputs;
  onDropCarried: () => void;
  restored: RestoredGear | null;
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
            <span className={note}>
              Also planned with these saved values, which have no field here:{' '}
              {carried.described.join('; ')}.{' '}
              <Button variant="quiet" size="inline" onClick={onDropCarried}>
                Plan without them
              </Button>
            </span>
          ) : null}
          {restored ? <GearLinkNotes gear={restored} /> : null}
        </Notice>
      ) : null}
    </>
  );
}
