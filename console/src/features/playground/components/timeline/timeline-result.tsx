import { ChartFigure } from '@/components/ui/side-scroll';
import type { TimelineResult } from '@lumenwright/shared';
import { clockTime, fixed } from '../../utils/format';
import { Cautions } from '../cautions';
import { Readouts } from '../form-grid';
import { WarningList } from '../warning-list';
import { TimelineStrip } from './timeline-strip';

const BASIS_WORDS: Record<NonNullable<TimelineResult['window']['basis']>, string> = {
  'blue-hour': 'the blue hour',
  'sunset-to-civil-dusk': 'sunset to civil dusk',
};

const KIND_STYLE: Record<TimelineResult['timeline'][number]['kind'], string> = {
  phase: 'text-ink-muted',
  event: 'text-ink',
  'set-up': 'text-ink font-semibold',
  portraits: 'text-accent font-semibold',
};

const span = (start: string, end: string | null) =>
  end ? `${clockTime(start)}–${clockTime(end)}` : clockTime(start);

export function TimelineResultView({ result }: { result: TimelineResult }) {
  const best = result.slots[0];
  return (
    <div className="flex flex-col gap-4" data-testid="timeline-plan">
      <div className="rounded-card border border-edge bg-panel p-4">
        <Readouts
          items={[
            {
              term: 'Looked for in',
              value: result.window.start ? span(result.window.start, result.window.end) : 'none',
              hint: result.window.basis ? BASIS_WORDS[result.window.basis] : undefined,
            },
            {
              term: 'Best session',
              value: best ? span(best.session.start, best.session.end) : 'none free',
              hint: best
                ? `set up from ${clockTime(best.setupFrom)}; ${fixed(best.blueHourMinutes, 0)} min in the blue hour`
                : undefined,
            },
            { term: 'Sunset', value: clockTime(result.twilight.sunset) },
          ]}
        />
      </div>
      <WarningList warnings={result.warnings} />
      <ChartFigure>
        <TimelineStrip result={result} />
        <figcaption className="px-1 text-caption text-ink-muted">
          Shaded: golden and blue hour. Middle lane: what is booked. Bottom lane: set-up (dashed)
          and the portrait session.
        </figcaption>
      </ChartFigure>
      <section
        aria-labelledby="timeline-order-heading"
        className="rounded-card border border-edge bg-panel p-4"
      >
        <h3 id="timeline-order-heading" className="mb-2 text-body font-semibold">
          The evening in order
        </h3>
        <ol aria-labelledby="timeline-order-heading" className="flex flex-col gap-1">
          {result.timeline.map((entry, i) => (
            <li
              key={`${entry.kind}-${entry.start}-${i}`}
              data-kind={entry.kind}
              className={`grid grid-cols-[7.5rem_1fr] gap-2 text-small tabular-nums ${KIND_STYLE[entry.kind]}`}
            >
              <span>{span(entry.start, entry.end)}</span>
              <span>{entry.label}</span>
            </li>
          ))}
        </ol>
      </section>
      {result.slots.length > 1 ? (
        <section
          aria-labelledby="timeline-slots-heading"
          className="overflow-x-auto rounded-card border border-edge bg-panel p-4"
        >
          <h3 id="timeline-slots-heading" className="mb-2 text-body font-semibold">
            Other free stretches
          </h3>
          <table className="w-full min-w-[28rem] text-left text-small tabular-nums">
            <thead className="text-caption text-ink-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">Free</th>
                <th className="py-1 pr-3 font-medium">Session</th>
                <th className="py-1 pr-3 font-medium">Set up from</th>
                <th className="py-1 font-medium">In the blue hour</th>
              </tr>
            </thead>
            <tbody>
              {result.slots.slice(1).map((slot) => (
                <tr key={slot.rank} className="border-t border-edge">
                  <td className="py-1 pr-3">{span(slot.start, slot.end)}</td>
                  <td className="py-1 pr-3">
                    {span(slot.session.start, slot.session.end)}
                    {slot.fitsWantedLength ? '' : ' (shorter than wanted)'}
                  </td>
                  <td className="py-1 pr-3">{clockTime(slot.setupFrom)}</td>
                  <td className="py-1">{fixed(slot.blueHourMinutes, 0)} min</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}
      <Cautions cautions={result.cautions} />
    </div>
  );
}
