import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import type { Frame } from '../api/frames';

const fmt = (value: number | null | undefined, digits = 0, unit = '') =>
  value === null || value === undefined ? '—' : `${value.toFixed(digits)}${unit}`;

function signed(value: number | null | undefined, digits = 0) {
  if (value === null || value === undefined) return '—';
  const text = value.toFixed(digits);
  // What rounds to zero reads as 0, not −0 or +0.
  if (Number(text) === 0) return (0).toFixed(digits);
  return `${value > 0 ? '+' : ''}${text}`;
}

/** What the server measured in the patch, and the change that would neutralise it. */
export function FrameResult({ frame }: { frame: Frame }) {
  const { colour, exposure, exif, patch } = frame;
  // A warning about the patch's colour is also a note on the correction: show it once.
  const warned = new Set(frame.warnings.map((w) => w.message));
  const notes = colour.notes.filter((note) => !warned.has(note.message));
  return (
    <Card aria-labelledby="frame-result-heading" data-testid="frame-result">
      <h2 id="frame-result-heading" className="text-title font-semibold">
        Patch reading
      </h2>
      <dl className="mt-3 grid grid-cols-2 gap-4 sm:grid-cols-4">
        <div>
          <dt className="text-small text-ink-muted">CCT</dt>
          <dd className="text-display font-semibold tabular-nums">
            {colour.cctMeaningful ? fmt(colour.cctKelvin, 0, ' K') : '—'}
          </dd>
        </div>
        <div>
          <dt className="text-small text-ink-muted">Duv</dt>
          <dd className="text-display font-semibold tabular-nums">{signed(colour.duv, 4)}</dd>
        </div>
        <div>
          <dt className="text-small text-ink-muted">Mired offset from neutral</dt>
          <dd className="text-display font-semibold tabular-nums">{signed(colour.miredOffset)}</dd>
        </div>
        <div>
          <dt className="text-small text-ink-muted">Tint</dt>
          <dd className="text-display font-semibold">{colour.tint}</dd>
        </div>
      </dl>
      <p className="mt-2 text-small text-ink-muted">
        Chromaticity x {colour.chromaticity.x.toFixed(4)}, y {colour.chromaticity.y.toFixed(4)};
        camera white balance {colour.cameraKelvin} K ({colour.cameraKelvinSource}); patch{' '}
        {patch.width} × {patch.height} px at ({patch.x}, {patch.y}),{' '}
        {patch.source === 'auto' ? 'found automatically' : 'as you marked it'}.
      </p>
      {!colour.cctMeaningful ? (
        <Notice tone="caution" className="mt-3">
          The patch is too far from the Planckian locus for a correlated colour temperature to mean
          much; correct the tint first.
        </Notice>
      ) : null}

      <h3 className="mt-5 text-lead font-semibold">Suggested correction</h3>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {colour.gel ? (
          <li>
            Gel the flash with{' '}
            {colour.gel.gels.length
              ? colour.gel.gels.map((g) => `${g.name} (${signed(g.miredShift)} mired)`).join(' + ')
              : 'nothing (already within tolerance)'}
            : needs {signed(colour.gel.requiredMiredShift)} mired, leaves{' '}
            {signed(colour.gel.residualMired)}, costs {colour.gel.lossStops.toFixed(1)} stops.
          </li>
        ) : null}
        {colour.whiteBalance ? (
          <li>
            Or set the camera to {colour.whiteBalance.kelvin} K (
            {signed(colour.whiteBalance.miredShift)} mired, about{' '}
            {signed(colour.whiteBalance.amberBlueSteps)} amber–blue step
            {Math.abs(Number(colour.whiteBalance.amberBlueSteps.toFixed(1))) === 1 ? '' : 's'}).
          </li>
        ) : null}
        {!colour.gel && !colour.whiteBalance ? <li>No correction could be worked out.</li> : null}
      </ul>
      {notes.length ? (
        <ul className="mt-2 space-y-1 text-small text-ink-muted" aria-label="Notes">
          {notes.map((note, i) => (
            <li key={`${note.code}-${i}`} data-code={note.code}>
              {note.message}
            </li>
          ))}
        </ul>
      ) : null}

      <h3 className="mt-5 text-lead font-semibold">Exposure</h3>
      <p className="mt-1 text-small">
        Scene EV₁₀₀ {fmt(exposure.sceneEv100, 1)} (settings EV₁₀₀ {fmt(exposure.settingsEv100, 1)});{' '}
        {exif.exposureTime ? `1/${Math.round(1 / exif.exposureTime)} s` : 'shutter —'}, f/
        {fmt(exif.fNumber, 1)}, ISO {exif.iso ?? '—'}, flash{' '}
        {exif.flashFired === null ? '—' : exif.flashFired ? 'fired' : 'did not fire'}.
      </p>
      {frame.warnings.length ? (
        <Notice tone="caution" className="mt-3">
          <ul aria-label="Warnings">
            {frame.warnings.map((warning, i) => (
              <li key={`${warning.code}-${i}`} data-code={warning.code}>
                {warning.message}
              </li>
            ))}
          </ul>
        </Notice>
      ) : null}
    </Card>
  );
}
