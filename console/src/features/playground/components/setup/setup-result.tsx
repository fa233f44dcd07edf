import {
  describeUsableSpans,
  fromMetres,
  type DuskSetupInput,
  type DuskSetupPlan,
} from '@lumenwright/shared';
import { PrintButton } from '@/components/ui/print-button';
import { ChartFigure, useScrollsSideways } from '@/components/ui/side-scroll';
import { clockTime, fixed, signed, stops } from '../../utils/format';
import { Swatches } from '../balance/swatches';
import { Cautions } from '../cautions';
import { SideDiagram } from '../diagrams/side-diagram';
import { TopDiagram } from '../diagrams/top-diagram';
import { Readouts } from '../form-grid';
import { modifierLabels } from '../flash/flash-panel';
import { WarningList } from '../warning-list';

/**
 * The usable minutes as runs ("19:14 and 19:16–19:20"): a gap is a stretch the limits rule out.
 * Plans saved before the runs were planned carry none: their first and last usable minute.
 */
function usableText(w: DuskSetupPlan['window']): string {
  const spans = (w as Partial<Pick<DuskSetupPlan['window'], 'usableSpans'>>).usableSpans;
  if (Array.isArray(spans)) return describeUsableSpans(spans, clockTime) ?? 'none';
  return w.usableStart ? `${clockTime(w.usableStart)}–${clockTime(w.usableEnd)}` : 'none';
}

/** The head height the plan's rim geometry assumes (computeBacklight's default), metres. */
const DEFAULT_HEAD_M = 1.6;

