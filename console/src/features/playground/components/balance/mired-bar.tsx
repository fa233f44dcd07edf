import { useId } from 'react';
import { fixed, signed } from '../../utils/format';
import { linearScale, niceExtent } from '../../utils/scale';

interface MiredBarProps {
  required: number;
  gels: readonly { name: string; miredShift: number }[];
}

const W = 640;
const ROW = 20;
const X0 = 20;
const X1 = W - 20;

/** The shift the flash needs against the one the gel stack gives, gel by gel, in mireds. */
export function MiredBar({ required, gels }: MiredBarProps) {
  const titleId = useId();
  const segments = gels.reduce<{ name: string; miredShift: number; start: number; end: number }[]>(
    (stack, gel) => {
      const start = stack[stack.length - 1]?.end ?? 0;
      return [...stack, { ...gel, start, end: start + gel.miredShift }];
    },
    [],
  );
  const total = segments[segments.length - 1]?.end ?? 0;
  const extremes = [0, required, ...segments.flatMap((segment) => [segment.start, segment.end])];
  const { domain, ticks } = niceExtent(Math.min(...extremes, -50), Math.max(...extremes, 50), 7);
  const x = linearScale(domain, [X0, X1]);
  const H = 96 + Math.max(1, segments.length) * ROW;
  const axisY = 70 + Math.max(1, segments.length) * ROW;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full min-w-[32rem]"
      data-chart="mired"
    >
      <title id={titleId}>
        {`Needed ${signed(required, 0)} mired; gels give ${signed(total, 0)} mired (${gels.map((gel) => gel.name).join(' + ') || 'no gel'})`}
      </title>
      <text x={X0} y={14} className="fill-ink-muted text-[11px]">
        cooler (CTB)
      </text>
      <text x={X1} y={14} textAnchor="end" className="fill-ink-muted text-[11px]">
        warmer (CTO)
      </text>
      <text x={X0} y={36} className="fill-ink text-[11px] font-medium">
        needed
      </text>
      <rect
        x={Math.min(x(0), x(required))}
        y={40}
        width={Math.max(2, Math.abs(x(required) - x(0)))}
        height={14}
        fill="none"
        stroke="var(--color-ink)"
        strokeWidth={1.5}
        strokeDasharray="4 2"
      />
      <text x={X0} y={68} className="fill-ink text-[11px] font-medium">
        gels, one after another
      </text>
      {segments.map((segment, i) => {
        const left = Math.min(x(segment.start), x(segment.end));
        const width = Math.max(2, Math.abs(x(segment.end) - x(segment.start)));
        const y = 72 + i * ROW;
        const labelLeft = left + width + 6 > X1 - 110;
        return (
          <g key={`${segment.name}-${i}`} data-gel={segment.name}>
            <rect
              x={left}
              y={y}
              width={width}
              height={14}
              fill={
                segment.miredShift >= 0 ? 'var(--color-chart-golden)' : 'var(--color-chart-blue)'
              }
              stroke="var(--color-edge-strong)"
            />
            <text
              x={labelLeft ? left - 6 : left + width + 6}
              y={y + 11}
              textAnchor={labelLeft ? 'end' : 'start'}
              className="fill-ink text-[11px]"
            >
              {segment.name} ({signed(segment.miredShift, 0)})
            </text>
          </g>
        );
      })}
      <line x1={x(0)} x2={x(0)} y1={20} y2={axisY - 10} stroke="var(--color-ink-muted)" />
      {ticks.map((tick) => (
        <text
          key={tick}
          x={x(tick)}
          y={axisY + 12}
          textAnchor="middle"
          className="fill-ink-muted text-[10px] tabular-nums"
        >
          {fixed(tick, 0)}
        </text>
      ))}
    </svg>
  );
}
