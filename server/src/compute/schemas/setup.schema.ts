import type { JsonSchema } from '../validation/json-schema.js';
import { refTo, schemaDto, type ObjectSchema } from '../validation/schema-dto.js';
import { backlightResponseSchema } from './backlight.schema.js';
import { balanceRequestSchema, balanceResponseSchema, SCENE_SWATCH } from './balance.schema.js';
import { exposureResponseSchema } from './exposure.schema.js';
import { flashResponseSchema } from './flash.schema.js';
import { MODIFIER_NAMES, SETUP_WARNING_CODES } from '@lumenwright/shared';
import {
  bool,
  lengthUnit,
  object,
  outNum,
  ranged,
  rangedInt,
  str,
  warningsWith,
} from './common.js';
import { twilightRequestSchema, twilightResponseSchema } from './twilight.schema.js';

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
    elevationUnit: tw.elevationUnit!,
    sky: tw.sky!,
    stepMinutes: tw.stepMinutes!,
    camera: closed('Camera limits and taste.', {
      aperture: ranged('Working f-number; default 5.6.', 0.7, 128, 4),
      isoMin: ranged('Lowest ISO to use; default 100.', 3, 409600, 100),
      isoMax: ranged(
        'ISO ceiling, at least isoMin; default 6400 (or isoMin when that is higher).',
        3,
        409600,
        3200,
      ),
      support: str(
        'Handheld (the shutter stops at 1/60 s before ISO rises) or on a tripod (it may go to ' +
          '1/15 s, where a person starts to ghost).',
        'handheld',
        { enum: ['handheld', 'tripod'] },
      ),
      slowestHandheldSeconds: ranged(
        'Slowest handheld shutter time, seconds; default 1/60.',
        1 / 8000,
        30,
        0.0167,
      ),
      flashSyncSeconds: ranged('Flash sync speed, seconds; default 1/200.', 1 / 16000, 1, 0.005),
      biasStops: ranged('Background bias, stops (taste); default −1.', -6, 6, -1),
      biasFloorStops: ranged(
        'Darkest background bias you accept, stops, at most biasStops. When a minute fails only ' +
          'because a flash would need less than its lowest power, the bias is lowered in ' +
          '1/3-stop steps (then to this floor) and the brightest that frees the minute is used. ' +
          'Omit it to keep the bias fixed.',
        -6,
        6,
        -2,
      ),
      kelvin: ranged('Camera white balance, kelvin; default 3800.', 1500, 20000, 3800),
      tint: ranged('Camera tint, CC units (+ = toward magenta); default 0.', -60, 60, 0),
    }),
    key: closed(
      'The key light.',
      {
        guideNumber: ranged('Guide number at ISO 100, full power, in guideNumberUnit.', 1, 500, 60),
        guideNumberUnit: lengthUnit('Unit of the guide number.'),
        distance: ranged(
          'Light-to-subject distance in distanceUnit: 0.1–50 m or 0.33–164 ft (the range ' +
            'given spans both).',
          0.1,
          164,
          2.5,
        ),
        distanceUnit: lengthUnit('Unit of the distances.'),
        angleFromCameraDeg: ranged(
          'Angle of the key from the camera axis, degrees; default 60.',
          0,
          180,
          45,
        ),
        modifier: str(
          'Modifier kind; it sets the default modifierSize and modifierLossStops. Default softbox.',
          'softbox',
          { enum: MODIFIER_NAMES },
        ),
        modifierSize: ranged(
          'Modifier size in distanceUnit: 0.01–10 m or 0.033–33 ft (the range given spans both).',
          0.01,
          33,
          0.9,
        ),
        modifierLossStops: ranged('Light lost in the modifier, stops.', 0, 8, 1.3),
      },
      ['guideNumber', 'distance'],
    ),
    rim: closed(
      'An optional rim light behind the subject.',
      {
        guideNumber: ranged('Guide number at ISO 100, full power, in guideNumberUnit.', 1, 500, 45),
        guideNumberUnit: lengthUnit('Unit of the guide number.'),
        distanceBehind: ranged(
          'Horizontal distance behind the subject, in distanceUnit: 0.1–50 m or 0.33–164 ft (the ' +
            'range given spans both).',
          0.1,
          164,
          3,
        ),
        lightHeight: ranged(
          'Height of the light above the ground, in distanceUnit; in metres at most 10 (33 is the limit in feet).',
          0,
          33,
          2,
        ),
        distanceUnit: lengthUnit('Unit of the distances.'),
        beamAngleDeg: ranged('Full beam angle, degrees; default 100.', 1, 180, 40),
        rimOverKeyStops: ranged(
          'Rim brighter than the lit side (key plus ambient, as a meter reads it), stops; default 1.',
          -6,
          6,
          1,
        ),
        gelled: bool('Gel the rim like the key (default true).', true),
        modifierLossStops: ranged('Light lost in the modifier, stops.', 0, 8, 0),
      },
      ['guideNumber', 'distanceBehind', 'lightHeight'],
    ),
    flashKelvin: bal.flashKelvin!,
    targetMiredOffset: bal.targetMiredOffset!,
    gels: bal.gels!,
    maxGels: bal.maxGels!,
    miredTolerance: bal.miredTolerance!,
    backgroundDistance: ranged(
      'Key-light-to-background distance, in key.distanceUnit.',
      0.05,
      1000,
      12,
    ),
    conditions: closed('Site conditions; they add safety cautions.', {
      windKmh: ranged('Wind speed, km/h.', 0, 400, 15),
      nearRoad: bool('Working near a road.', false),
      nearWater: bool('Working near water.', true),
      coldFogOrHaze: bool('Using cold fog or haze.', false),
      modellingLamps: bool('Using hot modelling lamps.', false),
    }),
    suggestions: rangedInt('How many suggested minutes; default 3.', 1, 10, 3),
  },
};