export function SetupResultView({ plan, input }: { plan: DuskSetupPlan; input: DuskSetupInput }) {
  const unit = plan.key.distanceUnit;
  const rimInput = input.rim;
  const first = plan.suggestedMinutes[0];
  return (
    <div className="flex flex-col gap-4" data-testid="setup-plan">
      {/* Paper for the evening: the page prints as print.css lays it out (no controls). */}
      <div className="flex justify-end print:hidden">
        <PrintButton label="Print this plan" />
      </div>
      <div className="rounded-card border border-edge bg-panel p-4">
        <Readouts
          items={[
            {
              term: 'Shooting window',
              value: `${clockTime(plan.window.start)}–${clockTime(plan.window.end)}`,
              hint: 'blue hour, else sunset to civil dusk',
            },
            {
              term: 'Usable within it',
              value: usableText(plan.window),
              hint: 'every limit met, flashes in range',
            },
            {
              term: 'White balance',
              value: `${plan.whiteBalance.cameraKelvin} K`,
              hint: plan.whiteBalance.fineTune.amberBlueSteps
                ? `fine-tune ${signed(plan.whiteBalance.fineTune.amberBlueSteps, 0)} (+ amber, − blue)`
                : undefined,
            },
            {
              term: 'Gels on the flash',
              value: plan.gels.gels.map((gel) => gel.name).join(' + ') || 'none',
              hint: `${stops(plan.gels.gelLossStops)} loss, flash now ${plan.gels.resultingFlashKelvin} K`,
            },
            {
              term: 'Key character',
              value: `${plan.key.quality}, ${plan.key.lightingRatioLabel}`,
              hint: `${modifierLabels[plan.key.modifier as keyof typeof modifierLabels] ?? plan.key.modifier}, ${plan.key.shadowSide} shadow side`,
            },
            {
              term: 'Background falloff',
              value:
                plan.backgroundFalloffStops === null ? '—' : stops(-plan.backgroundFalloffStops),
              hint: 'from the key alone',
            },
          ]}
        />
      </div>

      <section
        className="rounded-card border border-edge bg-panel p-4"
        aria-labelledby="suggested-heading"
      >
        <h3 id="suggested-heading" className="mb-2 text-body font-semibold">
          Suggested minutes
        </h3>
        <SuggestedMinutesBox>
          <table className="w-full min-w-[32rem] text-left text-small tabular-nums">
            <thead className="text-caption text-ink-muted">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Time
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Sun
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  EV100
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Camera
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Key
                </th>
                <th scope="col" className="py-1 pr-3 font-medium">
                  Rim
                </th>
                <th scope="col" className="py-1 font-medium">
                  Fits
                </th>
              </tr>
            </thead>
            <tbody>
              {plan.suggestedMinutes.map((minute) => (
                <tr key={minute.time} className="border-t border-edge">
                  <th scope="row" className="py-1.5 pr-3 font-semibold">
                    {clockTime(minute.time)}
                  </th>
                  <td className="py-1.5 pr-3">{fixed(minute.sunAltitudeDeg)}°</td>
                  <td className="py-1.5 pr-3">{fixed(minute.ambientEv100)}</td>
                  <td className="py-1.5 pr-3">
                    {minute.background.shutterLabel} · {minute.background.apertureLabel} ·{' '}
                    {minute.background.isoLabel}
                    {/* Planned darker than the bias (the darkest-bias field); older saved plans lack it. */}
                    {(minute.biasLoweredByStops ?? 0) > 0 ? (
                      <span className="block text-caption text-caution">
                        background {signed(minute.background.biasStops, 2)} stops,{' '}
                        {fixed(minute.biasLoweredByStops, 2)} darker
                      </span>
                    ) : null}
                  </td>
                  <td className="py-1.5 pr-3">{minute.keyFlash.powerLabel}</td>
                  <td className="py-1.5 pr-3">{minute.rimFlash?.powerLabel ?? '—'}</td>
                  <td className={`py-1.5 ${minute.usable ? 'text-ok' : 'text-caution'}`}>
                    {minute.usable ? 'yes' : 'no'}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </SuggestedMinutesBox>
        {plan.suggestedMinutes.length === 0 ? (
          <p className="text-ink-muted">No minutes in the window.</p>
        ) : null}
      </section>

      <div className="grid gap-4 2xl:grid-cols-2">
        <ChartFigure>
          <TopDiagram
            unit={unit}
            keyLight={{
              sideways: plan.key.position.sideways,
              towardCamera: plan.key.position.towardCamera,
              size: plan.key.sizeToDistance * input.key.distance,
              angleFromCameraDeg: input.key.angleFromCameraDeg ?? 60,
              label:
                modifierLabels[plan.key.modifier as keyof typeof modifierLabels] ??
                plan.key.modifier,
            }}
            rim={
              rimInput && plan.backlight
                ? {
                    distanceBehind: rimInput.distanceBehind,
                    beamAngleDeg: plan.backlight.beamAngleDeg,
                  }
                : null
            }
            backgroundDistance={input.backgroundDistance ?? null}
          />
          <figcaption className="px-1 text-caption text-ink-muted">
            From above, to scale except the camera.
          </figcaption>
        </ChartFigure>
        <ChartFigure>
          <SideDiagram
            unit={unit}
            headHeight={fromMetres(DEFAULT_HEAD_M, unit)}
            keyLight={{
              towardCamera: plan.key.position.towardCamera,
              aboveEyes: plan.key.position.aboveEyes,
            }}
            rim={
              rimInput && plan.backlight
                ? {
                    distanceBehind: rimInput.distanceBehind,
                    lightHeight: rimInput.lightHeight,
                    aimDeg: plan.backlight.aimDeg,
                    beamAngleDeg: plan.backlight.beamAngleDeg,
                    groundSpill: plan.backlight.groundSpill,
                  }
                : null
            }
          />
          <figcaption className="px-1 text-caption text-ink-muted">
            From the side, to scale, with the rim’s beam and ground spill.
          </figcaption>
        </ChartFigure>
      </div>

      {first ? (
        <p className="text-small text-ink-muted">
          At {clockTime(first.time)}: expose {first.background.shutterLabel} at{' '}
          {first.background.apertureLabel}, {first.background.isoLabel}; key at{' '}
          {first.keyFlash.powerLabel}
          {first.rimFlash ? `, rim at ${first.rimFlash.powerLabel}` : ''}. Ambient is modelled to ±
          {plan.twilight.ambientUncertaintyStops} stops: meter on the night.
        </p>
      ) : null}

      <section
        className="rounded-card border border-edge bg-panel p-4"
        aria-labelledby="look-heading"
      >
        <h3 id="look-heading" className="mb-3 text-body font-semibold">
          The look at {plan.whiteBalance.cameraKelvin} K
        </h3>
        <Swatches swatches={plan.look} cameraKelvin={plan.whiteBalance.cameraKelvin} />
      </section>

      <WarningList warnings={plan.warnings} />
      <Cautions cautions={plan.cautions} />
    </div>
  );
}

/** The suggested minutes' table scrolls sideways on a phone; it is then a named Tab stop. */
function SuggestedMinutesBox({ children }: { children: React.ReactNode }) {
  const [ref, scrolls] = useScrollsSideways<HTMLDivElement>();
  return (
    <div
      ref={ref}
      className="overflow-x-auto"
      {...(scrolls ? { tabIndex: 0, role: 'region', 'aria-labelledby': 'suggested-heading' } : {})}
    >
      {children}
    </div>
  );
}
