import { fromMetres } from '@lumenwright/shared';
import { useId } from 'react';
import { fixed } from '../../utils/format';

interface TopDiagramProps {
  unit: 'm' | 'ft';
  keyLight: {
    sideways: number;
    towardCamera: number;
    /** Modifier width, same unit. */
    size: number;
    angleFromCameraDeg: number;
    label: string;
  };
  rim?: { distanceBehind: number; beamAngleDeg: number } | null;
  /** Key-light-to-background distance, same unit. */
  backgroundDistance?: number | null;
}

const W = 560;
const H = 420;
const PAD = 34;
const DEG = Math.PI / 180;

/** Plan view: camera at the bottom, subject in the middle, key to the side, rim behind. */
export function TopDiagram({ unit, keyLight, rim, backgroundDistance }: TopDiagramProps) {
  const titleId = useId();
  const u = (metres: number) => fromMetres(metres, unit);
  const camera = Math.max(u(3), keyLight.towardCamera + u(1));
  // Where the background sits on the camera axis so that it is `backgroundDistance` from the key.
  const behindBg =
    backgroundDistance == null
      ? null
      : Math.max(
          u(0.3),
          Math.sqrt(Math.max(0, backgroundDistance ** 2 - keyLight.sideways ** 2)) -
            keyLight.towardCamera,
        );
  // A far background would shrink the set to a dot: past 2.5x the rim (or 4 m) it is drawn at
  // the top edge and marked as off scale.
  const nearLimit = Math.max((rim?.distanceBehind ?? 0) * 2.5, u(4));
  const bgOffScale = behindBg !== null && behindBg > nearLimit;
  const bgDrawn = behindBg === null ? null : Math.min(behindBg, nearLimit);
  const far = Math.max(rim?.distanceBehind ?? 0, bgDrawn ?? 0, u(1)) + u(0.6);
  const half = Math.max(Math.abs(keyLight.sideways), u(1.5)) + u(0.8);
  const scale = Math.min((W - 2 * PAD) / (2 * half), (H - 2 * PAD) / (far + camera + u(0.4)));
  // World: x to the camera's right, y away from the camera (behind the subject is +y).
  const px = (x: number) => W / 2 + x * scale;
  const py = (y: number) => PAD + (far - y) * scale;
  const subject = { x: px(0), y: py(0) };
  const key = { x: px(keyLight.sideways), y: py(-keyLight.towardCamera) };
  const towardSubject = Math.atan2(subject.y - key.y, subject.x - key.x);
  const modifierHalf = (keyLight.size * scale) / 2;
  const perpendicular = towardSubject + Math.PI / 2;

  const wedge = (
    from: { x: number; y: number },
    direction: number,
    spreadDeg: number,
    length: number,
  ) => {
    const a = direction - (spreadDeg / 2) * DEG;
    const b = direction + (spreadDeg / 2) * DEG;
    return `M${from.x},${from.y} L${from.x + Math.cos(a) * length},${from.y + Math.sin(a) * length} L${from.x + Math.cos(b) * length},${from.y + Math.sin(b) * length} Z`;
  };
  const rimPoint = rim ? { x: px(0), y: py(rim.distanceBehind) } : null;

  const title = [
    `Plan view in ${unit}`,
    `${keyLight.label} key at ${fixed(keyLight.angleFromCameraDeg, 0)}° from the camera axis, ${fixed(keyLight.towardCamera, 2)} toward the camera and ${fixed(Math.abs(keyLight.sideways), 2)} to the side`,
    rim
      ? `rim ${fixed(rim.distanceBehind, 2)} behind the subject with a ${fixed(rim.beamAngleDeg, 0)}° beam`
      : null,
    backgroundDistance != null ? `background ${fixed(backgroundDistance, 1)} from the key` : null,
    'camera distance not to scale',
  ]
    .filter(Boolean)
    .join('; ');

  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full min-w-[32rem]"
      data-diagram="top"
    >
      <title id={titleId}>{title}</title>
      {bgDrawn !== null ? (
        <g data-background>
          <line
            x1={PAD}
            x2={W - PAD}
            y1={py(bgDrawn)}
            y2={py(bgDrawn)}
            stroke="var(--color-edge-strong)"
            strokeWidth={3}
            strokeDasharray="10 6"
          />
          <text x={PAD} y={py(bgDrawn) - 6} className="fill-ink-muted text-[11px]">
            background, {fixed(backgroundDistance ?? 0, 1)} {unit} from the key
            {bgOffScale ? ' (further back than drawn)' : ''}
          </text>
        </g>
      ) : null}
      {rimPoint && rim ? (
        <g data-light="rim">
          <path
            d={wedge(rimPoint, Math.PI / 2, rim.beamAngleDeg, rim.distanceBehind * scale * 1.3)}
            fill="var(--color-chart-golden)"
            fillOpacity={0.7}
          />
          <circle cx={rimPoint.x} cy={rimPoint.y} r={7} fill="var(--color-accent)" />
          <text x={rimPoint.x + 11} y={rimPoint.y + 4} className="fill-ink text-[11px]">
            rim, {fixed(rim.distanceBehind, 1)} {unit} behind
          </text>
        </g>
      ) : null}
      <g data-light="key">
        <path
          d={wedge(key, towardSubject, 36, Math.hypot(subject.x - key.x, subject.y - key.y) * 1.15)}
          fill="var(--color-chart-golden)"
          fillOpacity={0.55}
        />
        <line
          x1={key.x + Math.cos(perpendicular) * modifierHalf}
          y1={key.y + Math.sin(perpendicular) * modifierHalf}
          x2={key.x - Math.cos(perpendicular) * modifierHalf}
          y2={key.y - Math.sin(perpendicular) * modifierHalf}
          stroke="var(--color-accent)"
          strokeWidth={6}
          strokeLinecap="round"
        />
        {/* The label runs from the key toward the middle, so a long modifier name stays inside. */}
        <text
          x={keyLight.sideways >= 0 ? Math.min(key.x + 12, W - 4) : Math.max(key.x - 12, 4)}
          y={key.y + 22}
          textAnchor={keyLight.sideways >= 0 ? 'end' : 'start'}
          className="fill-ink text-[11px]"
          data-key-label
        >
          key ({keyLight.label}), {fixed(keyLight.angleFromCameraDeg, 0)}°
        </text>
      </g>
      <line
        x1={px(0)}
        x2={px(0)}
        y1={py(0)}
        y2={py(-camera)}
        stroke="var(--color-edge-strong)"
        strokeDasharray="2 4"
      />
      <circle cx={subject.x} cy={subject.y} r={9} fill="var(--color-ink)" />
      <text x={subject.x + 13} y={subject.y + 4} className="fill-ink text-[11px]">
        subject
      </text>
      <g transform={`translate(${px(0)} ${py(-camera)})`}>
        <rect x={-13} y={-8} width={26} height={16} rx={3} fill="var(--color-ink)" />
        <path d="M-6,-8 L-9,-15 L9,-15 L6,-8 Z" fill="var(--color-ink)" />
        <text y={24} textAnchor="middle" className="fill-ink-muted text-[11px]">
          camera (distance not to scale)
        </text>
      </g>
    </svg>
  );
}
