import { mired, type SceneSwatch } from '@lumenwright/shared';
import { fixed, signed } from '../../utils/format';

/** How each light in the scene renders under the camera's white balance. */
export function Swatches({
  swatches,
  cameraKelvin,
}: {
  swatches: readonly SceneSwatch[];
  cameraKelvin: number;
}) {
  return (
    <div>
      <ul
        className="grid grid-cols-2 gap-3 sm:grid-cols-3 xl:grid-cols-4"
        aria-label={`Light sources as rendered at a ${cameraKelvin} K white balance`}
      >
        {swatches.map((swatch) => (
          <li
            key={swatch.id}
            data-swatch={swatch.id}
            className="overflow-hidden rounded-control border border-edge bg-panel"
          >
            <div
              aria-hidden="true"
              // Dimmed on a night screen, full colour on paper (printed even where backgrounds are not).
              className="h-14 w-full [print-color-adjust:exact] not-print:night:brightness-[0.45]"
              style={{ background: swatch.hex }}
            />
            <div className="p-2">
              <p className="text-small font-medium text-ink">{swatch.label}</p>
              <p className="text-caption text-ink-muted tabular-nums">
                {swatch.kelvin} K · {fixed(mired(swatch.kelvin), 0)} mired
              </p>
              <p className="text-caption text-ink-muted tabular-nums">
                {signed(swatch.miredOffset, 0)} mired vs WB: {swatch.rendersAs}
              </p>
            </div>
          </li>
        ))}
      </ul>
      <p className="mt-2 text-caption text-ink-muted">
        Swatch colours are a display approximation, not a colour measurement.
      </p>
    </div>
  );
}
