import {
  computeTwilight,
  DEFAULT_LIGHT_STANDS,
  DEFAULT_PLACEMENT,
  planEveningTimeline,
  SESSION_PLACEMENTS,
  type SessionPlacement,
  type TimelineInput,
  type TimelineResult,
} from '@lumenwright/shared';
import { useMemo } from 'react';
import { useFieldArray } from 'react-hook-form';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { given, optionalNumberField, useCalculationForm } from '../../hooks/use-calculation-form';
import { knownTimeZones, todayIso } from '../../utils/dates';
import { clockTime } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid } from '../form-grid';
import { usePlaygroundScene, type SiteConditions } from '../playground-scene';
import { TimelineResultView } from './timeline-result';

const number = z.number({ error: 'Enter a number' });
const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'A time such as 18:30');
const schema = z.object({
  latitude: number,
  longitude: number,
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date'),
  timeZone: z.string().min(1, 'Enter a time zone such as Europe/Zurich'),
  portraitMinutes: number,
  setupMinutes: optionalNumberField,
  placement: z.enum(SESSION_PLACEMENTS),
  lightStands: optionalNumberField,
  events: z.array(z.object({ label: z.string().min(1, 'Name it'), start: clock, end: clock })),
});
type TimelineForm = z.infer<typeof schema>;

export const timelineFieldLabels: Record<string, string> = {
  latitude: 'Latitude',
  longitude: 'Longitude',
  date: 'Date',
  timeZone: 'Time zone',
  portraitMinutes: 'Portrait session',
  setupMinutes: 'Set-up before it',
  placement: 'Place the session',
  lightStands: 'Light stands',
  'conditions.windKmh': 'Forecast wind (km/h)',
};

/** The placements in words, in the shared library's order. */
export const PLACEMENT_OPTIONS: readonly { value: SessionPlacement; label: string }[] = [
  { value: 'earliest', label: 'As early in the blue hour as it fits' },
  { value: 'latest', label: 'As late in the blue hour as it fits' },
  { value: 'mid-blue-hour', label: 'Centred on the blue hour' },
];

/** `HH:MM` of a local ISO time moved by `minutes`, rounded to 5 minutes (demo times). */
function around(iso: string, minutes: number): string {
  const [h, m] = clockTime(iso).split(':').map(Number) as [number, number];
  const total = (Math.round((h * 60 + m + minutes) / 5) * 5 + 1440) % 1440;
  return `${String(Math.floor(total / 60)).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}`;
}

/**
 * Demo scenario: an invented wedding at a lakeside terrace (round-number coordinates). The
 * speeches end before sunset and dinner starts in the blue hour, whatever the season: the times
 * are placed around today's sunset there.
 */
function demoValues(): TimelineForm {
  const place = { latitude: 47, longitude: 8, date: todayIso(), timeZone: 'Europe/Zurich' };
  const sunset = computeTwilight(place).sunset;
  return {
    ...place,
    portraitMinutes: 20,
    setupMinutes: 10,
    placement: DEFAULT_PLACEMENT,
    lightStands: Number.NaN,
    events: sunset
      ? [
          { label: 'Speeches', start: around(sunset, -70), end: around(sunset, -30) },
          { label: 'Dinner', start: around(sunset, 40), end: around(sunset, 150) },
        ]
      : [],
  };
}

/**
 * Form values and the site conditions (the panel above the tabs) -> the shared function's input
 * (events in the form's order: errors name them).
 */
export function toTimelineInput(form: TimelineForm, conditions: SiteConditions): TimelineInput {
  const { windKmh, ...flags } = conditions;
  const input: TimelineInput = {
    latitude: form.latitude,
    longitude: form.longitude,
    date: form.date,
    timeZone: form.timeZone,
    portraitMinutes: form.portraitMinutes,
    placement: form.placement,
    conditions: windKmh === undefined ? flags : { windKmh, ...flags },
    events: form.events.map((event) => ({ ...event })),
  };
  const setup = given(form.setupMinutes);
  if (setup !== undefined) input.setupMinutes = setup;
  const stands = given(form.lightStands);
  if (stands !== undefined) input.lightStands = stands;
  return input;
}

