import { fromMetres, toMetres, type DuskSetupInput } from '@lumenwright/shared';
import type { GearGelKit, GearLight, GearModifier } from '../../api/gear-options';
import type { DisplayUnit } from '../../hooks/use-length-unit';

/** The studio gear picked on the Dusk setup tab since it was opened (or reopened). */
export interface PickedGear {
  keyLight?: GearLight;
  keyModifier?: GearModifier;
  rimLight?: GearLight;
  rimModifier?: GearModifier;
  gelKit?: GearGelKit;
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
