import {
  MODIFIERS,
  MODIFIER_NAMES,
  planDuskSetup,
  type DuskSetupInput,
  type DuskSetupPlan,
  type ModifierName,
} from '@lumenwright/shared';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { paths } from '@/config/paths';
import { ApiProblem } from '@/lib/api';
import { problemMessage } from '@/lib/form-errors';
import { useSession, type Role } from '@/lib/session';
import { useSavedSetup, type OpenedSetup } from '../../api/saved-setups';
import {
  given,
  optionalDenominatorField,
  secondsFrom,
  useCalculationForm,
} from '../../hooks/use-calculation-form';
import type { DisplayUnit } from '../../hooks/use-length-unit';
import { fixed } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { FormGrid } from '../form-grid';
import { modifierOptions } from '../flash/flash-panel';
import { usePlaygroundScene, type SiteConditions } from '../playground-scene';
import { kitGels, lengthTo, withGearIds, type PickedGear } from './gear-links';
import { SaveSetupDialog } from './save-setup-dialog';
import {
  carriedInputs,
  fromSetupInput,
  linkedGear,
  NOTHING_CARRIED,
  savedConditions,
  savedPlace,
  type CarriedInputs,
  type SavedPlace,
} from './saved-inputs';
import {
  GelKitPicker,
  KeyLightPicker,
  KeyModifierPicker,
  RimLightPicker,
  RimModifierPicker,
} from './setup-gear';
import { SetupResultView } from './setup-result';

