import { MODIFIER_NAMES, type DuskSetupInput, type ModifierName } from '@lumenwright/shared';
import { z } from 'zod';
import { given, optionalDenominatorField, secondsFrom } from '../../hooks/use-calculation-form';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import type { SiteConditions } from '../playground-scene';
import { NOTHING_CARRIED, type CarriedInputs, type SavedPlace } from './saved-inputs';

// The Dusk setup form's values (checked by zod) and the request they become.

const maybe = z.union([z.number(), z.nan()]).optional();
const number = z.number({ error: 'Enter a number' });
export const setupSchema = z.object({
  aperture: maybe,
  isoMax: maybe,
  support: z.enum(['handheld', 'tripod']),
  syncDenominator: optionalDenominatorField,
  biasStops: maybe,
  biasFloorStops: maybe,
  kelvin: maybe,
  keyGuideNumber: number,
  guideNumberUnit: z.enum(['m', 'ft']),
  keyDistance: number,
  keyAngle: maybe,
  modifier: z.enum(MODIFIER_NAMES as [ModifierName, ...ModifierName[]]),
  keyModifierLossStops: maybe,
  keyModifierSize: maybe,
  rimEnabled: z.boolean(),
  rimGuideNumber: maybe,
  rimDistanceBehind: maybe,
  rimHeight: maybe,
  rimBeam: z.string(),
  rimModifierLossStops: maybe,
  rimOverKeyStops: maybe,
  rimGelled: z.boolean(),
  backgroundDistance: maybe,
  miredTolerance: maybe,
});
export type SetupForm = z.infer<typeof setupSchema>;

/** The form's label for each request field, so the API's complaints name the box. */
export const setupFieldLabels: Record<string, string> = {
  'camera.aperture': 'Aperture',
  'camera.isoMax': 'Highest ISO',
  'camera.flashSyncSeconds': 'Flash sync',
  'camera.biasStops': 'Background bias',
  'camera.biasFloorStops': 'Darkest bias',
  'camera.kelvin': 'Camera white balance',
  'key.guideNumber': 'Key guide number',
  'key.distance': 'Key distance',
  'key.angleFromCameraDeg': 'Key angle',
  'rim.guideNumber': 'Rim guide number',
  'rim.distanceBehind': 'Rim distance behind',
  'rim.lightHeight': 'Rim height',
  'rim.rimOverKeyStops': 'Rim over key',
  'key.modifierSize': 'Key modifier size',
  'key.modifierLossStops': 'Key modifier loss',
  'rim.modifierLossStops': 'Rim modifier loss',
  'rim.beamAngleDeg': 'Rim beam',
  backgroundDistance: 'Key to background',
  miredTolerance: 'Gels close enough',
  // Carried from a reopened saved setup (no field here).
  elevation: 'Elevation (saved)',
  flashKelvin: 'Flash colour temperature (saved)',
  gels: 'Gel list',
  maxGels: 'Most gels in a stack (saved)',
  targetMiredOffset: 'Skin warmth offset (saved)',
  stepMinutes: 'Minutes between points (saved)',
  suggestions: 'Number of suggested minutes (saved)',
  'camera.isoMin': 'Lowest ISO (saved)',
  'camera.slowestHandheldSeconds': 'Slowest hand-held shutter (saved)',
  'camera.tint': 'Camera tint (saved)',
};

/** Drop keys whose value is undefined, so the request (and the copied snippet) stays short. */
function compact<T extends object>(value: T): T {
  return Object.fromEntries(Object.entries(value).filter(([, v]) => v !== undefined)) as T;
}

export function toSetupInput(
  form: SetupForm,
  unit: DisplayUnit,
  moment: SavedPlace | null,
  conditions: SiteConditions,
  carried: CarriedInputs = NOTHING_CARRIED,
  /** The gels to choose from, when a gel kit was picked (else the saved or built-in ones). */
  gels?: DuskSetupInput['gels'],
): DuskSetupInput | undefined {
  if (!moment) return undefined;
  const input: DuskSetupInput = {
    ...carried.top,
    latitude: moment.latitude,
    longitude: moment.longitude,
    date: moment.date,
    timeZone: moment.timeZone,
    sky: moment.sky,
    camera: compact({
      ...carried.camera,
      aperture: given(form.aperture),
      isoMax: given(form.isoMax),
      support: form.support,
      flashSyncSeconds: secondsFrom(form.syncDenominator),
      biasStops: given(form.biasStops),
      biasFloorStops: given(form.biasFloorStops),
      kelvin: given(form.kelvin),
    }),
    key: compact({
      ...carried.key,
      guideNumber: form.keyGuideNumber,
      guideNumberUnit: form.guideNumberUnit,
      distance: form.keyDistance,
      distanceUnit: unit,
      angleFromCameraDeg: given(form.keyAngle),
      modifier: form.modifier,
      modifierSize: given(form.keyModifierSize),
      modifierLossStops: given(form.keyModifierLossStops),
    }),
    conditions: compact({ ...conditions }),
  };
  if (form.rimEnabled) {
    input.rim = compact({
      ...carried.rim,
      guideNumber: given(form.rimGuideNumber) ?? Number.NaN,
      guideNumberUnit: form.guideNumberUnit,
      distanceBehind: given(form.rimDistanceBehind) ?? Number.NaN,
      lightHeight: given(form.rimHeight) ?? Number.NaN,
      distanceUnit: unit,
      beamAngleDeg: Number(form.rimBeam),
      rimOverKeyStops: given(form.rimOverKeyStops),
      gelled: form.rimGelled,
      modifierLossStops: given(form.rimModifierLossStops),
    });
  }
  if (gels) input.gels = gels;
  if (given(form.backgroundDistance) !== undefined)
    input.backgroundDistance = form.backgroundDistance;
  const tolerance = given(form.miredTolerance);
  if (tolerance !== undefined && tolerance !== 0) input.miredTolerance = tolerance;
  return input;
}

/**
 * A usable evening out of the box: on a tripod at f/4 the shutter can wait at 1/15 s while the
 * sky darkens, and a 40 m key through a softbox at 3 m stays within its power range.
 */
export const SETUP_DEFAULTS: SetupForm = {
  aperture: 4,
  isoMax: 6400,
  support: 'tripod',
  syncDenominator: 200,
  biasStops: -1,
  // Empty: the bias stays fixed, as before the floor existed.
  biasFloorStops: Number.NaN,
  kelvin: 3800,
  keyGuideNumber: 40,
  guideNumberUnit: 'm',
  keyDistance: 3,
  keyAngle: 60,
  modifier: 'softbox',
  keyModifierLossStops: Number.NaN,
  keyModifierSize: Number.NaN,
  rimEnabled: true,
  rimGuideNumber: 40,
  rimDistanceBehind: 2.5,
  rimHeight: 1.2,
  rimBeam: '30',
  rimOverKeyStops: 1,
  rimGelled: true,
  rimModifierLossStops: Number.NaN,
  backgroundDistance: 12,
  // As on the Balance tab: up to 10 mired off for a shorter gel stack.
  miredTolerance: 10,
};

/** Fields holding lengths in the display unit (converted when the unit is switched). */
export const SETUP_LENGTH_FIELDS = [
  'keyDistance',
  'keyModifierSize',
  'rimDistanceBehind',
  'rimHeight',
  'backgroundDistance',
] as const;
