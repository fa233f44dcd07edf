import type { UseFormReturn } from 'react-hook-form';
import { Button } from '@/components/ui/button';
import { useGearGelKits, useGearLights, useGearModifiers } from '../../api/gear-options';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import { fixed } from '../../utils/format';
import { GearPicker } from '../gear-picker';
import { guideNumberIn, lengthTo, modifierSizeIn, type PickedGear } from './gear-links';
import type { SetupForm } from './setup-form';

// The Dusk setup tab's "from your gear" pickers. Each fills the fields its gear stands for and
// reports the pick, so saving can name the gear by id while the fields still hold its values.

type Form = UseFormReturn<SetupForm, unknown, SetupForm>;
interface PickerProps {
  form: Form;
  onPicked: (picked: PickedGear) => void;
  /** The id to show: the gear saving would name (picked, and its values still in the fields). */
  selected?: string | undefined;
}

const fill = { shouldValidate: true, shouldDirty: true } as const;

const describeLight = (l: { name: string; guideNumber: number; guideNumberUnit: string }) =>
  `${l.name} (GN ${fixed(l.guideNumber, 1)} ${l.guideNumberUnit})`;
const describeModifier = (m: { name: string; lossStops: number }) =>
  `${m.name} (${fixed(m.lossStops, 1)} stops)`;

/** Key light: its guide number and unit. The form has one unit for both lights, so a rim guide
 * number already typed is converted to the new unit and keeps its meaning. */
export function KeyLightPicker({ form, onPicked, selected }: PickerProps) {
  const lights = useGearLights();
  return (
    <GearPicker
      label="Key light from your gear"
      hint="Fills in its guide number; you can still change it."
      placeholder="Choose a light…"
      items={lights.data?.data ?? []}
      selected={selected}
      describe={describeLight}
      onPick={(light) => {
        const was = form.getValues('guideNumberUnit');
        const rim = form.getValues('rimGuideNumber');
        if (was !== light.guideNumberUnit && rim !== undefined && Number.isFinite(rim))
          form.setValue('rimGuideNumber', lengthTo(rim, was, light.guideNumberUnit), fill);
        form.setValue('keyGuideNumber', light.guideNumber, fill);
        form.setValue('guideNumberUnit', light.guideNumberUnit, fill);
        onPicked({ keyLight: light });
      }}
    />
  );
}

/** Key modifier: its kind (when it has one), loss, and size in the form's unit (when it has one). */
export function KeyModifierPicker({
  form,
  onPicked,
  unit,
  selected,
}: PickerProps & { unit: DisplayUnit }) {
  const modifiers = useGearModifiers();
  return (
    <GearPicker
      label="Key modifier from your gear"
      hint="Fills in its kind, loss and size."
      placeholder="Choose a modifier…"
      items={modifiers.data?.data ?? []}
      selected={selected}
      describe={describeModifier}
      onPick={(modifier) => {
        if (modifier.kind) form.setValue('modifier', modifier.kind, fill);
        form.setValue('keyModifierLossStops', modifier.lossStops, fill);
        form.setValue('keyModifierSize', modifierSizeIn(modifier, unit) ?? Number.NaN, fill);
        onPicked({ keyModifier: modifier });
      }}
    />
  );
}

/** Rim light: its guide number, in the unit the form uses for both lights. */
export function RimLightPicker({ form, onPicked, selected }: PickerProps) {
  const lights = useGearLights();
  return (
    <GearPicker
      label="Rim light from your gear"
      hint="Fills in its guide number, in the key’s unit."
      placeholder="Choose a light…"
      items={lights.data?.data ?? []}
      selected={selected}
      describe={describeLight}
      onPick={(light) => {
        const unit = form.getValues('guideNumberUnit');
        form.setValue('rimGuideNumber', guideNumberIn(light, unit), fill);
        onPicked({ rimLight: light });
      }}
    />
  );
}

/** Rim modifier: its loss, and its beam angle when it has one. */
export function RimModifierPicker({ form, onPicked, selected }: PickerProps) {
  const modifiers = useGearModifiers();
  return (
    <GearPicker
      label="Rim modifier from your gear"
      hint="Fills in its loss and beam."
      placeholder="Choose a modifier…"
      items={modifiers.data?.data ?? []}
      selected={selected}
      describe={describeModifier}
      onPick={(modifier) => {
        form.setValue('rimModifierLossStops', modifier.lossStops, fill);
        if (modifier.beamAngleDeg !== null)
          form.setValue('rimBeam', String(modifier.beamAngleDeg), fill);
        onPicked({ rimModifier: modifier });
      }}
    />
  );
}

/**
 * Gel kit: its pieces become the gels the balance may choose from (the tab has no gel list of its
 * own). Kits without pieces are left out: there would be nothing to choose from.
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
  return (
    <>
      <GearPicker
        label="Gel kit from your gear"
        hint="The gels the balance may choose from."
        placeholder="Choose a gel kit…"
        items={usable}
        selected={picked?.id}
        describe={(kit) =>
          `${kit.name} (${kit.pieces.length} ${kit.pieces.length === 1 ? 'gel' : 'gels'})`
        }
        onPick={(kit) => onPicked({ gelKit: kit })}
      />
      {picked ? (
        <p className="col-span-2 text-small text-ink-muted" data-testid="gel-kit-choice">
          Gels from {picked.name} ({picked.pieces.length}).{' '}
          <Button
            variant="quiet"
            className="px-0 py-0"
            onClick={() => onPicked({ gelKit: undefined })}
          >
            Use the built-in gels
          </Button>
        </p>
      ) : null}
    </>
  );
}
