import type { TwilightResult } from '@lumenwright/shared';
import { clockTime, fixed, signed } from '../../utils/format';
import { compassPoint, minutesPerStep } from '../../utils/time-axis';
import { Readouts } from '../form-grid';
import { TwilightChart } from './twilight-chart';

interface TwilightResultViewProps {
  result: TwilightResult;
  selectedIndex: number;
  onSelect: (index: number) => void;
}

const reasonText: Record<string, string> = {
  'sun-never-sets': 'the sun does not set',
  'sun-never-rises': 'the sun does not rise',
  'twilight-never-ends': 'it never gets that dark',
  'twilight-never-begins': 'the sun stays too low',
  'sun-always-above': 'the sun stays above this band',
  'sun-always-below': 'the sun stays below this band',
};

function eventTime(result: TwilightResult, key: string, iso: string | null) {
  if (iso) return clockTime(iso);
  const reason = result.reasons[key];
  return reason ? `none (${reasonText[reason] ?? reason})` : '—';
}

function Legend() {
  const swatch = (fill: string) => (
    <span
      aria-hidden="true"
      className="inline-block size-3 rounded-sm border border-edge"
      style={{ background: fill }}
    />
  );
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-caption text-ink-muted">
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="22" height="6">
          <line x1="0" x2="22" y1="3" y2="3" stroke="var(--color-chart-sun)" strokeWidth="2.5" />
        </svg>
        Sun altitude (left axis)
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="22" height="6">
          <line
            x1="0"
            x2="22"
            y1="3"
            y2="3"
            stroke="var(--color-chart-ev)"
            strokeWidth="2"
            strokeDasharray="6 4"
          />
        </svg>
        Ambient EV100, incident (right axis)
      </li>
      <li className="flex items-center gap-1.5">
        {swatch('var(--color-chart-civil)')} Civil twilight
      </li>
      <li className="flex items-center gap-1.5">
        {swatch('var(--color-chart-nautical)')} Nautical
      </li>
      <li className="flex items-center gap-1.5">
        {swatch('var(--color-chart-astro)')} Astronomical
      </li>
    </ul>
  );
}

