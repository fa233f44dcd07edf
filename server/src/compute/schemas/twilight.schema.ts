import {
  MISSING_REASONS,
  TWILIGHT_WARNING_CODES,
  ZONE_SOLAR_MISMATCH_HOURS,
} from '@lumenwright/shared';
import type { JsonSchema } from '../validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { lengthUnit, object, outNum, ranged, str, warningsWith } from './common.js';

const band = (description: string): JsonSchema => ({
  type: 'object',
  additionalProperties: false,
  description,
  required: ['upperDeg', 'lowerDeg'],
  properties: {
    upperDeg: ranged('Upper sun altitude, degrees.', -18, 20, 6),
    lowerDeg: ranged('Lower sun altitude, degrees, below upperDeg.', -18, 20, -4),
  },
});

export const twilightRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description: 'Sun events, evening windows and the ambient-light timeline for one local date.',
  required: ['latitude', 'longitude', 'date', 'timeZone'],
  properties: {
    latitude: ranged('Degrees, north positive.', -90, 90, 51.507),
    longitude: ranged('Degrees, east positive.', -180, 180, -0.1),
    date: str('Local calendar date, YYYY-MM-DD (1900..2100).', '2026-06-20', { format: 'date' }),
    timeZone: str(
      'IANA time zone name, such as Europe/Zurich (any letter case); a UTC offset such as ' +
        '"+02:00" is refused. Answers spell it as the tz database does.',
      'Europe/London',
      { minLength: 1, maxLength: 64 },
    ),
    elevation: ranged(
      'Observer height above the visible horizon, in elevationUnit: 0–9000 m or 0–29,527 ft ' +
        '(the range given spans both); default 0.',
      0,
      29527,
      0,
    ),
    elevationUnit: lengthUnit('Unit of the elevation; default m.'),
    goldenHour: band('Golden-hour band; default +6° to −4° (common practice, no standard).'),
    blueHour: band('Blue-hour band; default −4° to −8° (common practice, no standard).'),
    stepMinutes: ranged('Ambient timeline step, minutes; default 2.', 0.5, 60, 5),
    sky: str('Sky condition for the ambient estimate; default clear.', 'clear', {
      enum: ['clear', 'partly-cloudy', 'overcast'],
    }),
  },
};

const instant = (description: string, example: string | null): JsonSchema => ({
  type: ['string', 'null'],
  format: 'date-time',
  description: `${description} ISO 8601 local time with offset, or null (see reasons).`,
  example,
});

const window = (description: string): JsonSchema =>
  object(description, {
    start: instant('Start.', '2026-06-20T20:49:00+01:00'),
    end: instant('End.', '2026-06-20T21:48:00+01:00'),
  });

export const twilightResponseSchema: ObjectSchema = {
  type: 'object',
  required: [
    'sunset',
    'civilDusk',
    'nauticalDusk',
    'astronomicalDusk',
    'sunrise',
    'civilDawn',
    'nauticalDawn',
    'astronomicalDawn',
    'goldenHour',
    'blueHour',
    'reasons',
    'warnings',
    'ambient',
  ],
  properties: {
    date: str('The local date.', '2026-06-20'),
    timeZone: str('The IANA time zone, spelled as the tz database does.', 'Europe/London'),
    sunrise: instant('Sunrise.', '2026-06-20T04:43:00+01:00'),
    sunset: instant('Sunset.', '2026-06-20T21:21:00+01:00'),
    civilDawn: instant('Civil dawn (sun 6° below the horizon).', '2026-06-20T03:57:00+01:00'),
    civilDusk: instant('Civil dusk (sun 6° below the horizon).', '2026-06-20T22:08:00+01:00'),
    nauticalDawn: instant('Nautical dawn (12° below).', null),
    nauticalDusk: instant('Nautical dusk (12° below).', '2026-06-20T23:18:00+01:00'),
    astronomicalDawn: instant('Astronomical dawn (18° below).', null),
    astronomicalDusk: instant('Astronomical dusk (18° below).', null),
    solarNoon: instant('Solar noon.', '2026-06-20T13:02:00+01:00'),
    goldenHour: window('Evening golden hour (sun descending through the golden band).'),
    blueHour: window('Evening blue hour.'),
    sunsetAzimuthDeg: {
      type: ['number', 'null'],
      description: 'Sun azimuth at sunset, degrees clockwise from north.',
      example: 310.9,
    },
    reasons: {
      type: 'object',
      description:
        'For each null event (keys like "astronomicalDusk" or "goldenHour.start"), why it is missing.',
      additionalProperties: {
        type: 'string',
        enum: [...MISSING_REASONS],
        description: 'Why the event is missing.',
      },
      example: { astronomicalDusk: 'twilight-never-ends' },
    },
    notes: {
      type: 'array',
      description: 'Notes, e.g. an event after local midnight.',
      items: { type: 'string' },
    },
    warnings: warningsWith(TWILIGHT_WARNING_CODES, {
      'time-zone-mismatch':
        `the zone’s UTC offset on the date is more than ${ZONE_SOLAR_MISMATCH_HOURS} h from the ` +
        'place’s solar time, longitude / 15 h: probably not the place’s zone',
    }),
    ambient: object('Modelled ambient light through the evening (USNO Circular 171 model).', {
      sky: str('Sky condition used.', 'clear'),
      model: str('Model name.', 'USNO Circular 171'),
      uncertaintyStops: outNum('Typical model uncertainty, stops.', 1),
      stepMinutes: outNum('Timeline step, minutes.', 5),
      points: {
        type: 'array',
        description: 'The ambient timeline.',
        items: object('One sample.', {
          time: str('ISO 8601 local time with offset.', '2026-06-20T21:30:00+01:00'),
          sunAltitudeDeg: outNum('Geometric altitude of the sun, degrees.', -1.2),
          illuminanceLux: outNum('Modelled horizontal illuminance, lux.', 350),
          ev100: outNum('Incident EV at ISO 100.', 7.1),
          stopsPer10Min: outNum('Change of EV100 per 10 minutes (negative = darker).', -0.9),
        }),
      },
    }),
  },
};

export const TwilightRequestDto = schemaDto('TwilightRequestDto', twilightRequestSchema);
export const TwilightResponseDto = schemaDto('TwilightResponseDto', twilightResponseSchema);
