import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { lengthUnit, nullableNum, outNum, ranged, rangedInt, str } from './common.js';

export const falloffRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description: 'Inverse-square falloff from the subject to the background and ground.',
  required: ['subjectDistance'],
  properties: {
    subjectDistance: ranged('Light-to-subject distance in distanceUnit.', 0.05, 1000, 2.5),
    backgroundDistance: ranged('Light-to-background distance in distanceUnit.', 0.05, 1000, 9),
    groundDistance: ranged(
      'Light-to-nearest-ground-in-frame distance in distanceUnit.',
      0.05,
      1000,
      2.2,
    ),
    distanceUnit: lengthUnit('Unit of every distance.'),
    from: ranged(
      'Start of the chart series, in distanceUnit; default subjectDistance / 2.',
      0.05,
      999,
      1,
    ),
    to: ranged(
      'End of the chart series, in distanceUnit, beyond from; default 3 × the farthest mark, ' +
        'at most 1000.',
      0.05,
      1000,
      20,
    ),
    points: rangedInt('Series points; default 40, log-spaced.', 2, 500, 40),
  },
};

export const falloffResponseSchema: ObjectSchema = {
  type: 'object',
  required: ['distanceUnit', 'marks', 'subjectToBackgroundStops', 'series'],
  properties: {
    distanceUnit: str('Unit of every distance.', 'm', { enum: ['m', 'ft'] }),
    marks: {
      type: 'array',
      description: 'The subject and the optional background and ground marks.',
      items: {
        type: 'object',
        required: ['id', 'distance', 'stopsRelativeToSubject'],
        properties: {
          id: str('Which mark.', 'background', { enum: ['subject', 'background', 'ground'] }),
          distance: outNum('Distance from the light.'),
          stopsRelativeToSubject: outNum(
            'Stops relative to the subject (negative = darker).',
            -3.85,
          ),
        },
      },
    },
    subjectToBackgroundStops: nullableNum(
      'Stops the background sits below the subject (+ = darker).',
      3.85,
    ),
    series: {
      type: 'array',
      description: 'Log-spaced points for a chart.',
      items: {
        type: 'object',
        required: ['distance', 'stopsRelativeToSubject', 'relativeIlluminance'],
        properties: {
          distance: outNum('Distance from the light.'),
          stopsRelativeToSubject: outNum('Stops relative to the subject.'),
          relativeIlluminance: outNum('Illuminance relative to the subject (1 = subject).'),
        },
      },
    },
  },
};

export const FalloffRequestDto = schemaDto('FalloffRequestDto', falloffRequestSchema);
export const FalloffResponseDto = schemaDto('FalloffResponseDto', falloffResponseSchema);
