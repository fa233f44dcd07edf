import {
  MODIFIER_NAMES,
  planDuskSetup,
  type DuskSetupInput,
  type DuskSetupPlan,
  type ModifierName,
} from '@lumenwright/shared';
import { z } from 'zod';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { given, useCalculationForm } from '../../hooks/use-calculation-form';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import { fixed } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid } from '../form-grid';
import { modifierOptions } from '../flash/flash-panel';
import { usePlaygroundScene, type SceneMoment, type SiteConditions } from '../playground-scene';
import { SetupResultView } from './setup-result';

const maybe = z.union([z.number(), z.nan()]).optional();
const number = z.number({ error: 'Enter a number' });
const schema = z.object({
  aperture: maybe,
  isoMax: maybe,
  support: z.enum(['handheld', 'tripod']),
  syncDenominator: maybe,
  biasStops: maybe,
  kelvin: maybe,
  keyGuideNumber: number,
  guideNumberUnit: z.enum(['m', 'ft']),
  keyDistance: number,
  keyAngle: maybe,
  modifier: z.enum(MODIFIER_NAMES as [ModifierName, ...ModifierName[]]),
  rimEnabled: z.boolean(),
  rimGuideNumber: maybe,
  rimDistanceBehind: maybe,
  rimHeight: maybe,
  rimBeam: z.string(),
  rimOverKeyStops: maybe,
  rimGelled: z.boolean(),
  backgroundDistance: maybe,
});
type SetupForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  'camera.aperture': 'Aperture',
  'camera.isoMax': 'Highest ISO',
  'camera.flashSyncSeconds': 'Flash sync',
  'camera.biasStops': 'Background bias',
  'camera.kelvin': 'Camera white balance',
  'key.guideNumber': 'Key guide number',
  'key.distance': 'Key distance',
  'key.angleFromCameraDeg': 'Key angle',
  'rim.guideNumber': 'Rim guide number',
  'rim.distanceBehind': 'Rim distance behind',
  'rim.lightHeight': 'Rim height',
  'rim.rimOverKeyStops': 'Rim over key',
  backgroundDistance: 'Key to background',
};

/** Drop keys whose value is undefined, so the request (and the copied snippet) stays short. */
function compact<T extends object>(value: T): T {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as T;
}

export function toSetupInput(
  form: SetupForm,
  unit: DisplayUnit,
  moment: SceneMoment | null,
  conditions: SiteConditions,
): DuskSetupInput | undefined {
  if (!moment) return undefined;
  const input: DuskSetupInput = {
    latitude: moment.latitude,
    longitude: moment.longitude,
    date: moment.date,
    timeZone: moment.timeZone,
    sky: moment.sky,
    camera: compact({
      aperture: given(form.aperture),
      isoMax: given(form.isoMax),
      support: form.support,
      flashSyncSeconds: given(form.syncDenominator) ? 1 / form.syncDenominator! : undefined,
      biasStops: given(form.biasStops),
      kelvin: given(form.kelvin),
    }),
    key: compact({
      guideNumber: form.keyGuideNumber,
      guideNumberUnit: form.guideNumberUnit,
      distance: form.keyDistance,
      distanceUnit: unit,
      angleFromCameraDeg: given(form.keyAngle),
      modifier: form.modifier,
    }),
    conditions: compact({ ...conditions }),
  };
  if (form.rimEnabled) {
    input.rim = compact({
      guideNumber: given(form.rimGuideNumber) ?? Number.NaN,
      guideNumberUnit: form.guideNumberUnit,
      distanceBehind: given(form.rimDistanceBehind) ?? Number.NaN,
      lightHeight: given(form.rimHeight) ?? Number.NaN,
      distanceUnit: unit,
      beamAngleDeg: Number(form.rimBeam),
      rimOverKeyStops: given(form.rimOverKeyStops),
      gelled: form.rimGelled,
    });
  }
  if (given(form.backgroundDistance) !== undefined)
    input.backgroundDistance = form.backgroundDistance;
  return input;
}

export function SetupPanel() {
  const { moment, conditions } = usePlaygroundScene();
  const { form, unit, preview, numberField } = useCalculationForm<
    SetupForm,
    DuskSetupInput,
    DuskSetupPlan
  >({
    schema,
    defaults: {
      aperture: 5.6,
      isoMax: 6400,
      support: 'handheld',
      syncDenominator: 200,
      biasStops: -1,
      kelvin: 3800,
      keyGuideNumber: 40,
      guideNumberUnit: 'm',
      keyDistance: 2,
      keyAngle: 60,
      modifier: 'softbox',
      rimEnabled: true,
      rimGuideNumber: 40,
      rimDistanceBehind: 2.5,
      rimHeight: 1.2,
      rimBeam: '30',
      rimOverKeyStops: 1,
      rimGelled: true,
      backgroundDistance: 12,
    },
    lengthFields: ['keyDistance', 'rimDistanceBehind', 'rimHeight', 'backgroundDistance'],
    toInput: (values, displayUnit) => toSetupInput(values, displayUnit, moment, conditions),
    compute: planDuskSetup,
  });
  const rimEnabled = form.watch('rimEnabled');

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <p className="rounded-card border border-edge bg-panel p-4 text-small text-ink-muted">
          {moment
            ? `Place and date from the Twilight tab: ${fixed(moment.latitude, 3)}°, ${fixed(moment.longitude, 3)}° on ${moment.date} (${moment.timeZone}), sky ${moment.sky}. Site conditions above set the cautions.`
            : 'Set the place and date on the Twilight tab first.'}
        </p>
        <FormGrid legend="Camera">
          <TextField label="Aperture (f/)" {...numberField('aperture', 'camera.aperture')} />
          <TextField label="Highest ISO" {...numberField('isoMax', 'camera.isoMax')} />
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
            {...numberField('syncDenominator', 'camera.flashSyncSeconds')}
          />
          <TextField
            label="Background bias (stops)"
            {...numberField('biasStops', 'camera.biasStops')}
          />
          <TextField label="White balance (K)" {...numberField('kelvin', 'camera.kelvin')} />
        </FormGrid>
        <FormGrid legend="Key light">
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
            {...numberField('keyAngle', 'key.angleFromCameraDeg')}
          />
          <SelectField
            label="Modifier"
            className="col-span-2"
            options={modifierOptions}
            {...form.register('modifier')}
          />
          <TextField
            label={`Key to background (${unit})`}
            hint="Optional"
            className="col-span-2"
            {...numberField('backgroundDistance')}
          />
        </FormGrid>
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
              <TextField
                label="Guide number"
                {...numberField('rimGuideNumber', 'rim.guideNumber')}
              />
              <TextField
                label={`Behind subject (${unit})`}
                {...numberField('rimDistanceBehind', 'rim.distanceBehind')}
              />
              <TextField
                label={`Height (${unit})`}
                {...numberField('rimHeight', 'rim.lightHeight')}
              />
              <SelectField
                label="Beam"
                options={[
                  { value: '100', label: 'Bare' },
                  { value: '40', label: '40° grid' },
                  { value: '30', label: '30° grid' },
                  { value: '20', label: '20° grid' },
                  { value: '10', label: '10° grid' },
                ]}
                {...form.register('rimBeam')}
              />
              <TextField
                label="Rim over key (stops)"
                {...numberField('rimOverKeyStops', 'rim.rimOverKeyStops')}
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
      </form>
      <CalculationResult calculation="setup" preview={preview} fieldLabels={labels}>
        {(plan, input) => <SetupResultView plan={plan} input={input} />}
      </CalculationResult>
    </div>
  );
}
