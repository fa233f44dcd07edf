import { useQuery } from '@tanstack/react-query';
import { useCallback, useEffect } from 'react';
import { meQueryOptions } from '@/lib/me';
import { createPreference, usePreference } from '@/lib/preference';
import { useSession } from '@/lib/session';
import { useSaveLengthUnit } from '../api/length-unit';

export type DisplayUnit = 'm' | 'ft';

/**
 * This device's copy of the choice: what a signed-out page (or one whose /v1/me is unavailable)
 * shows. Signed in, the user's saved preference wins and is copied here.
 */
export const lengthUnitPreference = createPreference<DisplayUnit>(
  'lumenwright.length-unit',
  ['m', 'ft'],
  () => 'm',
);

/**
 * Metres or feet for every distance in the playground. Signed in, it is the user's preference from
 * GET /v1/me (so it follows them to any browser) and changing it saves it with PATCH /v1/me.
 * Returns the unit, a setter, and the last save error (null when the save went through).
 */
export function useLengthUnit(): [DisplayUnit, (unit: DisplayUnit) => void, unknown] {
  const signedIn = useSession() !== null;
  const [local, setLocal] = usePreference(lengthUnitPreference);
  const saved = useQuery({
    ...meQueryOptions(),
    enabled: signedIn,
    // The session gate keeps /v1/me fresh; these readers need not refetch it on every mount.
    staleTime: Infinity,
    select: (me) => me.preferences.lengthUnit,
  });
  const { mutate: save, error } = useSaveLengthUnit();
  const unit = signedIn && saved.data ? saved.data : local;

  useEffect(() => {
    if (saved.data && saved.data !== lengthUnitPreference.get()) setLocal(saved.data);
  }, [saved.data, setLocal]);

  const setUnit = useCallback(
    (next: DisplayUnit) => {
      setLocal(next);
      if (signedIn) save(next);
    },
    [setLocal, signedIn, save],
  );
  return [unit, setUnit, error];
}
