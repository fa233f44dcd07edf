import { MODIFIER_NAMES, fromMetres, toMetres, type ModifierName } from '@lumenwright/shared';
import type { SavedSetupInputs } from '../../api/saved-setups';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import type { SiteConditions } from '../playground-scene';
import type { SetupForm } from './setup-panel';

/** The place and date a saved setup was planned for (the form's inputs take these from the scene). */
export interface SavedPlace {
  latitude: number;
  longitude: number;
  date: string;
  timeZone: string;
  sky: 'clear' | 'partly-cloudy' | 'overcast';
}

/** The rim beam choices the form offers, in degrees. */
export const RIM_BEAMS = [100, 40, 30, 20, 10] as const;

/** Saved inputs that have no field in the Dusk setup form: reopened without them. */
const UNSUPPORTED = [
  'elevation',
  'flashKelvin',
  'gelKitId',
  'gels',
  'maxGels',
  'targetMiredOffset',
  'stepMinutes',
  'camera.isoMin',
  'camera.slowestHandheldSeconds',
  'camera.tint',
  'key.modifierSize',
  'key.modifierLossStops',
  'key.lightId',
  'key.modifierId',
  'rim.modifierLossStops',
  'rim.lightId',
  'rim.modifierId',
] as const;

/** A length in `from` as the display unit shows it (2 decimals when converted, as the unit toggle does). */
function lengthIn(value: number | undefined, from: DisplayUnit, to: DisplayUnit): number {
  if (value === undefined) return Number.NaN;
  if (from === to) return value;
  return Number(fromMetres(toMetres(value, from), to).toFixed(2));
}

/** An optional number: absent becomes NaN, which the form reads as "not given" (server default). */
function optional(value: number | undefined): number {
  return value ?? Number.NaN;
}

function nearestBeam(deg: number | undefined): string {
  if (deg === undefined) return '30';
  let best: number = RIM_BEAMS[0];
  for (const beam of RIM_BEAMS) if (Math.abs(beam - deg) < Math.abs(best - deg)) best = beam;
  return String(best);
}

function isModifier(value: string | undefined): value is ModifierName {
  return value !== undefined && (MODIFIER_NAMES as string[]).includes(value);
}

/**
 * The inverse of `toSetupInput`: saved inputs to the Dusk setup form's values, with lengths in the
 * display unit. Guide numbers keep the key's unit (the form has one unit for both lights); a rim
 * guide number saved in the other unit is converted (a guide number is a distance x f-number).
 */
export function fromSetupInput(inputs: SavedSetupInputs, unit: DisplayUnit): SetupForm {
  const camera = inputs.camera ?? {};
  const key = inputs.key;
  const keyUnit: DisplayUnit = key.distanceUnit ?? 'm';
  const gnUnit: DisplayUnit = key.guideNumberUnit ?? 'm';
  const rim = inputs.rim;
  const rimUnit: DisplayUnit = rim?.distanceUnit ?? 'm';
  const rimGn =
    rim?.guideNumber === undefined
      ? Number.NaN
      : lengthIn(rim.guideNumber, rim.guideNumberUnit ?? 'm', gnUnit);
  const sync = camera.flashSyncSeconds;
  return {
    aperture: optional(camera.aperture),
    isoMax: optional(camera.isoMax),
    support: camera.support ?? 'handheld',
    // 1/200 s is stored as 0.005; show the denominator, rounded off float noise.
    syncDenominator: sync ? Number((1 / sync).toFixed(2)) : Number.NaN,
    biasStops: optional(camera.biasStops),
    kelvin: optional(camera.kelvin),
    keyGuideNumber: optional(key.guideNumber),
    guideNumberUnit: gnUnit,
    keyDistance: lengthIn(key.distance, keyUnit, unit),
    keyAngle: optional(key.angleFromCameraDeg),
    modifier: isModifier(key.modifier) ? key.modifier : 'softbox',
    rimEnabled: rim !== undefined,
    rimGuideNumber: rimGn,
    rimDistanceBehind: lengthIn(rim?.distanceBehind, rimUnit, unit),
    rimHeight: lengthIn(rim?.lightHeight, rimUnit, unit),
    rimBeam: nearestBeam(rim?.beamAngleDeg),
    rimOverKeyStops: optional(rim?.rimOverKeyStops),
    rimGelled: rim?.gelled ?? true,
    backgroundDistance: lengthIn(inputs.backgroundDistance, keyUnit, unit),
    // Saved without one, the plan was made with the closest stack.
    miredTolerance: inputs.miredTolerance ?? 0,
  };
}

export function savedPlace(inputs: SavedSetupInputs): SavedPlace {
  return {
    latitude: inputs.latitude,
    longitude: inputs.longitude,
    date: inputs.date,
    timeZone: inputs.timeZone,
    sky: inputs.sky ?? 'clear',
  };
}

export function savedConditions(inputs: SavedSetupInputs): SiteConditions {
  const c = inputs.conditions ?? {};
  return {
    ...(c.windKmh !== undefined ? { windKmh: c.windKmh } : {}),
    nearRoad: c.nearRoad ?? false,
    nearWater: c.nearWater ?? false,
    coldFogOrHaze: c.coldFogOrHaze ?? false,
    modellingLamps: c.modellingLamps ?? false,
  };
}

/** Names of saved values the form cannot show, e.g. `gels`, `key.modifierLossStops`. */
export function unsupportedInputs(inputs: SavedSetupInputs): string[] {
  const record = inputs as unknown as Record<string, Record<string, unknown> | undefined>;
  return UNSUPPORTED.filter((path) => {
    const [head, tail] = path.split('.') as [string, string | undefined];
    const value = tail ? record[head]?.[tail] : record[head];
    return value !== undefined && value !== null;
  });
}
