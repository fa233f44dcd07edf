import type { JsonSchema } from '../validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { balanceRequestSchema } from './balance.schema.js';
import { bool, lengthUnit, num, str, WARNINGS } from './common.js';
import { twilightRequestSchema } from './twilight.schema.js';

const closed = (
  description: string,
  properties: Record<string, JsonSchema>,
  required: string[] = [],
): JsonSchema => ({
  type: 'object',
  additionalProperties: false,
  description,
  properties,
  required,
});

const tw = twilightRequestSchema.properties;
const bal = balanceRequestSchema.properties;

export const setupRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'The whole dusk setup: when to shoot, background exposure minute by minute, key and rim ' +
    'flash power, gels and white balance, with safety cautions for the conditions given.',
  required: ['latitude', 'longitude', 'date', 'timeZone', 'key'],
  properties: {
    latitude: tw.latitude!,
    longitude: tw.longitude!,
    date: tw.date!,
    timeZone: tw.timeZone!,
    elevation: tw.elevation!,
    sky: tw.sky!,
    stepMinutes: tw.stepMinutes!,
    camera: closed('Camera limits and taste.', {
      aperture: num('Working f-number; default 5.6.', 4),
      isoMin: num('Lowest ISO to use.', 100),
      isoMax: num('ISO ceiling; default 6400.', 3200),
      support: str('Handheld or on a tripod.', 'handheld', { enum: ['handheld', 'tripod'] }),
      slowestHandheldSeconds: num('Slowest handheld shutter time, seconds.', 0.0167),
      flashSyncSeconds: num('Flash sync speed, seconds; default 1/200.', 0.005),
      biasStops: num('Background bias, stops (taste); default −1.', -1),
      kelvin: num('Camera white balance, kelvin; default 3800.', 3800),
      tint: num('Camera tint, CC units.', 0),
    }),
    key: closed(
      'The key light.',
      {
        guideNumber: num('Guide number at ISO 100, full power, in guideNumberUnit.', 60),
        guideNumberUnit: lengthUnit('Unit of the guide number.'),
        distance: num('Light-to-subject distance in distanceUnit.', 2.5),
        distanceUnit: lengthUnit('Unit of the distances.'),
        angleFromCameraDeg: num('Angle of the key from the camera axis, degrees; default 60.', 45),
        modifier: str('Modifier kind (see the math library’s modifier list).', undefined, {
          maxLength: 40,
        }),
        modifierSize: num('Modifier size in distanceUnit.', 0.9),
        modifierLossStops: num('Light lost in the modifier, stops.', 1.3),
      },
      ['guideNumber', 'distance'],
    ),
    rim: closed(
      'An optional rim light behind the subject.',
      {
        guideNumber: num('Guide number at ISO 100, full power.', 45),
        guideNumberUnit: lengthUnit('Unit of the guide number.'),
        distanceBehind: num('Horizontal distance behind the subject.', 3),
        lightHeight: num('Height of the light above the ground.', 2),
        distanceUnit: lengthUnit('Unit of the distances.'),
        beamAngleDeg: num('Full beam angle, degrees.', 40),
        rimOverKeyStops: num('Rim brighter than the key by, stops; default 1.', 1),
        gelled: bool('Gel the rim like the key (default true).', true),
        modifierLossStops: num('Light lost in the modifier, stops.', 0),
      },
      ['guideNumber', 'distanceBehind', 'lightHeight'],
    ),
    flashKelvin: bal.flashKelvin!,
    targetMiredOffset: bal.targetMiredOffset!,
    gels: bal.gels!,
    maxGels: bal.maxGels!,
    miredTolerance: bal.miredTolerance!,
    backgroundDistance: num('Key-light-to-background distance, in key.distanceUnit.', 12),
    conditions: closed('Site conditions; they add safety cautions.', {
      windKmh: num('Wind speed, km/h.', 15),
      nearRoad: bool('Working near a road.', false),
      nearWater: bool('Working near water.', true),
      coldFogOrHaze: bool('Using cold fog or haze.', false),
      modellingLamps: bool('Using hot modelling lamps.', false),
    }),
    suggestions: {
      type: 'integer',
      minimum: 1,
      maximum: 10,
      description: 'How many suggested minutes (1..10); default 3.',
      example: 3,
    },
  },
};

const loose = (description: string): JsonSchema => ({ type: 'object', description });

export const setupResponseSchema: ObjectSchema = {
  type: 'object',
  required: ['twilight', 'window', 'suggestedMinutes', 'whiteBalance', 'gels', 'key', 'cautions'],
  properties: {
    twilight: loose(
      'Sun events and evening windows, as /v1/twilight returns them (without the ambient timeline).',
    ),
    window: {
      type: 'object',
      description:
        'The shooting window (blue hour, else sunset to civil dusk) and its usable part.',
      properties: {
        start: { type: ['string', 'null'], description: 'ISO 8601 with offset.' },
        end: { type: ['string', 'null'], description: 'ISO 8601 with offset.' },
        usableStart: { type: ['string', 'null'], description: 'ISO 8601 with offset.' },
        usableEnd: { type: ['string', 'null'], description: 'ISO 8601 with offset.' },
      },
    },
    suggestedMinutes: {
      type: 'array',
      description: 'Suggested minutes with background exposure and key/rim flash power for each.',
      items: {
        type: 'object',
        properties: {
          time: str('ISO 8601 local time with offset.'),
          sunAltitudeDeg: num('Sun altitude, degrees.'),
          ambientEv100: num('Ambient EV at ISO 100.'),
          background: loose('Background exposure (shutter, aperture, ISO).'),
          keyFlash: loose('Key flash power, as /v1/flash returns it.'),
          rimFlash: { type: ['object', 'null'], description: 'Rim flash power, or null.' },
          usable: bool('Settings stay inside every limit and the flashes are feasible.'),
        },
      },
    },
    whiteBalance: loose('Camera white balance and fine-tune.'),
    gels: loose('Chosen gels, their loss and the power compensation.'),
    key: loose('Key-light geometry and modifier.'),
    backlight: {
      type: ['object', 'null'],
      description: 'Rim-light geometry, as /v1/backlight returns it.',
    },
    backgroundFalloffStops: {
      type: ['number', 'null'],
      description: 'Key falloff from subject to background, stops.',
    },
    look: {
      type: 'array',
      description: 'How the scene’s sources render.',
      items: { type: 'object' },
    },
    cautions: {
      type: 'array',
      description: 'Safety cautions for the conditions (defer to local codes and venue rules).',
      items: { type: 'object' },
    },
    warnings: WARNINGS,
  },
};

export const SetupResponseDto = schemaDto('SetupResponseDto', setupResponseSchema);
