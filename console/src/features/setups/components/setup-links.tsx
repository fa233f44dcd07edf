import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { setupSheetHref } from '../api/setups';
import { playgroundHref } from '../schemas';

/** A small outlined link that sits beside buttons in setup rows and cards (off paper, like them). */
export const actionLink =
  'inline-flex rounded-control border border-edge-strong px-2 py-1 text-small font-medium text-ink no-underline hover:bg-raised print:hidden';

/** "Open" (in the playground) and "Shot sheet" (a new tab) for one saved setup. */
export function SetupLinks({ setup }: { setup: { id: string; name: string } }) {
  return (
    <>
      <Link
        to={playgroundHref(paths.playground, setup.id)}
        className={actionLink}
        aria-label={`Open ${setup.name} in the playground`}
      >
        Open
      </Link>
      <a
        href={setupSheetHref(setup.id)}
        target="_blank"
        rel="noopener"
        className={actionLink}
        aria-label={`Shot sheet for ${setup.name} (opens a new tab)`}
      >
        Shot sheet
      </a>
    </>
  );
}
