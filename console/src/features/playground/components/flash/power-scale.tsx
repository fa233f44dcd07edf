import { useId } from 'react';
import { linearScale } from '../../utils/scale';

interface PowerScaleProps {
  /** Stops below full power the shot needs (negative = more than full). */
  stopsBelowFull: number;
  powerLabel: string;
  /** Lowest setting, stops below full (8 for 1/256). */
  floorStops?: number;
}

const W = 640;
const H = 92;
const X0 = 20;
const X1 = W - 20;

/** The flash's power range from 1/256 to full, in thirds, with the needed setting marked. */
export function PowerScale({ stopsBelowFull, powerLabel, floorStops = 8 }: PowerScaleProps) {
  const titleId = useId();
  // Full power on the right; one whole stop per labelled tick, overflow zones at both ends.
  const x = linearScale([floorStops + 1, -1], [X0, X1]);
  const clamped = Math.min(floorStops + 1, Math.max(-1, stopsBelowFull));
  const thirds = Array.from({ length: floorStops * 3 + 1 }, (_, i) => i / 3);
  const feasible = stopsBelowFull >= -1e-9 && stopsBelowFull <= floorStops + 1e-9;
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full min-w-[32rem]"
      data-chart="power"
    >
      <title
        id={titleId}
      >{`Flash power needed: ${powerLabel}${feasible ? '' : ' (outside the light’s range)'}`}</title>
      <rect
        x={X0}
        y={30}
        width={x(floorStops) - X0}
        height={14}
        fill="var(--color-chart-nautical)"
      />
      <rect x={x(0)} y={30} width={X1 - x(0)} height={14} fill="var(--color-chart-golden)" />
      <text x={X0 + 2} y={24} className="fill-ink-muted text-[11px]">
        below lowest
      </text>
      <text x={X1 - 2} y={24} textAnchor="end" className="fill-ink-muted text-[11px]">
        over full
      </text>
      <line
        x1={x(floorStops)}
        x2={x(0)}
        y1={44}
        y2={44}
        stroke="var(--color-edge-strong)"
        strokeWidth={1.5}
      />
      {thirds.map((s) => {
        const whole = Math.abs(s - Math.round(s)) < 1e-9;
        return (
          <g key={s}>
            <line
              x1={x(s)}
              x2={x(s)}
              y1={44}
              y2={whole ? 53 : 48}
              stroke="var(--color-edge-strong)"
            />
            {whole ? (
              <text
                x={x(s)}
                y={66}
                textAnchor="middle"
                className="fill-ink-muted text-[11px] tabular-nums"
              >
                {s === 0 ? '1/1' : `1/${2 ** Math.round(s)}`}
              </text>
            ) : null}
          </g>
        );
      })}
      <path
        d={`M${x(clamped)},44 l-7,-14 h14 z`}
        fill={feasible ? 'var(--color-accent)' : 'var(--color-fault)'}
      />
      <text
        x={Math.min(X1 - 40, Math.max(X0 + 40, x(clamped)))}
        y={86}
        textAnchor="middle"
        className="fill-ink text-[12px] font-semibold"
      >
        {powerLabel}
      </text>
    </svg>
  );
}