const balanceOut = balanceResponseSchema.properties;
const twilightOut = twilightResponseSchema.properties;
const { ambient: _ambient, ...twilightWithoutAmbient } = twilightOut;
void _ambient;

const ISO = (description: string): JsonSchema => ({
  type: ['string', 'null'],
  format: 'date-time',
  description: `${description} ISO 8601 local time with offset, or null.`,
});

export const setupResponseSchema: ObjectSchema = {
  type: 'object',
  required: [
    'twilight',
    'window',
    'suggestedMinutes',
    'whiteBalance',
    'gels',
    'key',
    'backlight',
    'backgroundFalloffStops',
    'look',
    'cautions',
    'warnings',
  ],
  properties: {
    twilight: {
      type: 'object',
      description:
        'Sun events and evening windows, as /v1/twilight returns them (without the ambient ' +
        'timeline), with the ambient model’s uncertainty.',
      required: [...(twilightResponseSchema.required ?? []).filter((r) => r !== 'ambient')],
      properties: {
        ...twilightWithoutAmbient,
        ambientUncertaintyStops: outNum('Typical uncertainty of the ambient model, stops.', 1),
      },
    },
    window: {
      type: 'object',
      description:
        'The shooting window (blue hour, else sunset to civil dusk) and its usable part: the ' +
        'first and last usable minute, and the unbroken runs of usable minutes between them.',
      // usableSpans is always in a POST /v1/setup answer; plans saved before it lack it.
      required: ['start', 'end', 'usableStart', 'usableEnd'],
      properties: {
        start: ISO('Start of the window.'),
        end: ISO('End of the window.'),
        usableStart: ISO(
          'First minute where every setting stays inside its limits. Minutes between ' +
            'usableStart and usableEnd may be unusable: usableSpans lists the runs.',
        ),
        usableEnd: ISO('Last such minute. There may be gaps since usableStart (see usableSpans).'),
        usableSpans: {
          type: 'array',
          description:
            'The unbroken runs of usable minutes, in time order; empty when no minute is usable. ' +
            'Two usable minutes are in one run when they are neighbours on the timeline ' +
            '(stepMinutes apart); between two runs every planned minute is unusable (a ' +
            'background limit, or a flash out of its power range even at the lowest bias ' +
            'camera.biasFloorStops allows). Always present in a POST /v1/setup answer; absent ' +
            'from plans saved before it was added (read usableStart/usableEnd there).',
          items: {
            type: 'object',
            required: ['start', 'end', 'lengthMinutes'],
            properties: {
              start: str(
                'First usable minute of the run, ISO 8601 local time with offset.',
                '2026-09-20T19:57:24-04:00',
                { format: 'date-time' },
              ),
              end: str(
                'Last usable minute of the run (equal to start for a run of one planned minute).',
                '2026-09-20T20:01:24-04:00',
                { format: 'date-time' },
              ),
              lengthMinutes: outNum(
                'Minutes from start to end: (planned minutes in the run − 1) × stepMinutes; 0 ' +
                  'for a run of one minute.',
                4,
              ),
            },
          },
          example: [
            {
              start: '2026-09-20T19:57:24-04:00',
              end: '2026-09-20T20:01:24-04:00',
              lengthMinutes: 4,
            },
            {
              start: '2026-09-20T20:05:24-04:00',
              end: '2026-09-20T20:07:24-04:00',
              lengthMinutes: 2,
            },
          ],
        },
      },
    },
    suggestedMinutes: {
      type: 'array',
      description: 'Suggested minutes with background exposure and key/rim flash power for each.',
      items: {
        type: 'object',
        required: [
          'time',
          'sunAltitudeDeg',
          'ambientEv100',
          'background',
          'biasLoweredByStops',
          'keyFlash',
          'rimFlash',
          'usable',
        ],
        properties: {
          time: str('ISO 8601 local time with offset.', '2026-06-20T21:40:00+01:00'),
          sunAltitudeDeg: outNum('Sun altitude, degrees.', -3.1),
          ambientEv100: outNum('Ambient EV at ISO 100.', 6.2),
          background: refTo(
            'ExposureResponseDto',
            exposureResponseSchema,
            'Background exposure for that minute, as /v1/exposure returns it in background mode, ' +
              'at the bias used (biasStops).',
          ),
          biasLoweredByStops: outNum(
            'Stops the bias was lowered below camera.biasStops (within camera.biasFloorStops) to ' +
              'make this minute usable; 0 when planned at the bias given.',
            0.33,
          ),
          keyFlash: refTo(
            'FlashResponseDto',
            flashResponseSchema,
            'Key flash power, as /v1/flash returns it.',
          ),
          rimFlash: refTo(
            'FlashResponseDto',
            flashResponseSchema,
            'Rim flash power, or null without a rim light.',
            true,
          ),
          usable: bool('Settings stay inside every limit and the flashes are feasible.'),
        },
      },
    },
    whiteBalance: object('Camera white balance and the fine-tune that cancels the residual.', {
      cameraKelvin: outNum('Camera white balance, kelvin.', 3800),
      fineTune: balanceOut.whiteBalanceFineTune!,
    }),
    gels: object('Chosen gels for the key (and a gelled rim), their loss and the compensation.', {
      gels: balanceOut.gels!,
      gelLossStops: balanceOut.gelLossStops!,
      powerCompensationStops: balanceOut.powerCompensationStops!,
      residualMired: balanceOut.residualMired!,
      resultingFlashKelvin: balanceOut.resultingFlashKelvin!,
    }),
    key: object('Key-light placement, modifier and character.', {
      distanceUnit: str('Unit of the position.', 'm', { enum: ['m', 'ft'] }),
      position: object('Light position relative to the subject, in distanceUnit.', {
        towardCamera: outNum('Toward the camera (+) or behind the subject (−).', 1.25),
        sideways: outNum('To the side of the camera axis.', 2.17),
        aboveEyes: outNum('Above the subject’s eyes.', 0.6),
      }),
      apparentSizeDeg: outNum('Apparent size of the modifier from the subject, degrees.', 20.4),
      sizeToDistance: outNum('Modifier size ÷ distance.', 0.36),
      quality: str('Light quality from the size-to-distance ratio.', 'medium', {
        enum: ['hard', 'medium', 'soft'],
      }),
      shadowSide: str('Where the shadow side falls for this angle.', 'dramatic', {
        enum: ['frontal', 'modelled', 'dramatic', 'side', 'behind'],
      }),
      lightingRatio: outNum('(key + fill) : fill, e.g. 3 for 3:1.', 3),
      lightingRatioLabel: str('The ratio as written, e.g. "3:1".', '3:1'),
      shadowDepthStops: outNum('Lit side minus shadow side, stops.', 1.58),
      modifier: str('Modifier kind used.', 'softbox', { enum: MODIFIER_NAMES }),
      modifierLossStops: outNum('Light lost in the modifier, stops.', 1.3),
    }),
    backlight: refTo(
      'BacklightResponseDto',
      backlightResponseSchema,
      'Rim-light geometry, as /v1/backlight returns it, or null without a rim light.',
      true,
    ),
    backgroundFalloffStops: {
      type: ['number', 'null'],
      description:
        'Key falloff from subject to background, stops (null without backgroundDistance).',
      example: 2.3,
    },
    look: {
      type: 'array',
      description: 'How the scene’s sources render at the camera white balance.',
      items: SCENE_SWATCH,
    },
    cautions: {
      type: 'array',
      description:
        'Safety cautions for the conditions. General good practice only: defer to local codes, ' +
        'venue rules, permits and licensed practice.',
      items: object('One caution.', {
        id: str('Stable caution id.', 'stands-wind'),
        title: str('Short title.'),
        text: str('What to do.'),
      }),
    },
    warnings: warningsWith(
      SETUP_WARNING_CODES,
      {},
      'Things to look at: a stable code and a sentence for people. Besides the plan’s own, these ' +
        'include the twilight’s ("time-zone-mismatch"), the rim light’s backlight warnings ' +
        '(prefixed "rim-"), the first minute where the ambient outweighs the key ' +
        '("ambient-dominates") and the balance’s ("fine-tune-limit", "fine-tune-beyond-range").',
    ),
  },
};

export const SetupResponseDto = schemaDto('SetupResponseDto', setupResponseSchema);
