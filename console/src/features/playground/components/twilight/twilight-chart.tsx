import type { TwilightResult } from '@lumenwright/shared';
import { useId, useMemo } from 'react';
import { clockTime, fixed } from '../../utils/format';
import { linePath, linearScale, niceExtent } from '../../utils/scale';
import { clockTicks } from '../../utils/time-axis';

interface TwilightChartProps {
  result: TwilightResult;
  selectedIndex: number;
  onSelect: (index: number) => void;
}

const W = 720;
const H = 400;
const M = { left: 46, right: 50, top: 40, bottom: 34 };
/** Bottom of the main plot; the drift strip sits below the time axis. */
const PLOT_BOTTOM = 296;
const DRIFT = { top: 346, bottom: 392 };

const epochOf = (iso: string | null | undefined) => (iso ? Date.parse(iso) : Number.NaN);

/** Sun altitude and ambient EV through the evening, twilight phases shaded, one minute marked. */
export function TwilightChart({ result, selectedIndex, onSelect }: TwilightChartProps) {
  const titleId = useId();
  const descId = useId();
  const points = result.ambient.points;
  const geometry = useMemo(() => {
    const epochs = points.map((point) => Date.parse(point.time));
    const first = epochs[0] ?? 0;
    const last = epochs[epochs.length - 1] ?? first + 1;
    const x = linearScale([first, last], [M.left, W - M.right]);
    const altitudes = points.map((point) => point.sunAltitudeDeg);
    const evs = points.map((point) => point.ev100);
    const altExtent = niceExtent(Math.min(-18, ...altitudes), Math.max(0, ...altitudes), 6);
    const evExtent = niceExtent(Math.min(...evs), Math.max(...evs), 6);
    const altTicks = altExtent.ticks;
    const evTicks = evExtent.ticks;
    const alt = linearScale(altExtent.domain, [PLOT_BOTTOM, M.top]);
    const ev = linearScale(evExtent.domain, [PLOT_BOTTOM, M.top]);
    const span = (last - first) / 60_000;
    const timeTicks = clockTicks(
      points[0]?.time ?? '',
      points[points.length - 1]?.time ?? '',
      span > 300 ? 60 : 30,
    );
    return { epochs, first, last, x, alt, ev, altTicks, evTicks, timeTicks };
  }, [points]);
  const { epochs, first, last, x, alt, ev, altTicks, evTicks, timeTicks } = geometry;

  const clampX = (epoch: number) => x(Math.min(last, Math.max(first, epoch)));
  const band = (from: string | null, to: string | null) => {
    const a = epochOf(from);
    const b = Number.isFinite(epochOf(to)) ? epochOf(to) : last;
    if (!Number.isFinite(a) || a > last || b < first) return null;
    return { x0: clampX(a), x1: clampX(b) };
  };
  const phases = [
    {
      key: 'civil',
      label: 'Civil',
      fill: 'var(--color-chart-civil)',
      span: band(result.sunset, result.civilDusk),
    },
    {
      key: 'nautical',
      label: 'Nautical',
      fill: 'var(--color-chart-nautical)',
      span: band(result.civilDusk, result.nauticalDusk),
    },
    {
      key: 'astro',
      label: 'Astronomical',
      fill: 'var(--color-chart-astro)',
      span: band(result.nauticalDusk, result.astronomicalDusk),
    },
  ];
  const ribbons = [
    {
      key: 'golden',
      label: 'Golden hour',
      fill: 'var(--color-chart-golden)',
      y: 6,
      span: band(result.goldenHour.start, result.goldenHour.end),
    },
    {
      key: 'blue',
      label: 'Blue hour',
      fill: 'var(--color-chart-blue)',
      y: 21,
      span: band(result.blueHour.start, result.blueHour.end),
    },
  ];

  const selected = points[selectedIndex];
  const maxDrift = Math.max(0, ...points.map((point) => Math.abs(point.stopsPer10Min)));
  const barWidth = Math.max(1, ((W - M.left - M.right) / Math.max(1, points.length)) * 0.8);
  const sx = x(epochs[selectedIndex] ?? first);

  const pick = (event: React.PointerEvent<SVGRectElement>) => {
    const box = event.currentTarget.ownerSVGElement?.getBoundingClientRect();
    if (!box || box.width === 0) return;
    const epoch = x.invert(((event.clientX - box.left) / box.width) * W);
    let best = 0;
    for (let i = 1; i < epochs.length; i++) {
      if (Math.abs((epochs[i] ?? 0) - epoch) < Math.abs((epochs[best] ?? 0) - epoch)) best = i;
    }
    onSelect(best);
  };

  const summary = `From ${clockTime(points[0]?.time)} to ${clockTime(points[points.length - 1]?.time)}: sun altitude falls from ${fixed(points[0]?.sunAltitudeDeg ?? 0)}° to ${fixed(points[points.length - 1]?.sunAltitudeDeg ?? 0)}°, ambient EV100 from ${fixed(points[0]?.ev100 ?? 0)} to ${fixed(points[points.length - 1]?.ev100 ?? 0)}. Sunset ${clockTime(result.sunset)}, civil dusk ${clockTime(result.civilDusk)}, nautical dusk ${clockTime(result.nauticalDusk)}.`;

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      className="h-auto w-full min-w-[34rem] touch-none select-none"
      data-chart="twilight"
    >
      <title id={titleId}>Twilight timeline</title>
      <desc id={descId}>{summary}</desc>

      {phases.map((phase) =>
        phase.span ? (
          <g key={phase.key} data-band={phase.key}>
            <rect
              x={phase.span.x0}
              y={M.top}
              width={Math.max(0, phase.span.x1 - phase.span.x0)}
              height={PLOT_BOTTOM - M.top}
              fill={phase.fill}
            />
            {phase.span.x1 - phase.span.x0 > 56 ? (
              <text
                x={phase.span.x0 + 4}
                y={PLOT_BOTTOM - 6}
                className="fill-ink-muted text-[11px]"
              >
                {phase.label}
              </text>
            ) : null}
          </g>
        ) : null,
      )}
      {ribbons.map((ribbon) =>
        ribbon.span ? (
          <g key={ribbon.key} data-band={ribbon.key}>
            <rect
              x={ribbon.span.x0}
              y={ribbon.y}
              width={Math.max(2, ribbon.span.x1 - ribbon.span.x0)}
              height={12}
              rx={3}
              fill={ribbon.fill}
              stroke="var(--color-edge-strong)"
              strokeWidth={0.5}
            />
            <text
              x={ribbon.span.x0 + 4}
              y={ribbon.y + 10}
              className="fill-ink text-[10px] font-medium"
            >
              {ribbon.label}
            </text>
          </g>
        ) : null,
      )}

      {altTicks.map((tick) => (
        <g key={`a${tick}`}>
          <line
            x1={M.left}
            x2={W - M.right}
            y1={alt(tick)}
            y2={alt(tick)}
            stroke="var(--color-edge)"
            strokeWidth={tick === 0 ? 1.5 : 0.75}
          />
          <text
            x={M.left - 6}
            y={alt(tick) + 4}
            textAnchor="end"
            className="fill-ink-muted text-[11px] tabular-nums"
          >
            {fixed(tick, 0)}°
          </text>
        </g>
      ))}
      {evTicks.map((tick) => (
        <text
          key={`e${tick}`}
          x={W - M.right + 6}
          y={ev(tick) + 4}
          className="fill-ink-muted text-[11px] tabular-nums"
        >
          {fixed(tick, 0)}
        </text>
      ))}
      {timeTicks.map((tick) => (
        <g key={tick.epoch}>
          <line
            x1={x(tick.epoch)}
            x2={x(tick.epoch)}
            y1={PLOT_BOTTOM}
            y2={PLOT_BOTTOM + 4}
            stroke="var(--color-edge-strong)"
          />
          <text
            x={x(tick.epoch)}
            y={PLOT_BOTTOM + 17}
            textAnchor="middle"
            className="fill-ink-muted text-[11px] tabular-nums"
          >
            {tick.label}
          </text>
        </g>
      ))}
      <text x={M.left - 6} y={M.top - 6} textAnchor="end" className="fill-ink-muted text-[10px]">
        Sun
      </text>
      <text x={W - M.right + 6} y={M.top - 6} className="fill-ink-muted text-[10px]">
        EV100
      </text>

      <path
        d={linePath(points.map((p, i) => [x(epochs[i] ?? 0), alt(p.sunAltitudeDeg)]))}
        fill="none"
        stroke="var(--color-chart-sun)"
        strokeWidth={2.5}
        data-series="altitude"
      />
      <path
        d={linePath(points.map((p, i) => [x(epochs[i] ?? 0), ev(p.ev100)]))}
        fill="none"
        stroke="var(--color-chart-ev)"
        strokeWidth={2}
        strokeDasharray="6 4"
        data-series="ev100"
      />

      <g data-series="drift">
        <text
          x={M.left - 6}
          y={DRIFT.top - 6}
          textAnchor="start"
          className="fill-ink-muted text-[10px]"
        >
          Drift, stops per 10 min (max {fixed(maxDrift, 1)})
        </text>
        <line
          x1={M.left}
          x2={W - M.right}
          y1={DRIFT.top}
          y2={DRIFT.top}
          stroke="var(--color-edge)"
        />
        {points.map((point, i) => {
          const height =
            (Math.abs(point.stopsPer10Min) / (maxDrift || 1)) * (DRIFT.bottom - DRIFT.top);
          return (
            <rect
              key={point.time}
              x={x(epochs[i] ?? 0) - barWidth / 2}
              y={DRIFT.top}
              width={barWidth}
              height={height}
              fill={i === selectedIndex ? 'var(--color-accent)' : 'var(--color-chart-ev)'}
              opacity={i === selectedIndex ? 1 : 0.55}
            />
          );
        })}
      </g>
      {selected ? (
        <g data-selected={selected.time}>
          <line
            x1={sx}
            x2={sx}
            y1={M.top}
            y2={PLOT_BOTTOM}
            stroke="var(--color-ink)"
            strokeWidth={1.25}
          />
          <circle
            cx={sx}
            cy={alt(selected.sunAltitudeDeg)}
            r={4.5}
            fill="var(--color-chart-sun)"
            stroke="var(--color-panel)"
            strokeWidth={1.5}
          />
          <circle
            cx={sx}
            cy={ev(selected.ev100)}
            r={4.5}
            fill="var(--color-chart-ev)"
            stroke="var(--color-panel)"
            strokeWidth={1.5}
          />
          <text
            x={Math.min(sx + 6, W - M.right - 40)}
            y={M.top + 12}
            className="fill-ink text-[11px] font-semibold tabular-nums"
          >
            {clockTime(selected.time)}
          </text>
        </g>
      ) : null}

      <rect
        x={M.left}
        y={M.top}
        width={W - M.left - M.right}
        height={PLOT_BOTTOM - M.top}
        fill="transparent"
        onPointerDown={pick}
        onPointerMove={(event) => event.buttons === 1 && pick(event)}
      />
    </svg>
  );
}
