import {
  MODIFIERS,
  MODIFIER_NAMES,
  computeFlash,
  type FlashInput,
  type FlashResult,
  type ModifierName,
} from '@lumenwright/shared';
import { z } from 'zod';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { given, useCalculationForm } from '../../hooks/use-calculation-form';
import { fixed } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid, Readouts } from '../form-grid';
import { usePlaygroundScene } from '../playground-scene';
import { FlashLightPicker, FlashModifierPicker } from './flash-gear';
import { PowerScale } from './power-scale';
import { ChartFigure } from '@/components/ui/side-scroll';

export const modifierLabels: Record<ModifierName, string> = {
  bare: 'Bare head',
  umbrella: 'Umbrella',
  softbox: 'Softbox',
  'softbox-double-diffusion': 'Softbox, double diffusion',
  octabox: 'Octabox',
  'beauty-dish': 'Beauty dish (white)',
  grid: 'Grid',
  snoot: 'Snoot',
};

export const modifierOptions = MODIFIER_NAMES.map((name) => ({
  value: name,
  label: `${modifierLabels[name]} (about ${MODIFIERS[name].lossStops} stops)`,
}));

const maybe = z.union([z.number(), z.nan()]).optional();
const number = z.number({ error: 'Enter a number' });
const schema = z.object({
  guideNumber: number,
  guideNumberUnit: z.enum(['m', 'ft']),
  distance: number,
  aperture: number,
  iso: maybe,
  modifier: z.enum(MODIFIER_NAMES as [ModifierName, ...ModifierName[]]),
  modifierLossStops: maybe,
  gelLossStops: maybe,
});
type FlashForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  guideNumber: 'Guide number',
  distance: 'Light to subject',
  aperture: 'Aperture',
  iso: 'ISO',
  modifierLossStops: 'Modifier loss',
  gelLossStops: 'Gel loss',
};

