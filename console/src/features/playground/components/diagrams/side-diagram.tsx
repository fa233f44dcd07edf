import { fromMetres } from '@lumenwright/shared';
import { useId } from 'react';
import { fixed } from '../../utils/format';

export interface SideRim {
  distanceBehind: number;
  lightHeight: number;
  aimDeg: number;
  beamAngleDeg: number;
  groundSpill: { from: number; to: number | null } | null;
}

export interface SideKey {
  /** Horizontal distance toward the camera from the subject. */
  towardCamera: number;
  /** Height of the key above the eyes. */
  aboveEyes: number;
}

interface SideDiagramProps {
  unit: 'm' | 'ft';
  headHeight: number;
  rim?: SideRim | null;
  keyLight?: SideKey | null;
  /** Drawn camera distance in front of the subject (for scale only). */
  cameraDistance?: number;
}

const W = 640;
const H = 300;
const PAD = 28;
const DEG = Math.PI / 180;
/** Half the width of "ground spill" in 11 px semibold, rounded up (measured in chromium: 60). */
const SPILL_LABEL_HALF = 32;
/** Half the width of a "12.5 ft high" label in 10 px, rounded up (measured in chromium: 51). */
const HEIGHT_LABEL_HALF = 26;

/**
 * A label centred on `x` unless that would cut it at the drawing's edge: then it starts at the
 * left edge's padding or ends at the right one, still beside its mark.
 */
export function labelInside(
  x: number,
  halfWidth: number,
): { x: number; textAnchor: 'start' | 'middle' | 'end' } {
  if (x - halfWidth < PAD / 2) return { x: Math.max(x, PAD / 2), textAnchor: 'start' };
  if (x + halfWidth > W - PAD / 2) return { x: Math.min(x, W - PAD / 2), textAnchor: 'end' };
  return { x, textAnchor: 'middle' };
}

/**
 * Side elevation: camera left, subject at 0, rim light behind on the right with its beam cone
 * and where it spills on the ground. Same scale on both axes so angles look true.
 */
