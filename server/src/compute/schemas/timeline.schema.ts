import {
  DEFAULT_LIGHT_STANDS,
  DEFAULT_PLACEMENT,
  DEFAULT_SETUP_MINUTES,
  LIGHT_STANDS_RANGE,
  MAX_EVENTS,
  MAX_LABEL_LENGTH,
  MIN_SLOT_MINUTES,
  PORTRAIT_MINUTES_RANGE,
  SESSION_PLACEMENTS,
  SETUP_MINUTES_RANGE,
  TIMELINE_ENTRY_KINDS,
  TIMELINE_PHASES,
  TIMELINE_WARNING_CODES,
  WINDOW_BASES,
} from '@lumenwright/shared';
import type { JsonSchema } from '../validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { bool, object, outNum, ranged, rangedInt, str, warningsWith } from './common.js';
import { setupRequestSchema, setupResponseSchema } from './setup.schema.js';
import { twilightRequestSchema, twilightResponseSchema } from './twilight.schema.js';

/** "19:30" on the date, or an instant with Z or an offset: what the shared library reads. */
const EVENT_TIME =
  '^(?:(?:[01]\\d|2[0-3]):[0-5]\\d|\\d{4}-\\d{2}-\\d{2}T\\d{2}:\\d{2}(?::\\d{2}(?:\\.\\d+)?)?(?:Z|[+-]\\d{2}:\\d{2}))$';

const eventTime = (description: string, example: string): JsonSchema =>
  str(
    `${description} A local time HH:MM (24-hour) on the date, or an ISO 8601 date-time with Z ` +
      'or an offset (for an event after midnight); instants must fall between 00:00 on the ' +
      'date and 12:00 the next day, local time.',
    example,
    {
      pattern: EVENT_TIME,
      patternWords: 'a local time HH:MM (24-hour) or an ISO 8601 date-time with Z or an offset',
    },
  );

const place = twilightRequestSchema.properties;

export const timelineRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'The evening of a wedding or session: the booked events, and how long the portraits should ' +
    'take, for a place and date.',
  required: ['latitude', 'longitude', 'date', 'timeZone', 'portraitMinutes'],
  properties: {
    latitude: place.latitude!,
    longitude: place.longitude!,
    date: place.date!,
    timeZone: place.timeZone!,
    events: {
      type: 'array',
      maxItems: MAX_EVENTS,
      description: `The booked events (fixed), at most ${MAX_EVENTS}; default none.`,
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['label', 'start', 'end'],
        properties: {
          label: str('What the event is.', 'Speeches', {
            minLength: 1,
            maxLength: MAX_LABEL_LENGTH,
          }),
          start: eventTime('When it starts.', '21:00'),
          end: eventTime('When it ends; after start.', '21:45'),
        },
      },
    },
    portraitMinutes: ranged(
      'Length wanted for the portrait session, minutes.',
      PORTRAIT_MINUTES_RANGE.min,
      PORTRAIT_MINUTES_RANGE.max,
      20,
    ),
    setupMinutes: ranged(
      `Minutes the crew needs to set up right before the session, outside any event; default ` +
        `${DEFAULT_SETUP_MINUTES} (common practice, no source).`,
      SETUP_MINUTES_RANGE.min,
      SETUP_MINUTES_RANGE.max,
      10,
    ),
    placement: str(
      'Where the session goes in its free stretch, aiming at the part of the window in the blue ' +
        'hour (the whole window when the blue hour misses it) and moved into the stretch when ' +
        'it does not fit there: "earliest" (the default) starts it with that part, "latest" ' +
        'ends it with that part, "mid-blue-hour" centres ' +
        'it on that part’s middle. It also breaks ties between equal slots (earliest first, ' +
        'latest first, or nearest the middle). The set-up time before the session stays free ' +
        'of events whatever the placement.',
      DEFAULT_PLACEMENT,
      { enum: [...SESSION_PLACEMENTS] },
    ),
    conditions: {
      ...setupRequestSchema.properties.conditions!,
      description:
        'Site conditions, as /v1/setup takes them; they add safety cautions (the ones for ' +
        'working in the dark always come).',
    },
    lightStands: rangedInt(
      `Light stands on the site; with any, the wind caution comes. Default ` +
        `${DEFAULT_LIGHT_STANDS}: a key and a backlight (common practice, no source).`,
      LIGHT_STANDS_RANGE.min,
      LIGHT_STANDS_RANGE.max,
      2,
    ),
  },
};

const tw = twilightResponseSchema.properties;

const instant = (description: string, example: string): JsonSchema =>
  str(`${description} ISO 8601 local time with offset.`, example, { format: 'date-time' });

const nullableInstant = (description: string, example: string | null): JsonSchema => ({
  type: ['string', 'null'],
  format: 'date-time',
  description: `${description} ISO 8601 local time with offset, or null.`,
  example,
});

