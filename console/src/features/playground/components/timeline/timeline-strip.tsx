import { clockIn, type TimelineResult } from '@lumenwright/shared';
import { useId } from 'react';
import { clockTime } from '../../utils/format';

const W = 640;
const H = 132;
const M = { left: 12, right: 12, top: 8 };
const LANES = { sky: 8, booked: 44, portraits: 76 } as const;
const LANE_H = 26;
const AXIS_Y = 118;
/** Half the width of an 11 px "HH:MM" tick label, in viewBox units. */
const TICK_HALF_WIDTH = 16;

/**
 * The evening as three lanes over one time axis: the sky (golden and blue hour), the booked
 * events, and the crew's set-up and the portrait session of the best slot.
 */
export function TimelineStrip({ result }: { result: TimelineResult }) {
  const titleId = useId();
  const descId = useId();
  const entries = result.timeline;
  const times = entries.flatMap((e) => [Date.parse(e.start), Date.parse(e.end ?? e.start)]);
  if (times.length === 0) return null;
  const from = Math.min(...times);
  const to = Math.max(...times, from + 60_000);
  const x = (iso: string) =>
    M.left + ((Date.parse(iso) - from) / (to - from)) * (W - M.left - M.right);
  const bar = (start: string, end: string | null) => {
    const x0 = x(start);
    return { x0, width: Math.max(2, x(end ?? start) - x0) };
  };

  const sky = [
    { key: 'golden', window: result.twilight.goldenHour, fill: 'var(--color-chart-golden)' },
    { key: 'blue', window: result.twilight.blueHour, fill: 'var(--color-chart-blue)' },
  ].flatMap((band) =>
    band.window.start && band.window.end
      ? [{ ...band, ...bar(band.window.start, band.window.end) }]
      : [],
  );
  const booked = entries.filter((e) => e.kind === 'event');
  const session = entries.filter((e) => e.kind === 'set-up' || e.kind === 'portraits');

  // Ticks on the half hour.
  const ticks: number[] = [];
  const half = 30 * 60_000;
  for (let t = Math.ceil(from / half) * half; t <= to; t += half) ticks.push(t);

  const summary = `From ${clockTime(entries[0]?.start)} to ${clockIn(new Date(to).toISOString(), result.timeZone)}: ${
    booked.length
  } booked event${booked.length === 1 ? '' : 's'}; ${
    session.map((e) => `${e.label} ${clockTime(e.start)}–${clockTime(e.end)}`).join(', ') ||
    'no portrait session fits'
  }.`;

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      className="h-auto w-full min-w-[30rem]"
      data-chart="timeline"
    >
      <title id={titleId}>The evening’s timeline</title>
      <desc id={descId}>{summary}</desc>
      {sky.map((band) => (
        <rect
          key={band.key}
          data-band={band.key}
          x={band.x0}
          y={M.top}
          width={band.width}
          height={LANES.portraits + LANE_H - M.top}
          fill={band.fill}
          opacity={0.55}
        />
      ))}
      {booked.map((e, i) => {
        const b = bar(e.start, e.end);
        return (
          <g key={`event-${i}`} data-lane="booked">
            <rect
              x={b.x0}
              y={LANES.booked}
              width={b.width}
              height={LANE_H}
              rx={3}
              fill="var(--color-panel)"
              stroke="var(--color-edge-strong)"
            />
            {b.width > 44 ? (
              <text x={b.x0 + 4} y={LANES.booked + 17} className="fill-ink text-[11px]">
                {e.label.length > b.width / 6.5
                  ? `${e.label.slice(0, Math.floor(b.width / 6.5) - 1)}…`
                  : e.label}
              </text>
            ) : null}
          </g>
        );
      })}
      {session.map((e, i) => {
        const b = bar(e.start, e.end);
        const portraits = e.kind === 'portraits';
        return (
          <g key={`session-${i}`} data-lane={e.kind}>
            <rect
              x={b.x0}
              y={LANES.portraits}
              width={b.width}
              height={LANE_H}
              rx={3}
              fill={portraits ? 'var(--color-accent)' : 'var(--color-panel)'}
              stroke="var(--color-accent)"
              strokeDasharray={portraits ? undefined : '3 2'}
            />
          </g>
        );
      })}
      <line
        x1={M.left}
        x2={W - M.right}
        y1={AXIS_Y - 10}
        y2={AXIS_Y - 10}
        stroke="var(--color-edge-strong)"
      />
      {ticks.map((t) => {
        const iso = new Date(t).toISOString();
        const at = x(iso);
        // A label centred on a tick at either end would be cut by the frame: align it inward.
        const anchor = at < TICK_HALF_WIDTH ? 'start' : at > W - TICK_HALF_WIDTH ? 'end' : 'middle';
        return (
          <text
            key={t}
            x={at}
            y={AXIS_Y + 6}
            textAnchor={anchor}
            className="fill-ink-muted text-[11px] tabular-nums"
          >
            {clockIn(iso, result.timeZone)}
          </text>
        );
      })}
    </svg>
  );
}
