import { useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useSavedSetup } from '../../api/saved-setups';
import { savedPlace, type SavedPlace } from './saved-inputs';

function samePlace(a: SavedPlace, b: SavedPlace): boolean {
  return (
    Math.abs(a.latitude - b.latitude) < 1e-9 &&
    Math.abs(a.longitude - b.longitude) < 1e-9 &&
    a.date === b.date &&
    a.timeZone === b.timeZone &&
    a.sky === b.sky
  );
}

/**
 * The saved setup the URL names (`?setup=<id>`), and the place and date the Dusk setup plans for.
 * `moment` is the scene's (the Twilight tab's) place and date.
 */
export function useOpenedSetup(moment: SavedPlace | null) {
  const [params] = useSearchParams();
  const setupId = params.get('setup');
  const opened = useSavedSetup(setupId);
  const openedInputs = opened.data ? (opened.data.resolvedInputs ?? opened.data.inputs) : undefined;
  const savedAt = useMemo(() => (openedInputs ? savedPlace(openedInputs) : null), [openedInputs]);
  // A reopened setup sends its place and date to the Twilight tab, so every tab shows the same
  // evening. Until the Twilight tab has taken it, the saved place is used here; after that the
  // scene's (a later change on the Twilight tab then moves this plan too).
  const [syncedFor, setSyncedFor] = useState<string | null>(null);
  const synced = !!opened.data && syncedFor === opened.data.id;
  if (opened.data && savedAt && moment && !synced && samePlace(moment, savedAt))
    setSyncedFor(opened.data.id); // state adjusted while rendering, React's pattern for this
  const place: SavedPlace | null = savedAt && !synced ? savedAt : moment;
  const fromSaved = !!savedAt && (!synced || (!!moment && samePlace(moment, savedAt)));
  return { setupId, opened, openedInputs, place, fromSaved };
}
