import type { DuskSetupInput } from '@lumenwright/shared';
import { useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
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

export const GEAR_CHANGED_WHILE_SAVING =
  'Your studio’s gear changed since you picked from it (see the notes beside the pickers). Nothing was saved: check the values, then save again.';

const sameIds = (a: object, b: object) =>
  JSON.stringify(Object.entries(a).sort()) === JSON.stringify(Object.entries(b).sort());

/**
 * The picks as the studio's gear has them now (see `currentPicks`), and a check for the moment of
 * saving: it fetches the lists afresh and answers a message when the ids saving would send are no
 * longer the ones shown (an item changed or was deleted since the lists were last fetched).
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

  const checkBeforeSave = async (input: DuskSetupInput): Promise<string | null> => {
    let fresh: GearLists;
    try {
      const fetch = { staleTime: 0 } as const;
      const [l, m, k] = await Promise.all([
        queryClient.fetchQuery({ ...gearLightsQuery, ...fetch }),
        queryClient.fetchQuery({ ...gearModifiersQuery, ...fetch }),
        queryClient.fetchQuery({ ...gearGelKitsQuery, ...fetch }),
      ]);
      fresh = { lights: l.data, modifiers: m.data, gelKits: k.data };
    } catch {
      // The gear could not be fetched: save as shown; the server refuses an unknown id by name.
      return null;
    }
    const shown = savedGearIds(withGearIds(input, current));
    const now = savedGearIds(withGearIds(input, currentPicks(picked, fresh)));
    return sameIds(shown, now) ? null : GEAR_CHANGED_WHILE_SAVING;
  };

  return { current, checkBeforeSave };
}
