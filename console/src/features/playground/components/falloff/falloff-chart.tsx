import type { FalloffResult } from '@lumenwright/shared';
import { useId } from 'react';
import { fixed } from '../../utils/format';
import { linePath, linearScale, niceExtent } from '../../utils/scale';

const W = 640;
const H = 300;
const M = { left: 52, right: 20, top: 20, bottom: 40 };

const markStyle = {
  subject: { label: 'Subject', color: 'var(--color-accent)' },
  background: { label: 'Background', color: 'var(--color-chart-ev)' },
  ground: { label: 'Ground', color: 'var(--color-ok)' },
} as const;

/** Stops relative to the subject against distance from the light (log distance axis). */
export function FalloffChart({ result }: { result: FalloffResult }) {
  const titleId = useId();
  const descId = useId();
  const series = result.series;
  const d0 = series[0]?.distance ?? 0.1;
  const d1 = series[series.length - 1]?.distance ?? 10;
  const x = linearScale([Math.log10(d0), Math.log10(d1)], [M.left, W - M.right]);
  const values = series.map((point) => point.stopsRelativeToSubject);
  const { domain, ticks } = niceExtent(Math.min(...values), Math.max(...values), 6);
  const y = linearScale(domain, [H - M.bottom, M.top]);
  const xTicks = [0.1, 0.2, 0.5, 1, 2, 5, 10, 20, 50, 100, 200, 500].filter(
    (d) => d >= d0 && d <= d1,
  );
  const unit = result.distanceUnit;
  const summary = result.marks
    .map(
      (mark) =>
        `${markStyle[mark.id].label} at ${fixed(mark.distance, 2)} ${unit}: ${fixed(mark.stopsRelativeToSubject)} stops`,
    )
    .join('; ');

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={`${titleId} ${descId}`}
      className="h-auto w-full min-w-[32rem]"
      data-chart="falloff"
    >
      <title id={titleId}>Light falloff from the key</title>
      <desc id={descId}>{summary}</desc>
      {ticks.map((tick) => (
        <g key={tick}>
          <line
            x1={M.left}
            x2={W - M.right}
            y1={y(tick)}
            y2={y(tick)}
            stroke="var(--color-edge)"
            strokeWidth={tick === 0 ? 1.5 : 0.75}
          />
          <text
            x={M.left - 6}
            y={y(tick) + 4}
            textAnchor="end"
            className="fill-ink-muted text-[11px] tabular-nums"
          >
            {fixed(tick, 0)}
          </text>
        </g>
      ))}
      {xTicks.map((d) => (
        <g key={d}>
          <line
            x1={x(Math.log10(d))}
            x2={x(Math.log10(d))}
            y1={H - M.bottom}
            y2={H - M.bottom + 4}
            stroke="var(--color-edge-strong)"
          />
          <text
            x={x(Math.log10(d))}
            y={H - M.bottom + 16}
            textAnchor="middle"
            className="fill-ink-muted text-[11px] tabular-nums"
          >
            {d}
          </text>
        </g>
      ))}
      <text
        x={(M.left + W - M.right) / 2}
        y={H - 6}
        textAnchor="middle"
        className="fill-ink-muted text-[11px]"
      >
        Distance from the light ({unit}, log scale)
      </text>
      <text
        x={12}
        y={(M.top + H - M.bottom) / 2}
        transform={`rotate(-90 12 ${(M.top + H - M.bottom) / 2})`}
        textAnchor="middle"
        className="fill-ink-muted text-[11px]"
      >
        Stops vs subject
      </text>
      <path
        d={linePath(
          series.map((point) => [x(Math.log10(point.distance)), y(point.stopsRelativeToSubject)]),
        )}
        fill="none"
        stroke="var(--color-chart-sun)"
        strokeWidth={2.5}
      />
      {result.marks.map((mark, i) => {
        const cx = x(Math.log10(mark.distance));
        const cy = y(mark.stopsRelativeToSubject);
        const style = markStyle[mark.id];
        return (
          <g key={mark.id} data-mark={mark.id}>
            <line
              x1={cx}
              x2={cx}
              y1={cy}
              y2={H - M.bottom}
              stroke={style.color}
              strokeDasharray="3 3"
            />
            <circle
              cx={cx}
              cy={cy}
              r={5}
              fill={style.color}
              stroke="var(--color-panel)"
              strokeWidth={1.5}
            />
            <text x={cx + 8} y={cy - 8 - i * 14} className="fill-ink text-[11px] font-semibold">
              {style.label} {mark.id === 'subject' ? '0' : fixed(mark.stopsRelativeToSubject)}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
