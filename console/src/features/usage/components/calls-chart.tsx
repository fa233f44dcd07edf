import { formatCount, formatDate } from '@/lib/format';
import { niceCeiling, ticks } from '../chart-scale';

export interface DayBar {
  day: string;
  calls: number;
  errors: number;
}

const WIDTH = 720;
const HEIGHT = 220;
const PAD = { top: 12, right: 12, bottom: 32, left: 64 };

/** Calls per day as bars, the errors part of each bar in the fault colour. */
export function CallsChart({ days, title }: { days: DayBar[]; title: string }) {
  const total = days.reduce((sum, d) => sum + d.calls, 0);
  const errors = days.reduce((sum, d) => sum + d.errors, 0);
  const top = niceCeiling(Math.max(0, ...days.map((d) => d.calls)));
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const slot = days.length ? plotW / days.length : plotW;
  const barW = Math.max(1, slot * 0.7);
  const y = (value: number) => PAD.top + plotH - (value / top) * plotH;
  const labelEvery = Math.max(1, Math.ceil(days.length / 8));
  const summary = `${title}: ${formatCount(total)} calls, ${formatCount(errors)} errors over ${days.length} days`;

  return (
    <figure className="m-0">
      <svg
        viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
        role="img"
        aria-label={summary}
        className="h-auto w-full"
        data-testid="calls-chart"
      >
        <title>{summary}</title>
        {ticks(top).map((tick) => (
          <g key={tick}>
            <line
              x1={PAD.left}
              x2={WIDTH - PAD.right}
              y1={y(tick)}
              y2={y(tick)}
              className="stroke-edge"
              strokeWidth={1}
            />
            <text
              x={PAD.left - 6}
              y={y(tick) + 4}
              textAnchor="end"
              className="fill-ink-muted text-[11px] tabular-nums max-sm:text-[20px]"
            >
              {formatCount(tick)}
            </text>
          </g>
        ))}
        {days.map((d, index) => {
          const x = PAD.left + index * slot + (slot - barW) / 2;
          return (
            <g key={d.day}>
              <rect
                x={x}
                y={y(d.calls)}
                width={barW}
                height={Math.max(0, PAD.top + plotH - y(d.calls))}
                className="fill-chart-ev"
              >
                <title>{`${formatDate(d.day)}: ${formatCount(d.calls)} calls, ${formatCount(d.errors)} errors`}</title>
              </rect>
              {d.errors > 0 ? (
                <rect
                  x={x}
                  y={y(d.errors)}
                  width={barW}
                  height={Math.max(0, PAD.top + plotH - y(d.errors))}
                  className="fill-fault"
                />
              ) : null}
              {index % labelEvery === 0 ? (
                <text
                  x={x + barW / 2}
                  y={HEIGHT - 8}
                  textAnchor="middle"
                  className="fill-ink-muted text-[11px] max-sm:text-[20px]"
                >
                  {d.day.slice(5)}
                </text>
              ) : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="mt-2 flex flex-wrap gap-4 text-caption text-ink-muted">
        <span>
          <span className="mr-1 inline-block h-3 w-3 bg-chart-ev align-middle" aria-hidden="true" />
          Calls
        </span>
        <span>
          <span className="mr-1 inline-block h-3 w-3 bg-fault align-middle" aria-hidden="true" />
          Errors (4xx and 5xx)
        </span>
        <span>Days in UTC.</span>
      </figcaption>
    </figure>
  );
}

/** Summary rows spread over every day of the range (missing days are zero). */
export function toDayBars(
  byDay: { day: string; calls: number; errors: number }[],
  days: string[],
): DayBar[] {
  const byKey = new Map(byDay.map((d) => [d.day.slice(0, 10), d]));
  return days.map((day) => ({
    day,
    calls: byKey.get(day)?.calls ?? 0,
    errors: byKey.get(day)?.errors ?? 0,
  }));
}
