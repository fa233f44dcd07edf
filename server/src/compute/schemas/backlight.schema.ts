import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { BACKLIGHT_WARNING_CODES } from '@lumenwright/shared';
import { bool, lengthUnit, nullableNum, outNum, ranged, str, warningsWith } from './common.js';

export const backlightRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'Geometry of a rim light behind the subject: is the head in the beam, where does the beam ' +
    'spill on the ground. Stands behind people at dusk: weight them against wind.',
  required: ['lightHeight', 'distanceBehind'],
  properties: {
    lightHeight: ranged(
      'Height of the light above the ground, in distanceUnit; in metres at most 10 (33 is the limit in feet).',
      0,
      33,
      2,
    ),
    distanceBehind: ranged(
      'Horizontal distance of the light behind the subject, in distanceUnit: 0.1–50 m or ' +
        '0.33–164 ft (the range given spans both).',
      0.1,
      164,
      3,
    ),
    headHeight: ranged(
      'Height of the subject’s head, in distanceUnit: 0.1–10 m or 0.33–33 ft (the range given ' +
        'spans both); default 1.6 m.',
      0.1,
      33,
      1.7,
    ),
    distanceUnit: lengthUnit('Unit of every distance.'),
    tiltDeg: ranged(
      'Beam axis elevation, degrees (+ up, − down); default aimed at the head.',
      -90,
      90,
      -5,
    ),
    beamAngleDeg: ranged(
      'Full beam angle of the grid or reflector, degrees; default 100.',
      1,
      180,
      40,
    ),
  },
};

export const backlightResponseSchema: ObjectSchema = {
  type: 'object',
  required: [
    'distanceUnit',
    'aimDeg',
    'headInBeam',
    'distanceToHead',
    'beamAngleDeg',
    'groundSpill',
  ],
  properties: {
    distanceUnit: str('Unit of every distance.', 'm', { enum: ['m', 'ft'] }),
    aimDeg: outNum('Beam axis elevation used, degrees.', -5.7),
    headDirectionDeg: outNum('Direction from the light to the head, degrees of elevation.'),
    headInBeam: bool('Whether the head is inside the beam.', true),
    distanceToHead: outNum('Light-to-head distance.', 3.02),
    beamAngleDeg: outNum('Full beam angle used, degrees.', 40),
    groundSpill: {
      type: ['object', 'null'],
      description: 'Where the beam reaches the ground, measured from the subject toward the light.',
      properties: { from: outNum('Near edge.'), to: nullableNum('Far edge (null: beyond).') },
    },
    groundVsRimStops: nullableNum(
      'Peak ground illuminance relative to the rim, stops (+ = ground brighter).',
    ),
    warnings: warningsWith(BACKLIGHT_WARNING_CODES),
  },
};

export const BacklightRequestDto = schemaDto('BacklightRequestDto', backlightRequestSchema);
export const BacklightResponseDto = schemaDto('BacklightResponseDto', backlightResponseSchema);
