import { BALANCE_WARNING_CODES, WB_FINE_TUNE_USUAL_STEPS } from '@lumenwright/shared';
import type { JsonSchema } from '../validation/json-schema.js';
import { schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { outNum, ranged, rangedInt, str, warningsWith } from './common.js';

export const balanceRequestSchema: ObjectSchema = {
  type: 'object',
  additionalProperties: false,
  description:
    'Gel the flash so it matches the camera white balance (plus an optional creative offset), ' +
    'working in mireds (10⁶ / kelvin).',
  required: ['cameraKelvin'],
  properties: {
    cameraKelvin: ranged('Camera white balance, kelvin.', 1500, 20000, 3800),
    cameraTint: ranged('Camera tint, CC units (+ = toward magenta); default 0.', -60, 60, 0),
    flashKelvin: ranged('Bare flash colour temperature, kelvin; default 5500.', 2500, 10000, 5600),
    targetMiredOffset: ranged(
      'Extra warmth wanted on the subject, mireds (+ = warmer). With the camera white balance ' +
        'it must name real light: 10⁶ / cameraKelvin + offset within 1500..20000 K.',
      -200,
      200,
      10,
    ),
    gels: {
      type: 'array',
      maxItems: 30,
      description:
        'The gels to choose from; default: the built-in catalogue of common CTO/CTB cuts.',
      items: {
        type: 'object',
        additionalProperties: false,
        required: ['name', 'miredShift', 'lossStops'],
        properties: {
          name: str('Your name for the gel.', 'Half warming', { minLength: 1, maxLength: 60 }),
          miredShift: ranged(
            'Mired shift of the gel (+ = warmer, CTO; − = cooler, CTB).',
            -400,
            400,
            81,
          ),
          greenShift: ranged('Green shift, CC units (+ = plus-green); default 0.', -60, 60, 0),
          lossStops: ranged('Light the gel absorbs, stops.', 0, 6, 0.33),
        },
      },
    },
    maxGels: rangedInt('Most gels in one stack; default 3.', 0, 4, 2),
    miredTolerance: ranged(
      'Mireds of error accepted to use fewer gels; default 0 (closest stack). Any stack within ' +
        'this of the required shift is a match; the match with the fewest gels, then the least ' +
        'light loss, is chosen.',
      0,
      50,
      10,
    ),
  },
};

/** One chosen gel, as /v1/balance and /v1/setup return it. */
export const CHOSEN_GELS: JsonSchema = {
  type: 'array',
  description: 'The chosen gels (empty when none is needed).',
  items: {
    type: 'object',
    required: ['name', 'miredShift', 'greenShift', 'lossStops'],
    properties: {
      name: str('Gel name.', 'Half warming'),
      miredShift: outNum('Mired shift, mireds (+ = warmer).', 81),
      greenShift: outNum('Green shift, CC units (+ = plus-green).', 0),
      lossStops: outNum('Light loss, stops.', 0.33),
    },
  },
};

/** The camera white-balance change that cancels a residual. */
export const WB_FINE_TUNE: JsonSchema = {
  type: 'object',
  description: 'Camera white-balance change that cancels the residual on the subject.',
  required: ['miredShift', 'cameraKelvin', 'amberBlueSteps', 'tintCC'],
  properties: {
    miredShift: outNum('Mireds.'),
    cameraKelvin: outNum('Camera white balance that would cancel it, kelvin.'),
    amberBlueSteps: outNum(
      'Steps on an amber(+)/blue(−) fine-tune axis, about 5 mireds each. Cameras usually offer ' +
        `about ±${WB_FINE_TUNE_USUAL_STEPS} to ±9; beyond ±${WB_FINE_TUNE_USUAL_STEPS} a ` +
        '"fine-tune-beyond-range" warning says what to do instead.',
    ),
    tintCC: outNum('Camera tint change, CC units.'),
  },
};

/** The balance's warnings (the setup plan's list includes them). */
const BALANCE_WARNINGS: JsonSchema = warningsWith(BALANCE_WARNING_CODES, {
  'fine-tune-limit':
    'the camera white balance that would cancel the residual is outside 1500–20000 K, so it is ' +
    'clamped',
  'fine-tune-beyond-range': `cancelling the residual takes more than ±${WB_FINE_TUNE_USUAL_STEPS} amber/blue fine-tune steps; allow or add a gel, or set the camera’s kelvin instead`,
});

/** How one light source in the scene renders at the camera white balance. */
export const SCENE_SWATCH: JsonSchema = {
  type: 'object',
  required: ['id', 'label', 'kelvin', 'miredOffset', 'hex', 'rendersAs'],
  properties: {
    id: str('Swatch id.', 'sky-blue-hour'),
    label: str('Swatch label.', 'Sky at blue hour'),
    kelvin: outNum('Source colour temperature, kelvin.', 12000),
    miredOffset: outNum('mired(source) − mired(camera WB); + = warmer than neutral.', -229.2),
    hex: str('Display colour, sRGB hex.', '#9cbdff'),
    rendersAs: str('How it renders.', 'much cooler', {
      enum: ['much warmer', 'warmer', 'neutral', 'cooler', 'much cooler'],
    }),
  },
};

export const balanceResponseSchema: ObjectSchema = {
  type: 'object',
  required: ['requiredMiredShift', 'achievedMiredShift', 'residualMired', 'gels', 'gelLossStops'],
  properties: {
    requiredMiredShift: outNum('Shift the flash needs, mireds (+ = warmer).', 84.6),
    achievedMiredShift: outNum('Shift of the chosen gels, mireds.', 81),
    residualMired: outNum('achieved − required, mireds (+ = flash warmer than intended).', -3.6),
    gels: CHOSEN_GELS,
    gelLossStops: outNum('Total light lost in the chosen gels, stops.', 0.33),
    requiredGreenShift: outNum('Green shift needed, CC units.', 0),
    achievedGreenShift: outNum('Green shift of the chosen gels, CC units.', 0),
    residualGreen: outNum('Green left after gelling, CC units.', 0),
    powerCompensationStops: outNum('Raise flash power by this much to make up for the gels.', 0.33),
    whiteBalanceFineTune: WB_FINE_TUNE,
    flashKelvin: outNum('Bare flash colour temperature used, kelvin.', 5600),
    resultingFlashKelvin: outNum('Flash colour temperature through the gels, kelvin.', 3850),
    scene: {
      type: 'array',
      description: 'How light sources in the scene render at this white balance.',
      items: SCENE_SWATCH,
    },
    warnings: BALANCE_WARNINGS,
  },
};

export const BalanceResponseDto = schemaDto('BalanceResponseDto', balanceResponseSchema);
