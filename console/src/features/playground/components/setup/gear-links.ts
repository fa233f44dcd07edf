import { fromMetres, toMetres, type DuskSetupInput } from '@lumenwright/shared';
import type { GearGelKit, GearLight, GearModifier } from '../../api/gear-options';
import type { SavedSetupInputs } from '../../api/saved-setups';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import {
  currentItem,
  followPick,
  gelKitChanges,
  lightChanges,
  modifierChanges,
} from '../gear-changes';

/** The studio gear picked on the Dusk setup tab since it was opened (or reopened). */
export interface PickedGear {
  keyLight?: GearLight;
  keyModifier?: GearModifier;
  rimLight?: GearLight;
  rimModifier?: GearModifier;
  gelKit?: GearGelKit;
}

/** The studio's lists as they are now; undefined while a list is not known. */
export interface GearLists {
  lights: readonly GearLight[] | undefined;
  modifiers: readonly GearModifier[] | undefined;
  gelKits: readonly GearGelKit[] | undefined;
}

/**
 * The picks as the studio's gear has them now, for `withGearIds`: a deleted item is left out and a
 * changed one is its current self, so an id is only saved while the fields hold its values now.
 */
export function currentPicks(picked: PickedGear, gear: GearLists): PickedGear {
  const out: PickedGear = {};
  const keyLight = currentItem(followPick(picked.keyLight, gear.lights, lightChanges));
  const rimLight = currentItem(followPick(picked.rimLight, gear.lights, lightChanges));
  const keyModifier = currentItem(followPick(picked.keyModifier, gear.modifiers, modifierChanges));
  const rimModifier = currentItem(followPick(picked.rimModifier, gear.modifiers, modifierChanges));
  const gelKit = currentItem(followPick(picked.gelKit, gear.gelKits, gelKitChanges));
  if (keyLight) out.keyLight = keyLight;
  if (keyModifier) out.keyModifier = keyModifier;
  if (rimLight) out.rimLight = rimLight;
  if (rimModifier) out.rimModifier = rimModifier;
  if (gelKit) out.gelKit = gelKit;
  return out;
}

/** A length (or a guide number: a distance x f-number) in `to`, 2 decimals when converted. */
export function lengthTo(value: number, from: DisplayUnit, to: DisplayUnit): number {
  if (from === to) return value;
  return Number(fromMetres(toMetres(value, from), to).toFixed(2));
}

/** The light's guide number in the form's guide-number unit. */
export const guideNumberIn = (light: GearLight, unit: DisplayUnit) =>
  lengthTo(light.guideNumber, light.guideNumberUnit, unit);

/** The modifier's size in the form's length unit, or undefined when the gear has none. */
export function modifierSizeIn(modifier: GearModifier, unit: DisplayUnit): number | undefined {
  if (modifier.size === null) return undefined;
  return lengthTo(modifier.size, modifier.sizeUnit ?? 'm', unit);
}

/** The kit's pieces as the gels the balance may choose from, in the kit's order. */
export function kitGels(kit: GearGelKit): NonNullable<DuskSetupInput['gels']> {
  return [...kit.pieces]
    .sort((a, b) => a.position - b.position)
    .map((p) => ({
      name: p.name,
      miredShift: p.miredShift,
      greenShift: p.greenShift,
      lossStops: p.lossStops,
    }));
}

/** Equal up to the 2-decimal rounding a unit conversion leaves in a field. */
const same = (a: number | undefined, b: number | undefined) =>
  a !== undefined && b !== undefined && Math.abs(a - b) < 0.006;

type Part = Record<string, unknown>;

/**
 * The input to save: each picked piece of gear whose values the form still holds is named by id
 * instead (the server resolves ids to the same values and keeps the link), so the saved setup
 * follows the gear. A value changed after picking is saved as typed, without the link.
 */
export function withGearIds(input: DuskSetupInput, picked: PickedGear): SavedSetupInputs {
  const key: Part = { ...input.key };
  const rim: Part | undefined = input.rim ? { ...input.rim } : undefined;
  const out: Part = { ...input, key, ...(rim ? { rim } : {}) };
  const unit = input.key.guideNumberUnit ?? 'm';
  const { keyLight, keyModifier, rimLight, rimModifier, gelKit } = picked;
  if (keyLight && same(input.key.guideNumber, guideNumberIn(keyLight, unit))) {
    delete key.guideNumber;
    delete key.guideNumberUnit;
    key.lightId = keyLight.id;
  }
  if (
    keyModifier &&
    same(input.key.modifierLossStops, keyModifier.lossStops) &&
    (keyModifier.kind === null || keyModifier.kind === (input.key.modifier ?? 'softbox'))
  ) {
    delete key.modifierLossStops;
    const size = modifierSizeIn(keyModifier, input.key.distanceUnit ?? 'm');
    if (size !== undefined && same(input.key.modifierSize, size)) delete key.modifierSize;
    key.modifierId = keyModifier.id;
  }
  if (rim && input.rim && rimLight) {
    const rimUnit = input.rim.guideNumberUnit ?? 'm';
    if (same(input.rim.guideNumber, guideNumberIn(rimLight, rimUnit))) {
      delete rim.guideNumber;
      delete rim.guideNumberUnit;
      rim.lightId = rimLight.id;
    }
  }
  if (rim && input.rim && rimModifier && same(input.rim.modifierLossStops, rimModifier.lossStops)) {
    delete rim.modifierLossStops;
    if (rimModifier.beamAngleDeg !== null && input.rim.beamAngleDeg === rimModifier.beamAngleDeg)
      delete rim.beamAngleDeg;
    rim.modifierId = rimModifier.id;
  }
  if (gelKit && JSON.stringify(input.gels) === JSON.stringify(kitGels(gelKit))) {
    delete out.gels;
    out.gelKitId = gelKit.id;
  }
  return out as unknown as SavedSetupInputs;
}
