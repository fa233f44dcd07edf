import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { FLASH_WARNING_CODES } from '@lumenwright/shared';
import { bool, lengthUnit, outNum, ranged, str, warningsWith } from './common.js';

export const flashRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'Flash power for a subject at a distance and aperture, from the guide number (ISO 1230: ' +
    'GN = distance × f-number at ISO 100, full power).',
  required: ['guideNumber', 'distance', 'aperture'],
  properties: {
    guideNumber: ranged('Guide number at ISO 100 and full power, in guideNumberUnit.', 1, 500, 60),
    guideNumberUnit: lengthUnit('Unit of the guide number.'),
    distance: ranged('Light-to-subject distance in distanceUnit.', 0.05, 1000, 3),
    distanceUnit: lengthUnit('Unit of the distance.'),
    aperture: ranged('f-number.', 0.7, 128, 5.6),
    iso: ranged('ISO speed; default 100.', 3, 409600, 200),
    modifierLossStops: ranged('Light lost in the modifier, stops.', 0, 8, 1.5),
    gelLossStops: ranged('Light lost in gels, stops.', 0, 8, 0.67),
    minPowerFraction: ranged(
      'Lowest power the light can go to, as a fraction of full; default 1/256.',
      1 / 4096,
      1,
      0.00390625,
    ),
    exposureStops: ranged(
      'Exposure this light should give on its own, stops relative to a correct exposure at ' +
        'aperture and iso; default 0. -1 when the ambient already gives half the exposure on ' +
        'the subject; +1 for a rim one stop brighter.',
      -6,
      6,
      0,
    ),
  },
};

export const flashResponseSchema: ObjectSchema = {
  type: 'object',
  required: ['powerFraction', 'stopsBelowFull', 'feasible', 'fixes', 'warnings'],
  properties: {
    powerFraction: outNum('Fraction of full power needed (above 1 when not feasible).', 0.125),
    powerLabel: str('Power on the 1/1..1/256 third-stop scale, e.g. "1/8 +0.3".', '1/8'),
    decimalPower: outNum('Power on a decimal ten-stop scale (10 = full).', 7),
    stopsBelowFull: outNum('Stops below full power (negative = more than full needed).', 3),
    feasible: bool('Whether the light can deliver this at or below full power.', true),
    guideNumberUnit: lengthUnit('Unit of the guide numbers in this answer (as sent).'),
    distanceUnit: lengthUnit('Unit of the distances in `fixes` (as sent).'),
    requiredGuideNumber: outNum(
      'Guide number the shot needs at full power, ISO 100, no losses, in guideNumberUnit.',
    ),
    effectiveGuideNumber: outNum('Guide number after ISO and losses, in guideNumberUnit.'),
    totalLossStops: outNum('Modifier plus gel losses, stops.', 2.17),
    fixes: {
      type: ['object', 'null'],
      description:
        'When not feasible: each single change that would fix it (distances in distanceUnit).',
      properties: {
        moveCloserTo: outNum('Distance to move the light to.'),
        raiseIsoTo: outNum('ISO that would work.'),
        raiseIsoByStops: outNum('Stops of ISO to add.'),
        openUpTo: outNum('f-number that would work.'),
        openUpByStops: outNum('Stops to open up.'),
        moveBackTo: outNum('Distance to move back to (below minimum power).'),
        stopDownTo: outNum('f-number to stop down to (below minimum power).'),
        stopDownByStops: outNum('Stops to stop down (below minimum power).'),
        lowerIsoTo: outNum(
          'ISO that would work (below minimum power); left out when it would be under ISO 50.',
        ),
        lowerIsoByStops: outNum(
          'Stops of ISO to take away (below minimum power); left out with lowerIsoTo.',
        ),
        addLossStops: outNum(
          'Light to take away in front of the flash, stops: an ND gel or more diffusion (below minimum power).',
        ),
      },
    },
    warnings: warningsWith(FLASH_WARNING_CODES, {
      'ambient-dominates': 'the dusk setup’s key light only: the ambient outweighs the key',
    }),
  },
};

export const FlashResponseDto = schemaDto('FlashResponseDto', flashResponseSchema);
