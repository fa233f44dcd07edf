import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { num, object, outNum, str, WARNINGS } from './common.js';

export const exposureRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'A scene EV at ISO 100 plus any two (or fewer) of aperture, shutter time and ISO; the missing ' +
    'one is solved (APEX). With fewer than two given, ISO 100 and then f/8 are assumed.',
  required: ['ev100'],
  properties: {
    ev100: num('Scene or incident exposure value at ISO 100, EV (-10..25).', 9),
    aperture: num('f-number (0.7..128).', 4),
    shutterSeconds: num('Shutter time, seconds (1/64000..3600).', 0.0125, { exclusiveMinimum: 0 }),
    iso: num('ISO speed (3..409600).', 400),
  },
};

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
  },
};

export const ExposureRequestDto = schemaDto('ExposureRequestDto', exposureRequestSchema);
export const ExposureResponseDto = schemaDto('ExposureResponseDto', exposureResponseSchema);
