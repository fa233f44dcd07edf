import { MODIFIERS, type DuskSetupInput, type DuskSetupPlan } from '@lumenwright/shared';
import { useWatch } from 'react-hook-form';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import type { useCalculationForm } from '../../hooks/use-calculation-form';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import { FormGrid } from '../form-grid';
import { modifierOptions } from '../flash/flash-panel';
import { lengthTo, type PickedGear } from './gear-links';
import type { SavedGearIds } from './restore-gear';
import type { SetupForm } from './setup-form';
import {
  GelKitPicker,
  KeyLightPicker,
  KeyModifierPicker,
  RimLightPicker,
  RimModifierPicker,
} from './setup-gear';

// The Dusk setup form's three groups of boxes: camera, key light and rim light.

type Calculation = ReturnType<typeof useCalculationForm<SetupForm, DuskSetupInput, DuskSetupPlan>>;

export interface FieldsetProps {
  form: Calculation['form'];
  numberField: Calculation['numberField'];
  unit: DisplayUnit;
  picked: PickedGear;
  /** The gear ids saving would keep, shown in the pickers. */
  linked: SavedGearIds;
  onPicked: (picked: PickedGear) => void;
}

export function CameraFieldset({ form, numberField, picked, onPicked }: FieldsetProps) {
  return (
    <FormGrid legend="Camera">
      <TextField
        label="Aperture (f/)"
        {...numberField('aperture', 'camera.aperture', 'default 5.6')}
      />
      <TextField label="Highest ISO" {...numberField('isoMax', 'camera.isoMax', 'default 6400')} />
      <SelectField
        label="Support"
        options={[
          { value: 'handheld', label: 'Hand-held' },
          { value: 'tripod', label: 'Tripod' },
        ]}
        {...form.register('support')}
      />
      <TextField
        label="Flash sync (1/x s)"
        {...numberField('syncDenominator', 'camera.flashSyncSeconds', 'default 200')}
      />
      <TextField
        label="Background bias (stops)"
        {...numberField('biasStops', 'camera.biasStops', 'default −1')}
      />
      <TextField
        label="Darkest bias (stops)"
        hint="How dark the background may go when a flash can't turn down far enough; empty: the bias stays fixed"
        {...numberField('biasFloorStops', 'camera.biasFloorStops', 'none')}
      />
      <TextField
        label="White balance (K)"
        {...numberField('kelvin', 'camera.kelvin', 'default 3800')}
      />
      <TextField
        label="Gels close enough (mired)"
        hint="Fewer gels when within this; 0 = closest"
        {...numberField('miredTolerance', undefined, 'default 0')}
      />
      <GelKitPicker picked={picked.gelKit} onPicked={onPicked} />
    </FormGrid>
  );
}

export function KeyFieldset({ form, numberField, unit, picked, linked, onPicked }: FieldsetProps) {
  const modifier = useWatch({ control: form.control, name: 'modifier' });
  return (
    <FormGrid legend="Key light">
      <KeyLightPicker
        form={form}
        onPicked={onPicked}
        selected={linked.keyLight}
        picked={picked.keyLight}
      />
      <TextField label="Guide number" {...numberField('keyGuideNumber', 'key.guideNumber')} />
      <SelectField
        label="Guide numbers in"
        options={[
          { value: 'm', label: 'metres' },
          { value: 'ft', label: 'feet' },
        ]}
        {...form.register('guideNumberUnit')}
      />
      <TextField label={`Distance (${unit})`} {...numberField('keyDistance', 'key.distance')} />
      <TextField
        label="Angle from camera (°)"
        {...numberField('keyAngle', 'key.angleFromCameraDeg', 'default 60')}
      />
      <KeyModifierPicker
        form={form}
        onPicked={onPicked}
        unit={unit}
        selected={linked.keyModifier}
        picked={picked.keyModifier}
      />
      <SelectField
        label="Modifier"
        className="col-span-2"
        options={modifierOptions}
        {...form.register('modifier', {
          // A loss or size belongs to the modifier it was given for: another one drops them.
          onChange: () => {
            form.setValue('keyModifierLossStops', Number.NaN, { shouldValidate: true });
            form.setValue('keyModifierSize', Number.NaN, { shouldValidate: true });
          },
        })}
      />
      <TextField
        label="Modifier loss (stops)"
        hint="Empty: the modifier's usual"
        {...numberField(
          'keyModifierLossStops',
          'key.modifierLossStops',
          `default ${MODIFIERS[modifier].lossStops}`,
        )}
      />
      <TextField
        label={`Modifier size (${unit})`}
        hint="Empty: the modifier's usual"
        {...numberField(
          'keyModifierSize',
          'key.modifierSize',
          `default ${lengthTo(MODIFIERS[modifier].sizeM, 'm', unit)}`,
        )}
      />
      <TextField
        label={`Key to background (${unit})`}
        hint="Optional"
        className="col-span-2"
        {...numberField('backgroundDistance', undefined, 'not set')}
      />
    </FormGrid>
  );
}

const BEAMS = [
  { value: '100', label: 'Bare' },
  { value: '40', label: '40° grid' },
  { value: '30', label: '30° grid' },
  { value: '20', label: '20° grid' },
  { value: '10', label: '10° grid' },
];

/** The usual beams, plus a modifier's own beam angle when one from the gear set another. */
function beamOptions(current: string) {
  return BEAMS.some((b) => b.value === current)
    ? BEAMS
    : [...BEAMS, { value: current, label: `${current}°` }];
}

export function RimFieldset({ form, numberField, unit, picked, linked, onPicked }: FieldsetProps) {
  const rimEnabled = useWatch({ control: form.control, name: 'rimEnabled' });
  const rimBeam = useWatch({ control: form.control, name: 'rimBeam' });
  return (
    <FormGrid legend="Rim light">
      <label className="col-span-2 flex items-center gap-2 text-small font-medium">
        <input
          type="checkbox"
          className="size-4 accent-(--color-accent)"
          {...form.register('rimEnabled')}
        />
        Use a rim light behind the subject
      </label>
      {rimEnabled ? (
        <>
          <RimLightPicker
            form={form}
            onPicked={onPicked}
            selected={linked.rimLight}
            picked={picked.rimLight}
          />
          <TextField label="Guide number" {...numberField('rimGuideNumber', 'rim.guideNumber')} />
          <TextField
            label={`Behind subject (${unit})`}
            {...numberField('rimDistanceBehind', 'rim.distanceBehind')}
          />
          <TextField label={`Height (${unit})`} {...numberField('rimHeight', 'rim.lightHeight')} />
          <RimModifierPicker
            form={form}
            onPicked={onPicked}
            selected={linked.rimModifier}
            picked={picked.rimModifier}
          />
          <SelectField
            label="Beam"
            options={beamOptions(rimBeam)}
            {...form.register('rimBeam')}
            // Controlled: a beam from the gear is set before its option exists.
            value={rimBeam}
          />
          <TextField
            label="Modifier loss (stops)"
            {...numberField('rimModifierLossStops', 'rim.modifierLossStops', 'default 0')}
          />
          <TextField
            label="Rim over key (stops)"
            {...numberField('rimOverKeyStops', 'rim.rimOverKeyStops', 'default 1')}
          />
          <label className="flex items-center gap-2 self-end pb-2 text-small">
            <input
              type="checkbox"
              className="size-4 accent-(--color-accent)"
              {...form.register('rimGelled')}
            />
            Gel like the key
          </label>
        </>
      ) : null}
    </FormGrid>
  );
}
