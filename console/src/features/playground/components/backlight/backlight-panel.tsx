import {
  computeBacklight,
  fromMetres,
  type BacklightInput,
  type BacklightResult,
} from '@lumenwright/shared';
import { z } from 'zod';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { given, useCalculationForm } from '../../hooks/use-calculation-form';
import { fixed, stops } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { SideDiagram } from '../diagrams/side-diagram';
import { FormGrid, Readouts } from '../form-grid';
import { usePlaygroundScene } from '../playground-scene';
import { WarningList } from '../warning-list';
import { ChartFigure } from '@/components/ui/side-scroll';

const maybe = z.union([z.number(), z.nan()]).optional();
const number = z.number({ error: 'Enter a number' });
const schema = z.object({
  lightHeight: number,
  distanceBehind: number,
  headHeight: maybe,
  beamAngleDeg: z.string(),
  tiltDeg: maybe,
});
type BacklightForm = z.infer<typeof schema>;

// Common practice, no source: nominal grid spreads as usually marked on generic grids.
const beams = [
  { value: '100', label: 'Bare head (about 100°)' },
  { value: '60', label: 'Wide reflector (about 60°)' },
  { value: '40', label: '40° grid' },
  { value: '30', label: '30° grid' },
  { value: '20', label: '20° grid' },
  { value: '10', label: '10° grid' },
];

/** The head height computeBacklight assumes when none is given. */
const DEFAULT_HEAD_M = 1.6;

const labels: Record<string, string> = {
  lightHeight: 'Light height',
  distanceBehind: 'Distance behind the subject',
  headHeight: 'Head height',
  tiltDeg: 'Tilt',
  beamAngleDeg: 'Beam angle',
};

/** Where along the ground the beam lands, in words (positive = toward the light). */
function spillText(spill: { from: number; to: number | null }, unit: string): string {
  const place = (d: number) =>
    Math.abs(d) < 0.05
      ? 'at the subject'
      : `${fixed(Math.abs(d), 1)} ${unit} ${d > 0 ? 'behind' : 'in front of'} the subject`;
  return spill.to === null
    ? `lit from ${place(spill.from)} on toward the camera`
    : `lit from ${place(spill.from)} to ${place(spill.to)}`;
}

export function BacklightPanel() {
  const { cautionsFor } = usePlaygroundScene();
  const { form, unit, preview, numberField } = useCalculationForm<
    BacklightForm,
    BacklightInput,
    BacklightResult
  >({
    schema,
    defaults: {
      lightHeight: 1.2,
      distanceBehind: 2.5,
      headHeight: 1.6,
      beamAngleDeg: '30',
      tiltDeg: Number.NaN,
    },
    lengthFields: ['lightHeight', 'distanceBehind', 'headHeight'],
    toInput: (values, displayUnit) => {
      const input: BacklightInput = {
        lightHeight: values.lightHeight,
        distanceBehind: values.distanceBehind,
        distanceUnit: displayUnit,
        beamAngleDeg: Number(values.beamAngleDeg),
      };
      if (given(values.headHeight) !== undefined) input.headHeight = values.headHeight;
      if (given(values.tiltDeg) !== undefined) input.tiltDeg = values.tiltDeg;
      return input;
    },
    compute: computeBacklight,
  });

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="Rim light behind the subject">
          <TextField label={`Height (${unit})`} {...numberField('lightHeight')} />
          <TextField label={`Behind subject (${unit})`} {...numberField('distanceBehind')} />
          <TextField
            label={`Head height (${unit})`}
            {...numberField(
              'headHeight',
              undefined,
              `default ${fixed(fromMetres(DEFAULT_HEAD_M, unit), 2)}`,
            )}
          />
          <TextField
            label="Tilt (°, + up)"
            hint="Empty: aimed at the head"
            {...numberField('tiltDeg', undefined, 'at the head')}
          />
          <SelectField
            label="Beam"
            className="col-span-2"
            options={beams}
            {...form.register('beamAngleDeg')}
          />
        </FormGrid>
      </form>
      <CalculationResult
        calculation="backlight"
        preview={preview}
        fieldLabels={labels}
        cautions={cautionsFor(1)}
      >
        {(result, input) => (
          <div className="flex flex-col gap-4">
            <div className="rounded-card border border-edge bg-panel p-4">
              <Readouts
                items={[
                  {
                    term: 'Aim',
                    value: `${fixed(result.aimDeg)}°`,
                    hint: result.headInBeam ? 'head in the beam' : 'head outside the beam',
                  },
                  {
                    term: 'Light to head',
                    value: `${fixed(result.distanceToHead, 2)} ${result.distanceUnit}`,
                  },
                  {
                    term: 'Ground vs rim',
                    value:
                      result.groundVsRimStops === null
                        ? 'no spill'
                        : stops(result.groundVsRimStops),
                    hint: result.groundSpill
                      ? spillText(result.groundSpill, result.distanceUnit)
                      : undefined,
                  },
                ]}
              />
            </div>
            <ChartFigure>
              <SideDiagram
                unit={result.distanceUnit}
                headHeight={input.headHeight ?? fromMetres(DEFAULT_HEAD_M, result.distanceUnit)}
                rim={{
                  distanceBehind: input.distanceBehind,
                  lightHeight: input.lightHeight,
                  aimDeg: result.aimDeg,
                  beamAngleDeg: result.beamAngleDeg,
                  groundSpill: result.groundSpill,
                }}
              />
              <figcaption className="px-1 text-caption text-ink-muted">
                Side view to scale. The grid is drawn as a hard-edged cone; real grids fall off
                softly at the edge.
              </figcaption>
            </ChartFigure>
            <WarningList warnings={result.warnings} />
          </div>
        )}
      </CalculationResult>
    </div>
  );
}
