import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { bool, lengthUnit, nullableNum, num, outNum, str, WARNINGS } from './common.js';

export const backlightRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'Geometry of a rim light behind the subject: is the head in the beam, where does the beam ' +
    'spill on the ground. Stands behind people at dusk: weight them against wind.',
  required: ['lightHeight', 'distanceBehind'],
  properties: {
    lightHeight: num('Height of the light above the ground, in distanceUnit (0..10 m).', 2),
    distanceBehind: num(
      'Horizontal distance of the light behind the subject (0.1..50 m, 0.1..164 ft).',
      3,
    ),
    headHeight: num('Height of the subject’s head; default 1.6 m.', 1.7),
    distanceUnit: lengthUnit('Unit of every distance.'),
    tiltDeg: num(
      'Beam axis elevation, degrees (+ up, − down; -90..90); default aimed at the head.',
      -5,
    ),
    beamAngleDeg: num(
      'Full beam angle of the grid or reflector, degrees (1..180); default 100.',
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
    warnings: WARNINGS,
  },
};

export const BacklightRequestDto = schemaDto('BacklightRequestDto', backlightRequestSchema);
export const BacklightResponseDto = schemaDto('BacklightResponseDto', backlightResponseSchema);
