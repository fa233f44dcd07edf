import type { DuskSetupInput } from '@lumenwright/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { problemMessage } from '@/lib/form-errors';
import {
  gearGelKitsQuery,
  gearLightsQuery,
  gearModifiersQuery,
  useGearGelKits,
  useGearLights,
  useGearModifiers,
} from '../../api/gear-options';
import { currentPicks, withGearIds, type GearLists, type PickedGear } from './gear-links';
import { savedGearIds } from './restore-gear';
import type { SaveStop } from './save-setup-dialog';

export const GEAR_CHANGED_WHILE_SAVING =
  'Your studio’s gear changed since you picked from it (see the notes beside the pickers). Nothing was saved: check the values, then save again.';

/** The gear lists could not be fetched at the moment of saving, so the picks were not checked. */
export const gearUncheckedWhileSaving = (reason: string) =>
  `Your studio’s gear could not be checked before saving (${reason.replace(/\.$/, '')}). Nothing was saved, and everything you entered is kept.`;

const sameIds = (a: object, b: object) =>
  JSON.stringify(Object.entries(a).sort()) === JSON.stringify(Object.entries(b).sort());

/**
 * The picks as the studio's gear has them now (see `currentPicks`), and a check for the moment of
 * saving: it fetches the lists afresh and answers why not to save when the ids saving would send
 * are no longer the ones shown (an item changed or was deleted since the lists were last fetched),
 * or, when something was picked, the lists could not be fetched at all (saving may be retried).
 */
export function useCurrentGear(picked: PickedGear) {
  const queryClient = useQueryClient();
  const lights = useGearLights().data?.data;
  const modifiers = useGearModifiers().data?.data;
  const gelKits = useGearGelKits().data?.data;
  const current = useMemo(
    () => currentPicks(picked, { lights, modifiers, gelKits }),
    [picked, lights, modifiers, gelKits],
  );

  const checkBeforeSave = async (input: DuskSetupInput): Promise<SaveStop | null> => {
    // Nothing picked: no id to check, so the gear lists being unreachable does not matter.
    if (!Object.values(picked).some(Boolean)) return null;
    let fresh: GearLists;
    try {
      const fetch = { staleTime: 0 } as const;
      const [l, m, k] = await Promise.all([
        queryClient.fetchQuery({ ...gearLightsQuery, ...fetch }),
        queryClient.fetchQuery({ ...gearModifiersQuery, ...fetch }),
        queryClient.fetchQuery({ ...gearGelKitsQuery, ...fetch }),
      ]);
      fresh = { lights: l.data, modifiers: m.data, gelKits: k.data };
    } catch (error) {
      // Unchecked picks may name gear deleted since: stop rather than save ids nobody has seen.
      return { message: gearUncheckedWhileSaving(problemMessage(error)), retry: true };
    }
    const shown = savedGearIds(withGearIds(input, current));
    const now = savedGearIds(withGearIds(input, currentPicks(picked, fresh)));
    return sameIds(shown, now) ? null : { message: GEAR_CHANGED_WHILE_SAVING };
  };

  return { current, checkBeforeSave };
}
