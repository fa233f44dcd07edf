import {
  BARE_BEAM_DEG,
  MODIFIER_NAMES,
  fromMetres,
  toMetres,
  type ModifierName,
} from '@lumenwright/shared';
import type { SavedSetupInputs } from '../../api/saved-setups';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import type { SiteConditions } from '../playground-scene';
import type { SetupForm } from './setup-form';

/** The place and date a saved setup was planned for (the form's inputs take these from the scene). */
export interface SavedPlace {
  latitude: number;
  longitude: number;
  date: string;
  timeZone: string;
  sky: 'clear' | 'partly-cloudy' | 'overcast';
}

/**
 * Saved values with no field in the Dusk setup form, with what the notice calls them. A reopened
 * setup carries them into its plan unchanged, so the preview matches the saved plan and its sheet.
 */
const CARRIED = {
  elevation: 'elevation',
  flashKelvin: 'flash colour temperature',
  gels: 'gel list',
  maxGels: 'most gels in a stack',
  targetMiredOffset: 'skin warmth offset',
  stepMinutes: 'minutes between points',
  suggestions: 'number of suggested minutes',
  'camera.isoMin': 'lowest ISO',
  'camera.slowestHandheldSeconds': 'slowest hand-held shutter',
  'camera.tint': 'camera tint',
} as const;
export type CarriedPath = keyof typeof CARRIED;

/** Saved values the form cannot show, by part of the input; applied under the form's values. */
export interface CarriedInputs {
  top: Record<string, unknown>;
  camera: Record<string, unknown>;
  key: Record<string, unknown>;
  rim: Record<string, unknown>;
  /** What the notice lists, e.g. "lowest ISO 200". */
  described: string[];
}

export const NOTHING_CARRIED: CarriedInputs = {
  top: {},
  camera: {},
  key: {},
  rim: {},
  described: [],
};

function describeValue(path: CarriedPath, value: unknown): string {
  const label = CARRIED[path];
  if (Array.isArray(value))
    return `${label} (${value.length} ${value.length === 1 ? 'piece' : 'pieces'})`;
  if (
    path === 'camera.slowestHandheldSeconds' &&
    typeof value === 'number' &&
    value > 0 &&
    value < 1
  )
    return `${label} 1/${Math.round(1 / value)} s`;
  return `${label} ${String(value)}`;
}

/**
 * The saved values `toSetupInput` should carry, read from a saved setup's (resolved) inputs;
 * `skip` leaves some out (the gels, when the gel kit they came from is picked again).
 */
export function carriedInputs(
  inputs: SavedSetupInputs,
  skip: readonly CarriedPath[] = [],
): CarriedInputs {
  const record = inputs as unknown as Record<string, unknown>;
  const out: CarriedInputs = {
    top: {},
    camera: {},
    key: {},
    rim: {},
    described: [],
  };
  for (const path of Object.keys(CARRIED) as CarriedPath[]) {
    if (skip.includes(path)) continue;
    const [head, tail] = path.split('.') as [string, string | undefined];
    const part = tail ? (record[head] as Record<string, unknown> | undefined) : record;
    const value = part?.[tail ?? head];
    if (value === undefined || value === null) continue;
    const bucket = tail
      ? (out[head as 'camera' | 'key' | 'rim'] as Record<string, unknown>)
      : out.top;
    bucket[tail ?? head] = value;
    out.described.push(describeValue(path, value));
  }
  return out;
}

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

/**
 * The saved beam as it was planned: the beam select offers any angle, so none is rounded. A rim
 * saved without one was planned bare (the library's default), so it reopens bare.
 */
function savedBeam(deg: number | undefined): string {
  return String(deg ?? BARE_BEAM_DEG);
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
    biasFloorStops: optional(camera.biasFloorStops),
    kelvin: optional(camera.kelvin),
    keyGuideNumber: optional(key.guideNumber),
    guideNumberUnit: gnUnit,
    keyDistance: lengthIn(key.distance, keyUnit, unit),
    keyAngle: optional(key.angleFromCameraDeg),
    modifier: isModifier(key.modifier) ? key.modifier : 'softbox',
    keyModifierLossStops: optional(key.modifierLossStops),
    keyModifierSize: lengthIn(key.modifierSize, keyUnit, unit),
    rimEnabled: rim !== undefined,
    rimGuideNumber: rimGn,
    rimDistanceBehind: lengthIn(rim?.distanceBehind, rimUnit, unit),
    rimHeight: lengthIn(rim?.lightHeight, rimUnit, unit),
    rimBeam: savedBeam(rim?.beamAngleDeg),
    rimOverKeyStops: optional(rim?.rimOverKeyStops),
    rimGelled: rim?.gelled ?? true,
    rimModifierLossStops: optional(rim?.modifierLossStops),
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
