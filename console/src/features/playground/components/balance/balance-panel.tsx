import { solveBalance, type BalanceInput, type BalanceResult } from '@lumenwright/shared';
import { z } from 'zod';
import { TextField } from '@/components/ui/text-field';
import { given, useCalculationForm } from '../../hooks/use-calculation-form';
import { fixed, signed, stops } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid, Readouts } from '../form-grid';
import { usePlaygroundScene } from '../playground-scene';
import { MiredBar } from './mired-bar';
import { Swatches } from './swatches';
import { WarningList } from '../warning-list';
import { ChartFigure } from '@/components/ui/side-scroll';

const maybe = z.union([z.number(), z.nan()]).optional();
const schema = z.object({
  cameraKelvin: z.number({ error: 'Enter a number' }),
  cameraTint: maybe,
  flashKelvin: maybe,
  targetMiredOffset: maybe,
  maxGels: maybe,
  miredTolerance: maybe,
});
type BalanceForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  cameraKelvin: 'Camera white balance',
  cameraTint: 'Camera tint',
  flashKelvin: 'Bare flash',
  targetMiredOffset: 'Extra warmth',
  maxGels: 'Most gels',
  miredTolerance: 'Close enough',
};

export function BalancePanel() {
  const { cautionsFor } = usePlaygroundScene();
  const { preview, numberField } = useCalculationForm<BalanceForm, BalanceInput, BalanceResult>({
    schema,
    defaults: {
      cameraKelvin: 3800,
      cameraTint: 0,
      flashKelvin: 5500,
      targetMiredOffset: 0,
      maxGels: 3,
      // Trade up to 10 mired for a shorter stack; the camera's fine-tune takes the rest.
      miredTolerance: 10,
    },
    toInput: (values) => {
      const input: BalanceInput = { cameraKelvin: values.cameraKelvin };
      const optional = {
        cameraTint: given(values.cameraTint),
        flashKelvin: given(values.flashKelvin),
        targetMiredOffset: given(values.targetMiredOffset),
        maxGels: given(values.maxGels),
        miredTolerance: given(values.miredTolerance),
      };
      for (const [key, value] of Object.entries(optional)) {
        if (
          value !== undefined &&
          !(key === 'cameraTint' && value === 0) &&
          !(key === 'targetMiredOffset' && value === 0) &&
          !(key === 'miredTolerance' && value === 0)
        ) {
          (input as unknown as Record<string, number>)[key] = value;
        }
      }
      return input;
    },
    compute: solveBalance,
  });

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="White balance and flash">
          <TextField
            label="Camera WB (K)"
            hint="Lower makes the sky bluer"
            {...numberField('cameraKelvin')}
          />
          <TextField
            label="Camera tint (CC)"
            hint="+ for greenish ambient"
            {...numberField('cameraTint', undefined, 'default 0')}
          />
          <TextField
            label="Bare flash (K)"
            {...numberField('flashKelvin', undefined, 'default 5500')}
          />
          <TextField
            label="Extra warmth on skin (mired)"
            {...numberField('targetMiredOffset', undefined, 'default 0')}
          />
          <TextField
            label="Most gels in a stack"
            {...numberField('maxGels', undefined, 'default 3')}
          />
          <TextField
            label="Close enough (mired)"
            hint="Fewer gels when within this; 0 = closest"
            {...numberField('miredTolerance', undefined, 'default 0')}
          />
        </FormGrid>
        <p className="text-caption text-ink-muted">
          Gels come from a generic CTO/CTB and green kit; your own kit arrives with Gear.
        </p>
      </form>
      <CalculationResult
        calculation="balance"
        preview={preview}
        fieldLabels={labels}
        cautions={cautionsFor(0)}
      >
        {(result, input) => (
          <div className="flex flex-col gap-4">
            <div className="rounded-card border border-edge bg-panel p-4">
              <h3 className="text-body font-semibold">Gel stack</h3>
              <p className="mt-1 flex flex-wrap gap-2" data-testid="gel-stack">
                {result.gels.length === 0 ? (
                  <span className="text-ink-muted">No gel needed</span>
                ) : (
                  result.gels.map((gel, i) => (
                    <span
                      key={`${gel.name}-${i}`}
                      className="rounded-full border border-edge-strong bg-raised px-3 py-1 text-small font-medium"
                    >
                      {gel.name}
                    </span>
                  ))
                )}
              </p>
              <div className="mt-4">
                <Readouts
                  items={[
                    {
                      term: 'Shift needed',
                      value: `${signed(result.requiredMiredShift, 0)} mired`,
                    },
                    {
                      term: 'Stack gives',
                      value: `${signed(result.achievedMiredShift, 0)} mired`,
                      hint: `residual ${signed(result.residualMired, 0)}`,
                    },
                    { term: 'Gelled flash', value: `${result.resultingFlashKelvin} K` },
                    {
                      term: 'Add power',
                      value: stops(result.powerCompensationStops),
                      hint: 'to make up the gel loss',
                    },
                    {
                      term: 'WB fine-tune',
                      value:
                        result.whiteBalanceFineTune.amberBlueSteps === 0
                          ? 'none'
                          : `${signed(result.whiteBalanceFineTune.amberBlueSteps, 0)} step${Math.abs(result.whiteBalanceFineTune.amberBlueSteps) === 1 ? '' : 's'}`,
                      hint:
                        result.whiteBalanceFineTune.amberBlueSteps === 0
                          ? undefined
                          : `+ amber, − blue (≈ ${fixed(result.whiteBalanceFineTune.cameraKelvin, 0)} K)`,
                    },
                    { term: 'Green residual', value: `${signed(result.residualGreen, 1)} CC` },
                  ]}
                />
              </div>
            </div>
            <ChartFigure>
              <MiredBar required={result.requiredMiredShift} gels={result.gels} />
            </ChartFigure>
            <section
              className="rounded-card border border-edge bg-panel p-4"
              aria-label="How the scene renders"
            >
              <h3 className="mb-3 text-body font-semibold">
                How the scene renders at {input.cameraKelvin} K
              </h3>
              <Swatches swatches={result.scene} cameraKelvin={input.cameraKelvin} />
            </section>
            <WarningList warnings={result.warnings} />
          </div>
        )}
      </CalculationResult>
    </div>
  );
}
