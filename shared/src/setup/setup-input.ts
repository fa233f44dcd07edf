import { LightingInputError } from '../errors.js';
import { MODIFIERS, MODIFIER_NAMES, type ModifierName } from '../flash/modifiers.js';
import type { BalanceInput } from '../color/balance.js';
import type { SkyCondition } from '../twilight/ambient-model.js';
import type { LengthUnit } from '../units/length.js';
import { readSiteConditions } from './cautions.js';
import { maybeNumber, optionalNumber, requireObject, requireOneOf } from '../units/validate.js';

export interface DuskSetupInput {
  latitude: number;
  longitude: number;
  /** Local date YYYY-MM-DD. */
  date: string;
  /** IANA time zone. */
  timeZone: string;
  elevation?: number;
  /** Unit of `elevation`; default metres. */
  elevationUnit?: LengthUnit;
  sky?: SkyCondition;
  /** Timeline step, minutes; default 2. */
  stepMinutes?: number;
  camera?: {
    /** Working aperture; default f/5.6. */
    aperture?: number;
    isoMin?: number;
    /** ISO ceiling; default 6400. */
    isoMax?: number;
    /**
     * Hand-held (default): the shutter stops at `slowestHandheldSeconds` (1/60) before ISO rises.
     * Tripod: it may go to 1/15 s, where a person starts to ghost.
     */
    support?: 'handheld' | 'tripod';
    slowestHandheldSeconds?: number;
    /** Flash sync speed, s; default 1/200. */
    flashSyncSeconds?: number;
    /**
     * Background bias in stops (taste); default -1: the background one stop under, and the key
     * makes up the rest of a correct exposure on the subject (ambient plus key).
     */
    biasStops?: number;
    /**
     * Darkest background bias the planner may fall back to, stops, -6..6 and at most `biasStops`.
     * When a minute fails only because a flash would need less than its lowest power, the bias
     * is lowered in 1/3-stop steps (then to this floor) and the brightest bias that frees the
     * minute is used. Omitted: the bias stays fixed.
     */
    biasFloorStops?: number;
    /** Camera white balance, K; default 3800 (a cooled dusk look; taste, not a rule). */
    kelvin?: number;
    tint?: number;
  };
  key: {
    guideNumber: number;
    guideNumberUnit?: LengthUnit;
    distance: number;
    distanceUnit?: LengthUnit;
    /** Default 60° (inside the 45-90° dramatic band). */
    angleFromCameraDeg?: number;
    modifier?: ModifierName;
    /** Modifier size in distanceUnit; default from the modifier. */
    modifierSize?: number;
    modifierLossStops?: number;
  };
  rim?: {
    guideNumber: number;
    guideNumberUnit?: LengthUnit;
    distanceBehind: number;
    lightHeight: number;
    distanceUnit?: LengthUnit;
    beamAngleDeg?: number;
    /**
     * Rim brighter than the lit side (what a meter reads for key plus ambient), stops; default 1
     * (common practice, no source).
     */
    rimOverKeyStops?: number;
    /** Gel the rim like the key (default) or leave it bare (renders cooler). */
    gelled?: boolean;
    modifierLossStops?: number;
  };
  flashKelvin?: number;
  targetMiredOffset?: number;
  gels?: BalanceInput['gels'];
  maxGels?: number;
  miredTolerance?: BalanceInput['miredTolerance'];
  /** Key-light-to-background distance, in key.distanceUnit. */
  backgroundDistance?: number;
  conditions?: {
    windKmh?: number;
    nearRoad?: boolean;
    nearWater?: boolean;
    coldFogOrHaze?: boolean;
    modellingLamps?: boolean;
  };
  /** How many suggested minutes, 1..10; default 3. */
  suggestions?: number;
}

/** The optional bias floor: in range and no brighter than the bias it lowers. */
function readBiasFloor(cam: Record<string, unknown>, bias: number): number | undefined {
  const floor = maybeNumber('camera.biasFloorStops', cam.biasFloorStops, { min: -6, max: 6 });
  if (floor !== undefined && floor > bias) {
    throw new LightingInputError(
      'camera.biasFloorStops',
      `must be at most the background bias (camera.biasStops, ${bias})`,
    );
  }
  return floor;
}

/** Validate and default the parts the plan itself reads (others are validated downstream). */
export function readSetup(input: DuskSetupInput) {
  const o = requireObject('input', input);
  const cam = o.camera === undefined ? {} : requireObject('camera', o.camera);
  const key = requireObject('key', o.key);
  const rim = o.rim === undefined ? undefined : requireObject('rim', o.rim);
  const modifier = requireOneOf('key.modifier', key.modifier, MODIFIER_NAMES, 'softbox');
  const preset = MODIFIERS[modifier];
  const bias = optionalNumber('camera.biasStops', cam.biasStops, -1, { min: -6, max: 6 });
  return {
    o,
    cam,
    key,
    rim,
    // Checked here, not only when a minute is planned: a polar night plans no minute.
    rimOverKeyStops: optionalNumber('rim.rimOverKeyStops', rim?.rimOverKeyStops, 1, {
      min: -6,
      max: 6,
    }),
    modifier,
    modifierLoss: optionalNumber('key.modifierLossStops', key.modifierLossStops, preset.lossStops, {
      min: 0,
      max: 8,
    }),
    modifierSizeM: preset.sizeM,
    kelvin: optionalNumber('camera.kelvin', cam.kelvin, 3800, { min: 1500, max: 20000 }),
    aperture: optionalNumber('camera.aperture', cam.aperture, 5.6, { min: 0.7, max: 128 }),
    sync: optionalNumber('camera.flashSyncSeconds', cam.flashSyncSeconds, 1 / 200, {
      min: 1 / 16000,
      max: 1,
    }),
    bias,
    biasFloor: readBiasFloor(cam, bias),
    suggestions: optionalNumber('suggestions', o.suggestions, 3, {
      min: 1,
      max: 10,
      integer: true,
    }),
    conditions: readSiteConditions('conditions', o.conditions),
  };
}

/** Run `fn`, re-throwing a LightingInputError with its field placed under `prefix`. */
export function prefixed<T>(prefix: string, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof LightingInputError && !e.field.startsWith(`${prefix}.`)) {
      const field = e.field === 'input' ? prefix : `${prefix}.${e.field}`;
      throw new LightingInputError(field, e.reason);
    }
    throw e;
  }
}
