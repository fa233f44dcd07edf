import { useState } from 'react';
import {
  useGearLights,
  useGearModifiers,
  type GearLight,
  type GearModifier,
} from '../../api/gear-options';
import { fixed } from '../../utils/format';
import { lightChanges, modifierChanges } from '../gear-changes';
import { FollowingGearPicker } from '../gear-picker';

// The Flash tab's "from your gear" pickers. Each remembers its pick and follows it in the studio's
// gear as it is now, so an item changed or deleted since (in another tab) is named beside it.

const KEEPING = 'The boxes keep their values.';

/** Light: `fill` puts its guide number and unit in the boxes. */
export function FlashLightPicker({ fill }: { fill: (light: GearLight) => void }) {
  const lights = useGearLights();
  const [picked, setPicked] = useState<GearLight>();
  return (
    <FollowingGearPicker
      label="Light from your gear"
      hint="Fills in its guide number; you can still change it."
      placeholder="Choose a light…"
      items={lights.data?.data ?? []}
      describe={(l) => `${l.name} (GN ${fixed(l.guideNumber, 1)} ${l.guideNumberUnit})`}
      onPick={(light) => {
        fill(light);
        setPicked(light);
      }}
      picked={picked}
      changes={lightChanges}
      thing="light"
      keeping={KEEPING}
      onDrop={() => setPicked(undefined)}
    />
  );
}

/** Modifier: `fill` puts its kind and loss in the boxes. */
export function FlashModifierPicker({ fill }: { fill: (modifier: GearModifier) => void }) {
  const modifiers = useGearModifiers();
  const [picked, setPicked] = useState<GearModifier>();
  return (
    <FollowingGearPicker
      label="Modifier from your gear"
      hint="Fills in its kind and loss."
      placeholder="Choose a modifier…"
      items={modifiers.data?.data ?? []}
      describe={(m) => `${m.name} (${fixed(m.lossStops, 1)} stops)`}
      onPick={(modifier) => {
        fill(modifier);
        setPicked(modifier);
      }}
      picked={picked}
      changes={modifierChanges}
      thing="modifier"
      keeping={KEEPING}
      onDrop={() => setPicked(undefined)}
    />
  );
}