/** The evening's booked events and where the dusk portraits fit between them. */
export function TimelinePanel() {
  const zones = useMemo(() => knownTimeZones(), []);
  const { conditions } = usePlaygroundScene();
  const { form, preview, errorFor, numberField } = useCalculationForm<
    TimelineForm,
    TimelineInput,
    TimelineResult
  >({
    schema,
    defaults: demoValues(),
    toInput: (values) => toTimelineInput(values, conditions),
    compute: planEveningTimeline,
  });
  const events = useFieldArray({ control: form.control, name: 'events' });
  // The shared function names an event's field as events[2].end; the form as events.2.end.
  const eventError = (i: number, key: 'label' | 'start' | 'end') =>
    errorFor(`events.${i}.${key}`, `events[${i}].${key}`);

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="Place and date">
          <TextField label="Latitude (°N)" {...numberField('latitude')} />
          <TextField label="Longitude (°E)" {...numberField('longitude')} />
          <TextField label="Date" type="date" error={errorFor('date')} {...form.register('date')} />
          <TextField
            label="Time zone"
            list="lw-timeline-time-zones"
            autoComplete="off"
            spellCheck={false}
            error={errorFor('timeZone')}
            {...form.register('timeZone')}
          />
          <datalist id="lw-timeline-time-zones">
            {zones.map((zone) => (
              <option key={zone} value={zone} />
            ))}
          </datalist>
        </FormGrid>
        <FormGrid legend="The portraits">
          <TextField label="Session (min)" {...numberField('portraitMinutes')} />
          <TextField
            label="Set-up before it (min)"
            {...numberField('setupMinutes', undefined, 'default 10')}
          />
          <SelectField
            label="Place the session"
            className="col-span-2"
            options={PLACEMENT_OPTIONS}
            hint="Within its free stretch; set-up time stays clear of the events."
            error={errorFor('placement')}
            {...form.register('placement')}
          />
          <TextField
            label="Light stands"
            {...numberField('lightStands', undefined, `default ${DEFAULT_LIGHT_STANDS}`)}
          />
        </FormGrid>
        <fieldset className="flex flex-col gap-3 rounded-card border border-edge bg-panel p-4">
          <legend className="px-1 text-small font-semibold">Booked that evening</legend>
          <p className="text-caption text-ink-muted">
            Local times on the date, 24-hour. Leave the list empty for a session on its own.
          </p>
          {events.fields.map((field, i) => (
            <div key={field.id} className="grid grid-cols-2 items-start gap-2">
              <TextField
                label={`Event ${i + 1}`}
                className="col-span-2"
                error={eventError(i, 'label')}
                {...form.register(`events.${i}.label`)}
              />
              <TextField
                label="From"
                inputMode="numeric"
                placeholder="18:30"
                error={eventError(i, 'start')}
                {...form.register(`events.${i}.start`)}
              />
              <TextField
                label="To"
                inputMode="numeric"
                placeholder="19:00"
                error={eventError(i, 'end')}
                {...form.register(`events.${i}.end`)}
              />
              <Button
                variant="secondary"
                size="sm"
                className="col-span-2 justify-self-start"
                aria-label={`Remove event ${i + 1}`}
                onClick={() => events.remove(i)}
              >
                Remove
              </Button>
            </div>
          ))}
          <Button
            variant="secondary"
            size="sm"
            className="self-start"
            onClick={() => events.append({ label: '', start: '', end: '' })}
          >
            Add an event
          </Button>
        </fieldset>
      </form>
      <CalculationResult calculation="timeline" preview={preview} fieldLabels={timelineFieldLabels}>
        {(result) => <TimelineResultView result={result} />}
      </CalculationResult>
    </div>
  );
}
