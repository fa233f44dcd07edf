import {
  solveBackgroundExposure,
  type BackgroundExposureInput,
  type BackgroundExposureResult,
} from '@lumenwright/shared';
import { z } from 'zod';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import {
  given,
  optionalDenominatorField,
  secondsFrom,
  useCalculationForm,
} from '../../hooks/use-calculation-form';
import { clockTime, fixed, stops } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid, Readouts } from '../form-grid';
import { usePlaygroundScene, type SceneMoment } from '../playground-scene';
import { ShutterScale } from './shutter-scale';
import { WarningList } from '../warning-list';
import { ChartFigure } from '@/components/ui/side-scroll';

const maybe = z.union([z.number(), z.nan()]).optional();
const schema = z.object({
  source: z.enum(['moment', 'metered']),
  ev100: maybe,
  biasStops: maybe,
  aperture: maybe,
  isoMin: maybe,
  isoMax: maybe,
  support: z.enum(['handheld', 'tripod']),
  handheldDenominator: optionalDenominatorField,
  syncDenominator: optionalDenominatorField,
});
type ExposureForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  ev100: 'Metered EV100',
  biasStops: 'Background bias',
  aperture: 'Aperture',
  isoMin: 'Lowest ISO',
  isoMax: 'Highest ISO',
  slowestHandheldSeconds: 'Slowest hand-held shutter',
  flashSyncSeconds: 'Flash sync',
  'place.time': 'Shooting minute',
};

function toInput(
  form: ExposureForm,
  moment: SceneMoment | null,
): BackgroundExposureInput | undefined {
  const input: BackgroundExposureInput = { support: form.support };
  if (form.source === 'moment') {
    if (!moment) return undefined;
    input.place = {
      latitude: moment.latitude,
      longitude: moment.longitude,
      time: moment.time,
      sky: moment.sky,
    };
  } else {
    input.ev100 = given(form.ev100) ?? Number.NaN;
  }
  const optional = {
    biasStops: given(form.biasStops),
    aperture: given(form.aperture),
    isoMin: given(form.isoMin),
    isoMax: given(form.isoMax),
    slowestHandheldSeconds: secondsFrom(form.handheldDenominator),
    flashSyncSeconds: secondsFrom(form.syncDenominator),
  };
  for (const [key, value] of Object.entries(optional)) {
    if (value !== undefined) (input as Record<string, unknown>)[key] = value;
  }
  return input;
}

export function ExposurePanel() {
  const { moment, cautionsFor } = usePlaygroundScene();
  const { form, preview, errorFor, numberField } = useCalculationForm<
    ExposureForm,
    BackgroundExposureInput,
    BackgroundExposureResult
  >({
    schema,
    defaults: {
      source: 'moment',
      ev100: 6,
      biasStops: -1,
      aperture: 5.6,
      isoMin: 100,
      isoMax: 6400,
      support: 'handheld',
      handheldDenominator: 60,
      syncDenominator: 200,
    },
    toInput: (values) => toInput(values, moment),
    compute: solveBackgroundExposure,
  });
  const source = form.watch('source');

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="Ambient light">
          <SelectField
            label="Light level from"
            className="col-span-2"
            options={[
              {
                value: 'moment',
                label: moment
                  ? `Twilight tab: ${clockTime(moment.time)} (EV100 ${fixed(moment.ev100)})`
                  : 'Twilight tab (pick a minute)',
              },
              { value: 'metered', label: 'My meter reading' },
            ]}
            {...form.register('source')}
          />
          {source === 'metered' ? (
            <TextField label="Metered EV100 (incident)" {...numberField('ev100')} />
          ) : null}
          <TextField
            label="Background bias (stops)"
            hint="Taste: −1 keeps the sky a stop under"
            {...numberField('biasStops', undefined, 'default 0')}
          />
        </FormGrid>
        <FormGrid legend="Camera limits">
          <TextField label="Aperture (f/)" {...numberField('aperture', undefined, 'default 5.6')} />
          <SelectField
            label="Support"
            options={[
              { value: 'handheld', label: 'Hand-held' },
              { value: 'tripod', label: 'Tripod' },
            ]}
            {...form.register('support')}
          />
          <TextField label="Lowest ISO" {...numberField('isoMin', undefined, 'default 100')} />
          <TextField label="Highest ISO" {...numberField('isoMax', undefined, 'default 6400')} />
          <TextField
            label="Slowest hand-held (1/x s)"
            {...numberField('handheldDenominator', 'slowestHandheldSeconds', 'default 60')}
          />
          <TextField
            label="Flash sync (1/x s)"
            hint="Leave empty without flash"
            {...numberField('syncDenominator', 'flashSyncSeconds', 'no flash limit')}
          />
        </FormGrid>
        {errorFor('source', 'place.time') ? (
          <p className="text-small text-fault">{errorFor('source', 'place.time')}</p>
        ) : null}
      </form>
      <CalculationResult
        calculation="exposure"
        preview={preview}
        fieldLabels={labels}
        cautions={cautionsFor(0)}
      >
        {(result, input) => (
          <div className="flex flex-col gap-4">
            <div className="rounded-card border border-edge bg-panel p-4">
              <Readouts
                items={[
                  {
                    term: 'Shutter',
                    value: result.shutterLabel,
                    hint: result.needsTripod ? 'needs a tripod' : undefined,
                  },
                  { term: 'Aperture', value: result.apertureLabel },
                  { term: 'ISO', value: result.isoLabel.replace('ISO ', '') },
                  {
                    term: 'Ambient EV100',
                    value: fixed(result.ev100),
                    hint:
                      result.ambientSource === 'place'
                        ? 'modelled for the chosen minute'
                        : 'from your meter',
                  },
                  {
                    term: 'Exposing for',
                    value: `EV100 ${fixed(result.targetEv100)}`,
                    hint: `bias ${stops(result.biasStops)}`,
                  },
                  {
                    term: 'Nearest marked settings',
                    value: stops(result.nominal.errorStops),
                    hint: 'error after rounding to third stops',
                  },
                ]}
              />
            </div>
            <ChartFigure>
              <ShutterScale
                shutterSeconds={result.shutterSeconds}
                handheldSeconds={input.slowestHandheldSeconds ?? 1 / 60}
                syncSeconds={input.flashSyncSeconds}
              />
              <figcaption className="px-1 text-caption text-ink-muted">
                Shutter against the hand-held limit and flash sync.
                {result.hssLossStops !== null
                  ? ` High-speed sync would cost about ${fixed(result.hssLossStops)} stops of flash; ${fixed(result.ndStopsForSync ?? 0)} stops of ND would bring it back to sync.`
                  : ''}
              </figcaption>
            </ChartFigure>
            <WarningList warnings={result.warnings} />
          </div>
        )}
      </CalculationResult>
    </div>
  );
}
