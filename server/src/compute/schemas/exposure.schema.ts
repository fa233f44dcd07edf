import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { EXPOSURE_WARNING_CODES } from '@lumenwright/shared';
import { bool, nullableNum, object, outNum, ranged, str, warningsWith } from './common.js';

export const exposureRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'Two modes. Plain APEX: a scene EV at ISO 100 plus any two (or fewer) of aperture, shutter ' +
    'time and ISO; the missing one is solved (with fewer than two given, ISO 100 and then f/8 are ' +
    'assumed). Background: send any of the constraints (place, biasStops, support, ISO or ' +
    'aperture limits, shutter limits, flashSyncSeconds) and the background solver picks settings ' +
    'for the ambient EV100 (given, or estimated for place + time), with tripod, sync-speed and ' +
    'high-speed-sync warnings. Give ev100 or place.',
  required: [],
  properties: {
    ev100: ranged('Scene or incident exposure value at ISO 100, EV.', -10, 25, 9),
    aperture: ranged('f-number.', 0.7, 128, 4),
    shutterSeconds: ranged('Shutter time, seconds; plain mode only.', 1 / 64000, 3600, 0.0125),
    iso: ranged('ISO speed.', 3, 409600, 400),
    place: {
      type: 'object',
      additionalProperties: false,
      description: 'Background mode: estimate the ambient EV100 here (USNO Circular 171 model).',
      required: ['latitude', 'longitude', 'time'],
      properties: {
        latitude: ranged('Degrees, north positive.', -90, 90, 51.5),
        longitude: ranged('Degrees, east positive.', -180, 180, -0.1),
        time: str('ISO 8601 instant with offset.', '2026-06-21T21:40:00+01:00'),
        sky: str('Sky condition.', 'clear', { enum: ['clear', 'partly-cloudy', 'overcast'] }),
      },
    },
    biasStops: ranged('Background mode: stops brighter (+) or darker (-) than metered.', -6, 6, -1),
    isoMin: ranged('Background mode: lowest ISO the solver may use (default 100).', 3, 409600, 100),
    isoMax: ranged(
      'Background mode: highest ISO the solver may use, at least isoMin (default 6400, or isoMin ' +
        'when that is higher).',
      3,
      409600,
      3200,
    ),
    apertureMin: ranged(
      'Background mode: widest f-number when aperture is solved (default 1.4).',
      0.7,
      128,
    ),
    apertureMax: ranged(
      'Background mode: narrowest f-number when aperture is solved, at least apertureMin ' +
        '(default 22, or apertureMin when that is higher).',
      0.7,
      128,
    ),
    support: str('Background mode: camera support.', 'handheld', { enum: ['handheld', 'tripod'] }),
    slowestHandheldSeconds: ranged(
      'Background mode: slowest hand-held shutter, s (default 1/60).',
      1 / 8000,
      30,
    ),
    slowestTripodSeconds: ranged(
      'Background mode: slowest tripod shutter, s (default 30).',
      1 / 8000,
      3600,
    ),
    flashSyncSeconds: ranged(
      'Background mode: flash sync speed, s (e.g. 0.005 for 1/200).',
      1 / 16000,
      1,
      0.005,
    ),
  },
};

/** Fields that switch /v1/exposure to the background solver. */
export const BACKGROUND_FIELDS = [
  'place',
  'biasStops',
  'isoMin',
  'isoMax',
  'apertureMin',
  'apertureMax',
  'support',
  'slowestHandheldSeconds',
  'slowestTripodSeconds',
  'flashSyncSeconds',
] as const;

export const exposureResponseSchema: ObjectSchema = {
  type: 'object',
  required: ['ev100', 'ev', 'shutterSeconds', 'shutterLabel', 'aperture', 'iso', 'solvedFor'],
  properties: {
    ev100: outNum('The scene EV at ISO 100 used, EV.', 9),
    ev: outNum('Settings EV at the chosen ISO, log2(N²/t).', 11),
    shutterSeconds: outNum('Exact shutter time, seconds.', 0.0125),
    shutterLabel: str('Shutter time as printed on a camera, e.g. "1/80".', '1/80'),
    aperture: outNum('Exact f-number.', 4),
    apertureLabel: str('f-number label, e.g. "f/4".', 'f/4'),
    iso: outNum('ISO speed.', 400),
    isoLabel: str('ISO label.', '400'),
    solvedFor: str('Which setting was solved for.', 'shutterSeconds', {
      enum: ['shutterSeconds', 'aperture', 'iso', 'none'],
    }),
    nominal: object('Nearest third-stop settings and the exposure error they leave.', {
      shutterSeconds: outNum('Nominal shutter time, seconds.'),
      aperture: outNum('Nominal f-number.'),
      iso: outNum('Nominal ISO.'),
      errorStops: outNum('Exposure error of the nominal settings, stops (+ = brighter).'),
    }),
    warnings: warningsWith(EXPOSURE_WARNING_CODES, {
      'too-dark': 'background mode',
      'needs-tripod': 'background mode',
      'subject-motion': 'background mode',
      'exceeds-sync': 'background mode',
    }),
    biasStops: outNum('Background mode: the bias applied, stops.'),
    targetEv100: outNum('Background mode: the EV100 the settings expose for (ev100 - biasStops).'),
    ambientSource: str('Background mode: where ev100 came from.', 'place', {
      enum: ['ev100', 'place'],
    }),
    needsTripod: bool('Background mode: the shutter is slower than the hand-held limit.'),
    exceedsSync: bool('Background mode: the shutter is faster than the flash sync speed.'),
    hssLossStops: nullableNum('Background mode: flash power lost to high-speed sync, stops.'),
    ndStopsForSync: nullableNum('Background mode: ND strength that brings the shutter to sync.'),
    shortfallStops: outNum('Background mode: exposure the limits could not reach, stops.'),
  },
};

export const ExposureRequestDto = schemaDto('ExposureRequestDto', exposureRequestSchema);
export const ExposureResponseDto = schemaDto('ExposureResponseDto', exposureResponseSchema);
