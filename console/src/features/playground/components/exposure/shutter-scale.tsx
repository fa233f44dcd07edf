import { SHUTTER_SCALE, shutterLabel } from '@lumenwright/shared';
import { useId } from 'react';
import { linearScale } from '../../utils/scale';

interface ShutterScaleProps {
  shutterSeconds: number;
  handheldSeconds: number;
  syncSeconds?: number;
}

const W = 640;
const H = 86;
const X0 = 16;
const X1 = W - 16;

/** Where the shutter lands between 30 s and 1/8000, against the hand-held limit and sync. */
export function ShutterScale({ shutterSeconds, handheldSeconds, syncSeconds }: ShutterScaleProps) {
  const titleId = useId();
  // Longest exposure on the left; one whole stop per tick.
  const x = linearScale([Math.log2(30), Math.log2(1 / 8000)], [X0, X1]);
  const at = (seconds: number) => x(Math.log2(Math.min(30, Math.max(1 / 8000, seconds))));
  const wholeStops = SHUTTER_SCALE.filter((stop) => stop.thirds % 3 === 0);
  const labelled = new Set([
    '30s',
    '8s',
    '2s',
    '1/2',
    '1/8',
    '1/30',
    '1/125',
    '1/500',
    '1/2000',
    '1/8000',
  ]);
  const position = at(shutterSeconds);
  return (
    <svg
      viewBox={`0 0 ${W} ${H}`}
      role="img"
      aria-labelledby={titleId}
      className="h-auto w-full min-w-[32rem]"
      data-chart="shutter"
    >
      <title id={titleId}>
        {`Shutter ${shutterLabel(shutterSeconds)} on a scale from 30 s to 1/8000 s; hand-held limit ${shutterLabel(handheldSeconds)}${syncSeconds ? `, flash sync ${shutterLabel(syncSeconds)}` : ''}`}
      </title>
      <rect
        x={X0}
        y={30}
        width={at(handheldSeconds) - X0}
        height={14}
        fill="var(--color-chart-nautical)"
      />
      <text x={X0 + 4} y={26} className="fill-ink-muted text-[11px]">
        tripod
      </text>
      {syncSeconds ? (
        <>
          <rect
            x={at(syncSeconds)}
            y={30}
            width={X1 - at(syncSeconds)}
            height={14}
            fill="var(--color-chart-golden)"
          />
          <text x={X1 - 4} y={26} textAnchor="end" className="fill-ink-muted text-[11px]">
            beyond sync: HSS or ND
          </text>
        </>
      ) : null}
      <line x1={X0} x2={X1} y1={44} y2={44} stroke="var(--color-edge-strong)" />
      {wholeStops.map((stop) => (
        <g key={stop.label}>
          <line
            x1={x(Math.log2(stop.value))}
            x2={x(Math.log2(stop.value))}
            y1={44}
            y2={labelled.has(stop.label) ? 52 : 48}
            stroke="var(--color-edge-strong)"
          />
          {labelled.has(stop.label) ? (
            <text
              // The last label (1/8000) ends at its tick: centred on it, it ran past the edge.
              x={stop.label === '1/8000' ? X1 + 4 : x(Math.log2(stop.value))}
              y={66}
              textAnchor={stop.label === '1/8000' ? 'end' : 'middle'}
              className="fill-ink-muted text-[11px] tabular-nums"
            >
              {stop.label}
            </text>
          ) : null}
        </g>
      ))}
      <path d={`M${position},44 l-7,-14 h14 z`} fill="var(--color-accent)" />
      <text
        x={Math.min(X1 - 30, Math.max(X0 + 30, position))}
        y={82}
        textAnchor="middle"
        className="fill-ink text-[12px] font-semibold tabular-nums"
      >
        {shutterLabel(shutterSeconds)}
      </text>
    </svg>
  );
}