export const timelineResponseSchema: ObjectSchema = {
  type: 'object',
  required: [
    'date',
    'timeZone',
    'portraitMinutes',
    'setupMinutes',
    'placement',
    'lightStands',
    'twilight',
    'window',
    'timeline',
    'slots',
    'cautions',
    'warnings',
  ],
  properties: {
    date: tw.date!,
    timeZone: tw.timeZone!,
    portraitMinutes: outNum('The session length asked for, minutes.', 20),
    setupMinutes: outNum('The set-up time used, minutes.', 10),
    placement: str('The placement used.', DEFAULT_PLACEMENT, { enum: [...SESSION_PLACEMENTS] }),
    lightStands: outNum('The light stands the cautions assume.', DEFAULT_LIGHT_STANDS),
    twilight: object(
      'The evening’s phases, as /v1/twilight gives them (null with a reason when the sun does ' +
        'not get there).',
      {
        sunset: tw.sunset!,
        civilDusk: tw.civilDusk!,
        nauticalDusk: tw.nauticalDusk!,
        goldenHour: tw.goldenHour!,
        blueHour: tw.blueHour!,
        reasons: tw.reasons!,
        notes: tw.notes!,
      },
    ),
    window: object(
      'Where the slots were looked for: the blue hour, or sunset to civil dusk when the blue ' +
        'hour is missing or has no free stretch; all null when neither exists.',
      {
        basis: {
          type: ['string', 'null'],
          enum: [...WINDOW_BASES, null] as never,
          description: 'Which stretch of sky: "blue-hour" or "sunset-to-civil-dusk".',
          example: 'blue-hour',
        },
        start: nullableInstant('Window start.', '2026-06-20T21:50:00+01:00'),
        end: nullableInstant('Window end.', '2026-06-20T22:30:00+01:00'),
      },
    ),
    timeline: {
      type: 'array',
      description:
        'The phases, the booked events and the best slot’s set-up and session, in time order ' +
        '(moments before spans that start with them).',
      items: object('One line of the timeline.', {
        kind: str('What the line is.', 'event', { enum: [...TIMELINE_ENTRY_KINDS] }),
        phase: {
          type: ['string', 'null'],
          enum: [...TIMELINE_PHASES, null] as never,
          description: 'The twilight phase, for a phase line; else null.',
          example: null,
        },
        eventIndex: {
          type: ['integer', 'null'],
          description: 'Position of the booked event in the request, for an event line; else null.',
          example: 1,
        },
        label: str('The event’s label, or words for the phase, set-up or session.', 'Speeches'),
        start: instant('Start.', '2026-06-20T21:00:00+01:00'),
        end: nullableInstant('End; null for a moment (sunset, civil dusk...).', null),
      }),
    },
    slots: {
      type: 'array',
      description:
        `Proposed portrait slots, best first: free stretches of ${MIN_SLOT_MINUTES} minute or ` +
        'more inside the window that overlap no event, with the set-up time before them free ' +
        'too. Ranked by the minutes of the wanted session in the blue hour, then length, then ' +
        'as the placement prefers (the earliest, the latest, or the nearest the middle).',
      items: object('One slot.', {
        rank: outNum('1 for the best.', 1),
        start: instant(
          'The session may start from here (set-up done).',
          '2026-06-20T21:55:00+01:00',
        ),
        end: instant(
          'The stretch ends (window end or the next event).',
          '2026-06-20T22:30:00+01:00',
        ),
        minutes: outNum('Length of the stretch, minutes (to 0.1).', 35),
        setupFrom: instant('The crew starts setting up.', '2026-06-20T21:45:00+01:00'),
        session: object(
          'The wanted session placed in the stretch as `placement` asks (or as much as fits).',
          {
            start: instant('Session start.', '2026-06-20T21:55:00+01:00'),
            end: instant('Session end.', '2026-06-20T22:15:00+01:00'),
            minutes: outNum('Session length, minutes (to 0.1).', 20),
          },
        ),
        blueHourMinutes: outNum(
          'Minutes of the session inside the blue hour (to 0.1); when the sun turns before the ' +
            'blue hour’s lower edge (white nights), the minutes after the blue hour’s start.',
          20,
        ),
        fitsWantedLength: bool('Whether the whole wanted length fits.', true),
      }),
    },
    cautions: {
      ...setupResponseSchema.properties.cautions!,
      description:
        'Safety cautions for the conditions and light stands, as /v1/setup gives them: the ' +
        'ones for working in the dark (batteries, footing and cables) always. General good ' +
        'practice only: defer to local codes, venue rules, permits and licensed practice.',
    },
    warnings: warningsWith(TIMELINE_WARNING_CODES, {
      'polar-day': 'the sun does not set on the date',
      'polar-night': 'the sun does not rise on the date; a blue hour may still come',
      'no-window': 'neither a blue hour nor sunset to civil dusk on the date',
      'outside-blue-hour':
        'the blue hour is missing or fully booked: slots are looked for between sunset and civil dusk',
      'no-free-stretch': 'the events and set-up leave no free stretch in the window',
      'shorter-than-wanted': 'the best slot is shorter than the wanted length',
      'event-overlaps-window': 'a booked event overlaps the window (one warning per event)',
    }),
  },
};

export const TimelineRequestDto = schemaDto('TimelineRequestDto', timelineRequestSchema);
export const TimelineResponseDto = schemaDto('TimelineResponseDto', timelineResponseSchema);