export function SideDiagram({ unit, headHeight, rim, keyLight, cameraDistance }: SideDiagramProps) {
  const clipId = useId();
  const titleId = useId();
  const u = (metres: number) => fromMetres(metres, unit);
  const camera = cameraDistance ?? Math.max(u(2), (keyLight?.towardCamera ?? 0) + u(1));
  const xMin = -Math.max(camera, keyLight?.towardCamera ?? 0) - u(0.6);
  const xMax = (rim?.distanceBehind ?? 1) + u(0.8);
  const topWorld =
    Math.max(headHeight, rim?.lightHeight ?? 0, (keyLight?.aboveEyes ?? 0) + headHeight) * 1.25;
  const scale = Math.min((W - 2 * PAD) / (xMax - xMin), (H - 2 * PAD) / topWorld);
  const px = (x: number) => PAD + (x - xMin) * scale;
  const py = (y: number) => H - PAD - y * scale;
  const ground = py(0);
  const head = { x: px(0), y: py(headHeight) };
  const headR = Math.max(5, u(0.12) * scale);

  let beam: string | null = null;
  let spill: { x0: number; x1: number } | null = null;
  if (rim) {
    const lx = px(rim.distanceBehind);
    const ly = py(rim.lightHeight);
    const reach = 4 * (W + H);
    const ray = (deg: number) =>
      `${lx - Math.cos(deg * DEG) * reach},${ly - Math.sin(deg * DEG) * reach}`;
    beam = `M${lx},${ly} L${ray(rim.aimDeg - rim.beamAngleDeg / 2)} L${ray(rim.aimDeg + rim.beamAngleDeg / 2)} Z`;
    if (rim.groundSpill) {
      const near = px(rim.groundSpill.from);
      const far = rim.groundSpill.to === null ? PAD : px(rim.groundSpill.to);
      spill = {
        x0: Math.max(PAD, Math.min(near, far)),
        x1: Math.min(W - PAD, Math.max(near, far)),
      };
    }
  }

  const describe = [
    `Subject head at ${fixed(headHeight, 2)} ${unit}`,
    rim
      ? `rim light ${fixed(rim.distanceBehind, 2)} ${unit} behind at ${fixed(rim.lightHeight, 2)} ${unit} high, aimed ${fixed(rim.aimDeg)}°, beam ${fixed(rim.beamAngleDeg, 0)}°`
      : null,
    rim?.groundSpill
      ? `ground lit from ${fixed(rim.groundSpill.from, 2)} to ${rim.groundSpill.to === null ? 'beyond the frame' : `${fixed(rim.groundSpill.to, 2)} ${unit}`} from the subject toward the light`
      : null,
    keyLight
      ? `key ${fixed(keyLight.towardCamera, 2)} ${unit} toward the camera, ${fixed(keyLight.aboveEyes, 2)} ${unit} above the eyes`
      : null,
  ]
    .filter(Boolean)
    .join('; ');

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full min-w-[32rem]"
      data-diagram="side"
    >
      <title id={titleId}>{`Side view: ${describe}`}</title>
      <defs>
        <clipPath id={clipId}>
          <rect x={PAD} y={PAD / 2} width={W - 2 * PAD} height={ground - PAD / 2} />
        </clipPath>
      </defs>
      {beam ? (
        <path
          d={beam}
          clipPath={`url(#${clipId})`}
          fill="var(--color-chart-golden)"
          fillOpacity={0.75}
          stroke="var(--color-accent)"
          strokeOpacity={0.6}
          data-beam
        />
      ) : null}
      <line
        x1={PAD}
        x2={W - PAD}
        y1={ground}
        y2={ground}
        stroke="var(--color-ink-muted)"
        strokeWidth={2}
      />
      {spill ? (
        <g data-spill>
          <rect
            x={spill.x0}
            y={ground - 1}
            width={Math.max(2, spill.x1 - spill.x0)}
            height={7}
            fill="var(--color-caution)"
          />
          <text
            {...labelInside((spill.x0 + spill.x1) / 2, SPILL_LABEL_HALF)}
            y={ground + 20}
            className="fill-caution text-[11px] font-semibold"
          >
            ground spill
          </text>
        </g>
      ) : null}

      {/* camera */}
      <g transform={`translate(${px(-camera)} ${py(u(1.5))})`}>
        <rect x={-12} y={-8} width={24} height={16} rx={3} fill="var(--color-ink)" />
        <rect x={12} y={-4} width={7} height={8} fill="var(--color-ink)" />
        <text y={-14} textAnchor="middle" className="fill-ink-muted text-[11px]">
          camera
        </text>
      </g>
      <line
        x1={px(-camera)}
        x2={px(-camera)}
        y1={py(u(1.5)) + 8}
        y2={ground}
        stroke="var(--color-ink-muted)"
      />

      {/* subject */}
      <rect
        x={head.x - headR * 0.9}
        y={head.y + headR * 1.2}
        width={headR * 1.8}
        height={Math.max(0, ground - head.y - headR * 1.2)}
        rx={headR * 0.8}
        fill="var(--color-ink-muted)"
      />
      <circle cx={head.x} cy={head.y} r={headR} fill="var(--color-ink)" />
      <text x={head.x} y={head.y - headR - 6} textAnchor="middle" className="fill-ink text-[11px]">
        subject
      </text>

      {keyLight ? (
        <g data-light="key">
          <line
            x1={px(-keyLight.towardCamera)}
            y1={py(headHeight + keyLight.aboveEyes)}
            x2={head.x}
            y2={head.y}
            stroke="var(--color-accent)"
            strokeDasharray="4 3"
          />
          <circle
            cx={px(-keyLight.towardCamera)}
            cy={py(headHeight + keyLight.aboveEyes)}
            r={7}
            fill="var(--color-accent)"
          />
          <line
            x1={px(-keyLight.towardCamera)}
            x2={px(-keyLight.towardCamera)}
            y1={py(headHeight + keyLight.aboveEyes) + 7}
            y2={ground}
            stroke="var(--color-edge-strong)"
            strokeWidth={2}
          />
          <text
            x={px(-keyLight.towardCamera)}
            y={py(headHeight + keyLight.aboveEyes) - 11}
            textAnchor="middle"
            className="fill-ink text-[11px]"
          >
            key
          </text>
        </g>
      ) : null}
      {rim ? (
        <g data-light="rim">
          <line
            x1={px(rim.distanceBehind)}
            x2={px(rim.distanceBehind)}
            y1={py(rim.lightHeight) + 7}
            y2={ground}
            stroke="var(--color-edge-strong)"
            strokeWidth={2}
          />
          <circle
            cx={px(rim.distanceBehind)}
            cy={py(rim.lightHeight)}
            r={7}
            fill="var(--color-accent)"
          />
          <text
            x={px(rim.distanceBehind)}
            y={py(rim.lightHeight) - 11}
            textAnchor="middle"
            className="fill-ink text-[11px]"
          >
            rim
          </text>
          <text
            {...(px(rim.distanceBehind) + 10 + 2 * HEIGHT_LABEL_HALF > W
              ? { x: px(rim.distanceBehind) - 10, textAnchor: 'end' }
              : { x: px(rim.distanceBehind) + 10 })}
            y={ground - 6}
            className="fill-ink-muted text-[10px] tabular-nums"
          >
            {fixed(rim.lightHeight, 1)} {unit} high
          </text>
        </g>
      ) : null}
    </svg>
  );
}