export function FlashPanel() {
  const { cautionsFor } = usePlaygroundScene();
  const { form, unit, preview, numberField } = useCalculationForm<
    FlashForm,
    FlashInput,
    FlashResult
  >({
    schema,
    defaults: {
      guideNumber: 40,
      guideNumberUnit: 'm',
      distance: 2,
      aperture: 5.6,
      iso: 400,
      modifier: 'softbox',
      modifierLossStops: Number.NaN,
      gelLossStops: 0.4,
    },
    lengthFields: ['distance'],
    toInput: (values, displayUnit) => {
      const input: FlashInput = {
        guideNumber: values.guideNumber,
        guideNumberUnit: values.guideNumberUnit,
        distance: values.distance,
        distanceUnit: displayUnit,
        aperture: values.aperture,
        modifierLossStops: given(values.modifierLossStops) ?? MODIFIERS[values.modifier].lossStops,
      };
      if (given(values.iso) !== undefined) input.iso = values.iso;
      if (given(values.gelLossStops) !== undefined) input.gelLossStops = values.gelLossStops;
      return input;
    },
    compute: computeFlash,
  });
  const modifier = form.watch('modifier');
  const fill = { shouldValidate: true, shouldDirty: true } as const;

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="Key light">
          <FlashLightPicker
            fill={(light) => {
              form.setValue('guideNumber', light.guideNumber, fill);
              form.setValue('guideNumberUnit', light.guideNumberUnit, fill);
            }}
          />
          <TextField label="Guide number (ISO 100)" {...numberField('guideNumber')} />
          <SelectField
            label="Guide number in"
            options={[
              { value: 'm', label: 'metres' },
              { value: 'ft', label: 'feet' },
            ]}
            {...form.register('guideNumberUnit')}
          />
          <TextField label={`Light to subject (${unit})`} {...numberField('distance')} />
          <TextField label="Aperture (f/)" {...numberField('aperture')} />
          <TextField label="ISO" {...numberField('iso', undefined, 'default 100')} />
          <FlashModifierPicker
            fill={(picked) => {
              if (picked.kind) form.setValue('modifier', picked.kind, fill);
              form.setValue('modifierLossStops', picked.lossStops, fill);
            }}
          />
          <SelectField
            label="Modifier"
            className="col-span-2"
            options={modifierOptions}
            {...form.register('modifier')}
          />
          <TextField
            label="Modifier loss (stops)"
            hint="Empty: the modifier's usual"
            {...numberField(
              'modifierLossStops',
              undefined,
              `default ${MODIFIERS[modifier].lossStops}`,
            )}
          />
          <TextField
            label="Gel loss (stops)"
            hint="From the Gels tab"
            {...numberField('gelLossStops', undefined, 'default 0')}
          />
        </FormGrid>
      </form>
      <CalculationResult
        calculation="flash"
        preview={preview}
        fieldLabels={labels}
        cautions={cautionsFor(1)}
      >
        {(result) => (
          <div className="flex flex-col gap-4">
            <div className="rounded-card border border-edge bg-panel p-4">
              <Readouts
                items={[
                  {
                    term: 'Power',
                    value: result.powerLabel,
                    hint: result.feasible
                      ? 'within the light’s range'
                      : 'outside the light’s range',
                  },
                  {
                    term: 'Decimal scale',
                    value: fixed(result.decimalPower),
                    hint: '10 = full, 1 per stop',
                  },
                  { term: 'Below full', value: `${fixed(result.stopsBelowFull)} stops` },
                  {
                    term: 'Guide number needed',
                    value: fixed(result.requiredGuideNumber),
                    hint: `at ISO 100, no losses (${form.getValues('guideNumberUnit')})`,
                  },
                  {
                    term: 'Effective guide number',
                    value: fixed(result.effectiveGuideNumber),
                    hint: 'after ISO and losses',
                  },
                  { term: 'Total loss', value: `${fixed(result.totalLossStops, 2)} stops` },
                ]}
              />
            </div>
            <ChartFigure>
              <PowerScale stopsBelowFull={result.stopsBelowFull} powerLabel={result.powerLabel} />
              <figcaption className="px-1 text-caption text-ink-muted">
                Power setting on a 1/256 to full scale, in thirds of a stop.
              </figcaption>
            </ChartFigure>
            {result.fixes ? (
              <div className="rounded-card border border-caution/50 bg-panel p-4 text-small">
                <p className="font-semibold">Any one of these fixes it:</p>
                <ul className="mt-1 list-disc pl-5 text-ink-muted">
                  {result.fixes.moveCloserTo !== undefined ? (
                    <li>
                      Move the light to {fixed(result.fixes.moveCloserTo, 2)} {unit}
                    </li>
                  ) : null}
                  {result.fixes.raiseIsoTo !== undefined ? (
                    <li>Raise ISO to {result.fixes.raiseIsoTo}</li>
                  ) : null}
                  {result.fixes.openUpTo !== undefined ? (
                    <li>Open up to f/{fixed(result.fixes.openUpTo)}</li>
                  ) : null}
                  {result.fixes.moveBackTo !== undefined ? (
                    <li>
                      Move the light back to {fixed(result.fixes.moveBackTo, 2)} {unit}
                    </li>
                  ) : null}
                  {result.fixes.stopDownTo !== undefined ? (
                    <li>Stop down to f/{fixed(result.fixes.stopDownTo)}</li>
                  ) : null}
                  {result.fixes.lowerIsoTo !== undefined ? (
                    <li>Lower ISO to {result.fixes.lowerIsoTo}</li>
                  ) : null}
                  {result.fixes.addLossStops !== undefined ? (
                    <li>
                      Take {fixed(result.fixes.addLossStops)} stops away in front of the flash (ND
                      gel or more diffusion)
                    </li>
                  ) : null}
                </ul>
              </div>
            ) : null}
          </div>
        )}
      </CalculationResult>
    </div>
  );
}
