import { useEffect, useMemo, useRef } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import { useGearGelKits, useGearLights, useGearModifiers } from '../../api/gear-options';
import type { OpenedSetup, SavedSetupInputs } from '../../api/saved-setups';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import type { SiteConditions } from '../playground-scene';
import type { PickedGear } from './gear-links';
import { restoreGear, savedGearIds, type RestoredGear } from './restore-gear';
import {
  carriedInputs,
  fromSetupInput,
  savedConditions,
  savedPlace,
  type CarriedInputs,
  type SavedPlace,
} from './saved-inputs';
import type { SetupForm } from './setup-form';

interface Reopen {
  setup: OpenedSetup | undefined;
  /** The saved values (the server's resolved inputs, else the inputs as sent). */
  resolved: SavedSetupInputs | undefined;
  unit: DisplayUnit;
  form: UseFormReturn<SetupForm, unknown, SetupForm>;
  setConditions: (conditions: SiteConditions) => void;
  requestPlace: (place: SavedPlace) => void;
  setCarried: (carried: CarriedInputs) => void;
  setPicked: (picked: PickedGear) => void;
}

/**
 * Fills the Dusk setup form once per reopened setup (not again on refetch, so edits survive). A
 * setup that named studio gear by id waits for the gear lists, so its picks come back with it.
 * Returns what became of those links, for the notice (null until known).
 */
export function useReopenForm({
  setup,
  resolved,
  unit,
  form,
  setConditions,
  requestPlace,
  setCarried,
  setPicked,
}: Reopen): RestoredGear | null {
  const lights = useGearLights();
  const modifiers = useGearModifiers();
  const kits = useGearGelKits();
  const gearSettled = !lights.isPending && !modifiers.isPending && !kits.isPending;
  // What became of the links: the saved ids against the studio's gear as it is now.
  const gear = useMemo(() => {
    if (!setup || !resolved) return null;
    const ids = savedGearIds(setup.inputs);
    if (Object.keys(ids).length && !gearSettled) return null;
    const lists = {
      lights: lights.data?.data,
      modifiers: modifiers.data?.data,
      gelKits: kits.data?.data,
    };
    return restoreGear(ids, lists, resolved);
  }, [setup, resolved, gearSettled, lights.data, modifiers.data, kits.data]);
  const filledFrom = useRef<string | null>(null);
  useEffect(() => {
    if (!setup || !resolved || !gear || filledFrom.current === setup.id) return;
    filledFrom.current = setup.id;
    form.reset(fromSetupInput(resolved, unit));
    setConditions(savedConditions(resolved));
    // A gel kit picked again stands for the saved gels; a missing or changed one leaves them carried.
    setCarried(carriedInputs(resolved, gear.picked.gelKit ? ['gels'] : []));
    setPicked(gear.picked);
    requestPlace(savedPlace(resolved));
  }, [setup, resolved, gear, unit, form, setConditions, requestPlace, setCarried, setPicked]);
  return gear;
}
