import { computeFalloff, type FalloffInput, type FalloffResult } from '@lumenwright/shared';
import { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { given, useCalculationForm } from '../../hooks/use-calculation-form';
import { fixed, stops } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid, Readouts } from '../form-grid';
import { usePlaygroundScene } from '../playground-scene';
import { FalloffChart } from './falloff-chart';
import { ChartFigure } from '@/components/ui/side-scroll';

const maybe = z.union([z.number(), z.nan()]).optional();
const schema = z.object({
  subjectDistance: z.number({ error: 'Enter a number' }),
  backgroundDistance: maybe,
  groundDistance: maybe,
});
type FalloffForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  subjectDistance: 'Light to subject',
  backgroundDistance: 'Light to background',
  groundDistance: 'Light to nearest ground in frame',
};

export function FalloffPanel() {
  const { cautionsFor } = usePlaygroundScene();
  const { unit, preview, numberField } = useCalculationForm<
    FalloffForm,
    FalloffInput,
    FalloffResult
  >({
    schema,
    defaults: { subjectDistance: 2, backgroundDistance: 12, groundDistance: 2.6 },
    lengthFields: ['subjectDistance', 'backgroundDistance', 'groundDistance'],
    toInput: (values, displayUnit) => {
      const input: FalloffInput = {
        subjectDistance: values.subjectDistance,
        distanceUnit: displayUnit,
      };
      if (given(values.backgroundDistance) !== undefined)
        input.backgroundDistance = values.backgroundDistance;
      if (given(values.groundDistance) !== undefined) input.groundDistance = values.groundDistance;
      return input;
    },
    compute: computeFalloff,
  });

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend={`Distances from the key light (${unit})`}>
          <TextField
            label="To the subject"
            className="col-span-2"
            {...numberField('subjectDistance')}
          />
          <TextField
            label="To the background"
            hint="Optional"
            {...numberField('backgroundDistance', undefined, 'not set')}
          />
          <TextField
            label="To the ground in frame"
            hint="Optional"
            {...numberField('groundDistance', undefined, 'not set')}
          />
        </FormGrid>
      </form>
      <CalculationResult
        calculation="falloff"
        preview={preview}
        fieldLabels={labels}
        cautions={cautionsFor(1)}
      >
        {(result) => {
          const ground = result.marks.find((mark) => mark.id === 'ground');
          return (
            <div className="flex flex-col gap-4">
              <div className="rounded-card border border-edge bg-panel p-4">
                <Readouts
                  items={[
                    {
                      term: 'Background vs subject',
                      value:
                        result.subjectToBackgroundStops === null
                          ? '—'
                          : stops(-result.subjectToBackgroundStops),
                      hint: 'flash only; ambient adds to it',
                    },
                    {
                      term: 'Ground vs subject',
                      value: ground ? stops(ground.stopsRelativeToSubject) : '—',
                    },
                    {
                      term: 'Subject distance',
                      value: `${fixed(result.marks[0]?.distance ?? 0, 2)} ${result.distanceUnit}`,
                    },
                  ]}
                />
              </div>
              <ChartFigure>
                <FalloffChart result={result} />
                <figcaption className="px-1 text-caption text-ink-muted">
                  Inverse-square falloff of a small source: each doubling of distance costs two
                  stops.
                </figcaption>
              </ChartFigure>
            </div>
          );
        }}
      </CalculationResult>
    </div>
  );
}
