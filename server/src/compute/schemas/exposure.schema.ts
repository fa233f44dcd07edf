import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { bool, nullableNum, num, object, outNum, str, WARNINGS } from './common.js';

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
    ev100: num('Scene or incident exposure value at ISO 100, EV (-10..25).', 9),
    aperture: num('f-number (0.7..128).', 4),
    shutterSeconds: num('Shutter time, seconds (1/64000..3600); plain mode only.', 0.0125, {
      exclusiveMinimum: 0,
    }),
    iso: num('ISO speed (3..409600).', 400),
    place: {
      type: 'object',
      additionalProperties: false,
      description: 'Background mode: estimate the ambient EV100 here (USNO Circular 171 model).',
      required: ['latitude', 'longitude', 'time'],
      properties: {
        latitude: num('Degrees, -90..90.', 51.5),
        longitude: num('Degrees, -180..180.', -0.1),
        time: str('ISO 8601 instant with offset.', '2026-06-21T21:40:00+01:00'),
        sky: str('Sky condition.', 'clear', { enum: ['clear', 'partly-cloudy', 'overcast'] }),
      },
    },
    biasStops: num('Background mode: stops brighter (+) or darker (-) than metered, -6..6.', -1),
    isoMin: num('Background mode: lowest ISO the solver may use (default 100).', 100),
    isoMax: num('Background mode: highest ISO the solver may use (default 6400).', 3200),
    apertureMin: num('Background mode: widest f-number when aperture is solved (default 1.4).'),
    apertureMax: num('Background mode: narrowest f-number when aperture is solved (default 22).'),
    support: str('Background mode: camera support.', 'handheld', { enum: ['handheld', 'tripod'] }),
    slowestHandheldSeconds: num('Background mode: slowest hand-held shutter, s (default 1/60).'),
    slowestTripodSeconds: num('Background mode: slowest tripod shutter, s (default 30).'),
    flashSyncSeconds: num('Background mode: flash sync speed, s (e.g. 0.005 for 1/200).', 0.005),
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
    warnings: WARNINGS,
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