/** The timeline as a table, every ten minutes, for reading values exactly or by screen reader. */
function NumbersTable({ result }: { result: TwilightResult }) {
  const every = Math.max(1, Math.round(10 / result.ambient.stepMinutes));
  const rows = result.ambient.points.filter((_, i) => i % every === 0);
  if (rows.length === 0) return null;
  return (
    <details className="rounded-card border border-edge bg-panel p-4">
      <summary className="cursor-pointer text-small font-semibold">Show the numbers</summary>
      <div className="mt-3 max-h-80 overflow-auto">
        <table className="w-full text-left text-small tabular-nums">
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
                Lux
              </th>
              <th scope="col" className="py-1 font-medium">
                Stops / 10 min
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((point) => (
              <tr key={point.time} className="border-t border-edge">
                <th scope="row" className="py-1 pr-3 font-medium">
                  {clockTime(point.time)}
                </th>
                <td className="py-1 pr-3">{fixed(point.sunAltitudeDeg)}°</td>
                <td className="py-1 pr-3">{fixed(point.ev100)}</td>
                <td className="py-1 pr-3">{point.illuminanceLux.toPrecision(3)}</td>
                <td className="py-1">{signed(point.stopsPer10Min)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

export function TwilightResultView({ result, selectedIndex, onSelect }: TwilightResultViewProps) {
  const points = result.ambient.points;
  const chosen = points[selectedIndex];
  const uncertainty = result.ambient.uncertaintyStops;
  const remeter = chosen ? minutesPerStep(chosen.stopsPer10Min) : null;
  const sinceSunset =
    chosen && result.sunset
      ? Math.round((Date.parse(chosen.time) - Date.parse(result.sunset)) / 60_000)
      : null;

  return (
    <div className="flex flex-col gap-4">
      <div className="rounded-card border border-edge bg-panel p-4">
        <Readouts
          items={[
            {
              term: 'Sunset',
              value: eventTime(result, 'sunset', result.sunset),
              hint:
                result.sunsetAzimuthDeg === null
                  ? undefined
                  : `toward ${compassPoint(result.sunsetAzimuthDeg)} (${fixed(result.sunsetAzimuthDeg, 0)}°)`,
            },
            { term: 'Civil dusk (−6°)', value: eventTime(result, 'civilDusk', result.civilDusk) },
            {
              term: 'Nautical dusk (−12°)',
              value: eventTime(result, 'nauticalDusk', result.nauticalDusk),
            },
            {
              term: 'Golden hour',
              value: `${eventTime(result, 'goldenHour.start', result.goldenHour.start)}–${eventTime(result, 'goldenHour.end', result.goldenHour.end)}`,
            },
            {
              term: 'Blue hour',
              value: `${eventTime(result, 'blueHour.start', result.blueHour.start)}–${eventTime(result, 'blueHour.end', result.blueHour.end)}`,
            },
            {
              term: 'Astronomical dusk (−18°)',
              value: eventTime(result, 'astronomicalDusk', result.astronomicalDusk),
            },
          ]}
        />
      </div>
      <figure className="overflow-x-auto rounded-card border border-edge bg-panel p-3">
        {points.length > 1 ? (
          <TwilightChart result={result} selectedIndex={selectedIndex} onSelect={onSelect} />
        ) : (
          <p className="p-4 text-ink-muted">No evening twilight to draw on this date.</p>
        )}
        <figcaption className="mt-2 flex flex-col gap-3 px-1">
          <Legend />
          {points.length > 1 && chosen ? (
            <label className="flex flex-col gap-1 text-small font-medium">
              Shooting minute: {clockTime(chosen.time)}
              <input
                type="range"
                min={0}
                max={points.length - 1}
                step={1}
                value={selectedIndex}
                onChange={(event) => onSelect(Number(event.target.value))}
                aria-valuetext={`${clockTime(chosen.time)}, sun ${fixed(chosen.sunAltitudeDeg)} degrees, EV100 ${fixed(chosen.ev100)}`}
                className="w-full accent-(--color-accent)"
              />
            </label>
          ) : null}
        </figcaption>
      </figure>
      <NumbersTable result={result} />
      {chosen ? (
        <div className="rounded-card border border-edge bg-panel p-4" data-testid="chosen-minute">
          <h3 className="mb-3 text-body font-semibold">
            At {clockTime(chosen.time)}
            {sinceSunset !== null ? (
              <span className="font-normal text-ink-muted">
                {' '}
                ({sinceSunset >= 0 ? `${sinceSunset} min after` : `${-sinceSunset} min before`}{' '}
                sunset)
              </span>
            ) : null}
          </h3>
          <Readouts
            items={[
              { term: 'Sun altitude', value: `${fixed(chosen.sunAltitudeDeg)}°` },
              {
                term: 'Ambient EV100',
                value: fixed(chosen.ev100),
                hint: `±${uncertainty} stop${uncertainty === 1 ? '' : 's'} (${result.ambient.model} model)`,
              },
              {
                term: 'Illuminance',
                value: `${chosen.illuminanceLux < 10 ? chosen.illuminanceLux.toPrecision(2) : Math.round(chosen.illuminanceLux)} lx`,
              },
              {
                term: 'Drift',
                value: `${signed(chosen.stopsPer10Min)} stops / 10 min`,
                hint:
                  remeter === null
                    ? undefined
                    : `about ⅓ stop every ${remeter < 10 ? remeter.toFixed(1) : Math.round(remeter)} min: re-meter the background`,
              },
            ]}
          />
        </div>
      ) : null}
      {result.notes.length > 0 ? (
        <ul className="list-disc pl-5 text-small text-ink-muted">
          {result.notes.map((note) => (
            <li key={note}>{note}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
