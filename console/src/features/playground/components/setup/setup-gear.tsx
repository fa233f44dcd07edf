import type { UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import {
  useGearGelKits,
  useGearLights,
  useGearModifiers,
  type GearLight,
  type GearModifier,
} from '../../api/gear-options';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import { fixed } from '../../utils/format';
import { followPick, gelKitChanges, lightChanges, modifierChanges } from '../gear-changes';
import { FollowingGearPicker } from '../gear-picker';
import { guideNumberIn, lengthTo, modifierSizeIn, type PickedGear } from './gear-links';
import type { SetupForm } from './setup-form';

// The Dusk setup tab's "from your gear" pickers. Each fills the fields its gear stands for and
// reports the pick, so saving can name the gear by id while the fields still hold its values.
// Each also follows its pick in the studio's gear as it is now: changed or deleted since, it says
// so beside the picker (saving compares the fields with the gear as it is now, not the pick).

type Form = UseFormReturn<SetupForm, unknown, SetupForm>;
interface PickerProps<T> {
  form: Form;
  onPicked: (picked: PickedGear) => void;
  /** The id to show: the gear saving would name (picked, and its values still in the fields). */
  selected?: string | undefined;
  /** The item as it was when picked (or restored with a reopened setup). */
  picked?: T | undefined;
}

const fill = { shouldValidate: true, shouldDirty: true } as const;
/** What keeping the picked values means for saving. */
const KEEPING = 'The boxes keep their values; saving keeps them, without the link to it.';

/** The following part of a picker's props: its pick, how to compare it, and how to forget it. */
const following = <T,>(
  picked: T | undefined,
  changes: (was: T, now: T) => string[],
  thing: string,
  onDrop: () => void,
) => ({ picked, changes, thing, keeping: KEEPING, onDrop });

const describeLight = (l: { name: string; guideNumber: number; guideNumberUnit: string }) =>
  `${l.name} (GN ${fixed(l.guideNumber, 1)} ${l.guideNumberUnit})`;
const describeModifier = (m: { name: string; lossStops: number }) =>
  `${m.name} (${fixed(m.lossStops, 1)} stops)`;

/** The form has one unit for both lights, so a rim guide number already typed is converted. */
function fillKeyLight(form: Form, light: GearLight) {
  const was = form.getValues('guideNumberUnit');
  const rim = form.getValues('rimGuideNumber');
  if (was !== light.guideNumberUnit && rim !== undefined && Number.isFinite(rim))
    form.setValue('rimGuideNumber', lengthTo(rim, was, light.guideNumberUnit), fill);
  form.setValue('keyGuideNumber', light.guideNumber, fill);
  form.setValue('guideNumberUnit', light.guideNumberUnit, fill);
}

function fillKeyModifier(form: Form, modifier: GearModifier, unit: DisplayUnit) {
  if (modifier.kind) form.setValue('modifier', modifier.kind, fill);
  form.setValue('keyModifierLossStops', modifier.lossStops, fill);
  form.setValue('keyModifierSize', modifierSizeIn(modifier, unit) ?? Number.NaN, fill);
}

const fillRimLight = (form: Form, light: GearLight) =>
  form.setValue('rimGuideNumber', guideNumberIn(light, form.getValues('guideNumberUnit')), fill);

function fillRimModifier(form: Form, modifier: GearModifier) {
  form.setValue('rimModifierLossStops', modifier.lossStops, fill);
  if (modifier.beamAngleDeg !== null) form.setValue('rimBeam', String(modifier.beamAngleDeg), fill);
}

/** Key light: its guide number and unit. */
export function KeyLightPicker({ form, onPicked, selected, picked }: PickerProps<GearLight>) {
  const lights = useGearLights();
  return (
    <FollowingGearPicker
      label="Key light from your gear"
      hint="Fills in its guide number; you can still change it."
      placeholder="Choose a light…"
      items={lights.data?.data ?? []}
      selected={selected}
      describe={describeLight}
      onPick={(light) => {
        fillKeyLight(form, light);
        onPicked({ keyLight: light });
      }}
      {...following(picked, lightChanges, 'key light', () => onPicked({ keyLight: undefined }))}
    />
  );
}

/** Key modifier: its kind (when it has one), loss, and size in the form's unit (when it has one). */
export function KeyModifierPicker({
  form,
  onPicked,
  unit,
  selected,
  picked,
}: PickerProps<GearModifier> & { unit: DisplayUnit }) {
  const modifiers = useGearModifiers();
  return (
    <FollowingGearPicker
      label="Key modifier from your gear"
      hint="Fills in its kind, loss and size."
      placeholder="Choose a modifier…"
      items={modifiers.data?.data ?? []}
      selected={selected}
      describe={describeModifier}
      onPick={(modifier) => {
        fillKeyModifier(form, modifier, unit);
        onPicked({ keyModifier: modifier });
      }}
      {...following(picked, modifierChanges, 'key modifier', () =>
        onPicked({ keyModifier: undefined }),
      )}
    />
  );
}

/** Rim light: its guide number, in the unit the form uses for both lights. */
export function RimLightPicker({ form, onPicked, selected, picked }: PickerProps<GearLight>) {
  const lights = useGearLights();
  return (
    <FollowingGearPicker
      label="Rim light from your gear"
      hint="Fills in its guide number, in the key’s unit."
      placeholder="Choose a light…"
      items={lights.data?.data ?? []}
      selected={selected}
      describe={describeLight}
      onPick={(light) => {
        fillRimLight(form, light);
        onPicked({ rimLight: light });
      }}
      {...following(picked, lightChanges, 'rim light', () => onPicked({ rimLight: undefined }))}
    />
  );
}

/** Rim modifier: its loss, and its beam angle when it has one. */
export function RimModifierPicker({ form, onPicked, selected, picked }: PickerProps<GearModifier>) {
  const modifiers = useGearModifiers();
  return (
    <FollowingGearPicker
      label="Rim modifier from your gear"
      hint="Fills in its loss and beam."
      placeholder="Choose a modifier…"
      items={modifiers.data?.data ?? []}
      selected={selected}
      describe={describeModifier}
      onPick={(modifier) => {
        fillRimModifier(form, modifier);
        onPicked({ rimModifier: modifier });
      }}
      {...following(picked, modifierChanges, 'rim modifier', () =>
        onPicked({ rimModifier: undefined }),
      )}
    />
  );
}

/**
 * Gel kit: its pieces become the gels the balance may choose from (the tab has no gel list of its
 * own). Kits without pieces are left out: there would be nothing to choose from. The pick holds
 * the gels, so a changed or deleted kit keeps planning with the gels as picked until another
 * choice is made.
 */
export function GelKitPicker({
  picked,
  onPicked,
}: {
  picked: PickedGear['gelKit'];
  onPicked: (picked: PickedGear) => void;
}) {
  const kits = useGearGelKits();
  const usable = (kits.data?.data ?? []).filter((kit) => kit.pieces.length > 0);
  const followed = followPick(picked, kits.data?.data, gelKitChanges);
  return (
    <>
      <FollowingGearPicker
        label="Gel kit from your gear"
        hint="The gels the balance may choose from."
        placeholder="Choose a gel kit…"
        items={usable}
        selected={followed?.state === 'current' ? picked?.id : undefined}
        describe={(kit) =>
          `${kit.name} (${kit.pieces.length} ${kit.pieces.length === 1 ? 'gel' : 'gels'})`
        }
        onPick={(kit) => onPicked({ gelKit: kit })}
        picked={picked}
        all={kits.data?.data}
        changes={gelKitChanges}
        thing="gel kit"
        keeping="The plan keeps the gels as picked; saving lists them, without the link to the kit."
        refillLabel="Use its gels now"
      />
      {picked ? (
        <p className="col-span-2 text-small text-ink-muted" data-testid="gel-kit-choice">
          Gels from {picked.name} ({picked.pieces.length}).{' '}
          <Button variant="quiet" size="inline" onClick={() => onPicked({ gelKit: undefined })}>
            Use the built-in gels
          </Button>
        </p>
      ) : null}
    </>
  );
}