const maybe = z.union([z.number(), z.nan()]).optional();
const number = z.number({ error: 'Enter a number' });
const schema = z.object({
  aperture: maybe,
  isoMax: maybe,
  support: z.enum(['handheld', 'tripod']),
  syncDenominator: optionalDenominatorField,
  biasStops: maybe,
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
export type SetupForm = z.infer<typeof schema>;

const labels: Record<string, string> = {
  'camera.aperture': 'Aperture',
  'camera.isoMax': 'Highest ISO',
  'camera.flashSyncSeconds': 'Flash sync',
  'camera.biasStops': 'Background bias',
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

const BEAMS = [
  { value: '100', label: 'Bare' },
  { value: '40', label: '40° grid' },
  { value: '30', label: '30° grid' },
  { value: '20', label: '20° grid' },
  { value: '10', label: '10° grid' },
];

/** The usual beams, plus a modifier's own beam angle when one from the gear set another. */
function beamOptions(current: string) {
  return BEAMS.some((b) => b.value === current)
    ? BEAMS
    : [...BEAMS, { value: current, label: `${current}°` }];
}

/** Roles that may save setups (the server checks `setups:manage` too). */
const SAVERS: readonly Role[] = ['owner', 'admin', 'photographer'];

function openFailure(error: unknown): string {
  if (error instanceof ApiProblem && error.status === 404)
    return 'That saved setup was not found: it may have been deleted, or it belongs to another organisation.';
  if (error instanceof ApiProblem && error.status === 403)
    return 'Your role may not open saved setups. Ask an owner or admin.';
  return `The saved setup could not be opened. ${problemMessage(error)}`;
}

function samePlace(a: SavedPlace, b: SavedPlace): boolean {
  return (
    Math.abs(a.latitude - b.latitude) < 1e-9 &&
    Math.abs(a.longitude - b.longitude) < 1e-9 &&
    a.date === b.date &&
    a.timeZone === b.timeZone &&
    a.sky === b.sky
  );
}

function describe(setup: Pick<OpenedSetup, 'name' | 'venue' | 'date'>): string {
  return `${setup.name} (${setup.venue ? `${setup.venue}, ` : ''}${setup.date})`;
}

export function SetupPanel() {
  const { moment, conditions, setConditions, requestPlace } = usePlaygroundScene();
  const [params] = useSearchParams();
  const setupId = params.get('setup');
  const opened = useSavedSetup(setupId);
  const openedInputs = opened.data ? (opened.data.resolvedInputs ?? opened.data.inputs) : undefined;
  const savedAt = useMemo(() => (openedInputs ? savedPlace(openedInputs) : null), [openedInputs]);
  // A reopened setup sends its place and date to the Twilight tab, so every tab shows the same
  // evening. Until the Twilight tab has taken it, the saved place is used here; after that the
  // scene's (a later change on the Twilight tab then moves this plan too).
  const [syncedFor, setSyncedFor] = useState<string | null>(null);
  const synced = !!opened.data && syncedFor === opened.data.id;
  if (opened.data && savedAt && moment && !synced && samePlace(moment, savedAt))
    setSyncedFor(opened.data.id); // state adjusted while rendering, React's pattern for this
  const place: SavedPlace | null = savedAt && !synced ? savedAt : moment;
  const [carried, setCarried] = useState<CarriedInputs>(NOTHING_CARRIED);
  const role = useSession()?.role;
  const maySave = role !== undefined && SAVERS.includes(role);
  const [saving, setSaving] = useState(false);
  const [saved, setSaved] = useState<OpenedSetup | null>(null);
  const [picked, setPicked] = useState<PickedGear>({});
  const pick = (more: PickedGear) => setPicked((was) => ({ ...was, ...more }));
  const kitGelList = useMemo(() => (picked.gelKit ? kitGels(picked.gelKit) : undefined), [picked]);

  const { form, unit, input, preview, numberField } = useCalculationForm<
    SetupForm,
    DuskSetupInput,
    DuskSetupPlan
  >({
    schema,
    // A usable evening out of the box: on a tripod at f/4 the shutter can wait at 1/15 s while the
    // sky darkens, and a 40 m key through a softbox at 3 m stays within its power range.
    defaults: {
      aperture: 4,
      isoMax: 6400,
      support: 'tripod',
      syncDenominator: 200,
      biasStops: -1,
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
    },
    lengthFields: [
      'keyDistance',
      'keyModifierSize',
      'rimDistanceBehind',
      'rimHeight',
      'backgroundDistance',
    ],
    toInput: (values, displayUnit) =>
      toSetupInput(values, displayUnit, place, conditions, carried, kitGelList),
    compute: planDuskSetup,
  });
  const rimEnabled = form.watch('rimEnabled');
  const modifier = form.watch('modifier');
  const rimBeam = form.watch('rimBeam');

  // Fill the form once per reopened setup (not again on refetch, so edits survive).
  const filledFrom = useRef<string | null>(null);
  useEffect(() => {
    if (!opened.data || !openedInputs || filledFrom.current === opened.data.id) return;
    filledFrom.current = opened.data.id;
    form.reset(fromSetupInput(openedInputs, unit));
    setConditions(savedConditions(openedInputs));
    setCarried(carriedInputs(openedInputs));
    setPicked({});
    requestPlace(savedPlace(openedInputs));
  }, [opened.data, openedInputs, unit, form, setConditions, requestPlace]);
  const links = openedInputs ? linkedGear(openedInputs) : [];

  const fromSaved = !!savedAt && (!synced || (!!moment && samePlace(moment, savedAt)));
  const setupsLink = (
    <Link to={paths.setups} className="font-medium text-accent underline">
      Back to setups
    </Link>
  );

  return (
    <div className="flex flex-col gap-4">
      {setupId && opened.isPending ? <Notice>Opening the saved setup…</Notice> : null}
      {setupId && opened.isError ? (
        <Notice tone="fault">
          {openFailure(opened.error)} {setupsLink}
        </Notice>
      ) : null}
      {opened.data ? (
        <Notice tone="ok">
          Opened saved setup {describe(opened.data)}. {setupsLink}
          {carried.described.length ? (
            <span className="mt-1 block text-ink-muted">
              Also planned with these saved values, which have no field here:{' '}
              {carried.described.join('; ')}.{' '}
              <Button
                variant="quiet"
                className="px-0 py-0"
                onClick={() => setCarried(NOTHING_CARRIED)}
              >
                Plan without them
              </Button>
            </span>
          ) : null}
          {links.length ? (
            <span className="mt-1 block text-ink-muted">
              This setup was saved with links to studio gear; it reopens with the values it was
              planned with, not the links.
            </span>
          ) : null}
        </Notice>
      ) : null}
      {saved ? (
        <Notice tone="ok">
          Saved setup {describe(saved)}.{' '}
          <Link to={paths.setups} className="font-medium text-accent underline">
            See it in Setups
          </Link>
        </Notice>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-[minmax(16rem,22rem)_1fr]">
        <form
          noValidate
          onSubmit={(event) => event.preventDefault()}
          className="flex flex-col gap-4"
        >
          <div className="rounded-card border border-edge bg-panel p-4 text-small text-ink-muted">
            {place
              ? `Place and date from ${fromSaved ? 'the saved setup' : 'the Twilight tab'}: ${fixed(place.latitude, 3)}°, ${fixed(place.longitude, 3)}° on ${place.date} (${place.timeZone}), sky ${place.sky}. Site conditions above set the cautions.`
              : 'Set the place and date on the Twilight tab first.'}
          </div>
          {maySave ? (
            <div className="flex items-center gap-3">
              <Button
                variant="secondary"
                disabled={!input}
                onClick={() => {
                  setSaved(null);
                  setSaving(true);
                }}
              >
                Save setup
              </Button>
              {!input ? (
                <span className="text-small text-ink-muted">Complete the inputs to save.</span>
              ) : null}
            </div>
          ) : null}
          <FormGrid legend="Camera">
            <TextField
              label="Aperture (f/)"
              {...numberField('aperture', 'camera.aperture', 'default 5.6')}
            />
            <TextField
              label="Highest ISO"
              {...numberField('isoMax', 'camera.isoMax', 'default 6400')}
            />
            <SelectField
              label="Support"
              options={[
                { value: 'handheld', label: 'Hand-held' },
                { value: 'tripod', label: 'Tripod' },
              ]}
              {...form.register('support')}
            />
            <TextField
              label="Flash sync (1/x s)"
              {...numberField('syncDenominator', 'camera.flashSyncSeconds', 'default 200')}
            />
            <TextField
              label="Background bias (stops)"
              {...numberField('biasStops', 'camera.biasStops', 'default −1')}
            />
            <TextField
              label="White balance (K)"
              {...numberField('kelvin', 'camera.kelvin', 'default 3800')}
            />
            <TextField
              label="Gels close enough (mired)"
              hint="Fewer gels when within this; 0 = closest"
              {...numberField('miredTolerance', undefined, 'default 0')}
            />
            <GelKitPicker picked={picked.gelKit} onPicked={pick} />
          </FormGrid>
          <FormGrid legend="Key light">
            <KeyLightPicker form={form} onPicked={pick} />
            <TextField label="Guide number" {...numberField('keyGuideNumber', 'key.guideNumber')} />
            <SelectField
              label="Guide numbers in"
              options={[
                { value: 'm', label: 'metres' },
                { value: 'ft', label: 'feet' },
              ]}
              {...form.register('guideNumberUnit')}
            />
            <TextField
              label={`Distance (${unit})`}
              {...numberField('keyDistance', 'key.distance')}
            />
            <TextField
              label="Angle from camera (°)"
              {...numberField('keyAngle', 'key.angleFromCameraDeg', 'default 60')}
            />
            <KeyModifierPicker form={form} onPicked={pick} unit={unit} />
            <SelectField
              label="Modifier"
              className="col-span-2"
              options={modifierOptions}
              {...form.register('modifier', {
                // A loss or size belongs to the modifier it was given for: another one drops them.
                onChange: () => {
                  form.setValue('keyModifierLossStops', Number.NaN, { shouldValidate: true });
                  form.setValue('keyModifierSize', Number.NaN, { shouldValidate: true });
                },
              })}
            />
            <TextField
              label="Modifier loss (stops)"
              hint="Empty: the modifier's usual"
              {...numberField(
                'keyModifierLossStops',
                'key.modifierLossStops',
                `default ${MODIFIERS[modifier].lossStops}`,
              )}
            />
            <TextField
              label={`Modifier size (${unit})`}
              hint="Empty: the modifier's usual"
              {...numberField(
                'keyModifierSize',
                'key.modifierSize',
                `default ${lengthTo(MODIFIERS[modifier].sizeM, 'm', unit)}`,
              )}
            />
            <TextField
              label={`Key to background (${unit})`}
              hint="Optional"
              className="col-span-2"
              {...numberField('backgroundDistance', undefined, 'not set')}
            />
          </FormGrid>
          <FormGrid legend="Rim light">
            <label className="col-span-2 flex items-center gap-2 text-small font-medium">
              <input
                type="checkbox"
                className="size-4 accent-(--color-accent)"
                {...form.register('rimEnabled')}
              />
              Use a rim light behind the subject
            </label>
            {rimEnabled ? (
              <>
                <RimLightPicker form={form} onPicked={pick} />
                <TextField
                  label="Guide number"
                  {...numberField('rimGuideNumber', 'rim.guideNumber')}
                />
                <TextField
                  label={`Behind subject (${unit})`}
                  {...numberField('rimDistanceBehind', 'rim.distanceBehind')}
                />
                <TextField
                  label={`Height (${unit})`}
                  {...numberField('rimHeight', 'rim.lightHeight')}
                />
                <RimModifierPicker form={form} onPicked={pick} />
                <SelectField
                  label="Beam"
                  options={beamOptions(rimBeam)}
                  {...form.register('rimBeam')}
                  // Controlled: a beam from the gear is set before its option exists.
                  value={rimBeam}
                />
                <TextField
                  label="Modifier loss (stops)"
                  {...numberField('rimModifierLossStops', 'rim.modifierLossStops', 'default 0')}
                />
                <TextField
                  label="Rim over key (stops)"
                  {...numberField('rimOverKeyStops', 'rim.rimOverKeyStops', 'default 1')}
                />
                <label className="flex items-center gap-2 self-end pb-2 text-small">
                  <input
                    type="checkbox"
                    className="size-4 accent-(--color-accent)"
                    {...form.register('rimGelled')}
                  />
                  Gel like the key
                </label>
              </>
            ) : null}
          </FormGrid>
        </form>
        <CalculationResult calculation="setup" preview={preview} fieldLabels={labels}>
          {(plan, input) => <SetupResultView plan={plan} input={input} />}
        </CalculationResult>
      </div>
      {maySave && input ? (
        <SaveSetupDialog
          open={saving}
          onClose={() => setSaving(false)}
          input={withGearIds(input, picked)}
          initial={
            opened.data
              ? {
                  venue: opened.data.venue ?? '',
                  notes: opened.data.notes ?? '',
                }
              : undefined
          }
          onSaved={(setup) => {
            setSaving(false);
            setSaved(setup);
          }}
        />
      ) : null}
    </div>
  );
}
