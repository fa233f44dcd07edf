import { planDuskSetup, type DuskSetupInput, type DuskSetupPlan } from '@lumenwright/shared';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { useSession, type Role } from '@/lib/session';
import type { OpenedSetup } from '../../api/saved-setups';
import { useCalculationForm } from '../../hooks/use-calculation-form';
import { fixed } from '../../utils/format';
import { CalculationResult } from '../calculation-result';
import { usePlaygroundScene } from '../playground-scene';
import { kitGels, withGearIds, type PickedGear } from './gear-links';
import { describeSetup, OpenedSetupNotice } from './opened-setup-notice';
import { SaveSetupDialog } from './save-setup-dialog';
import { pickedIds, savedGearIds } from './restore-gear';
import { NOTHING_CARRIED, type CarriedInputs } from './saved-inputs';
import { CameraFieldset, KeyFieldset, RimFieldset } from './setup-fieldsets';
import {
  SETUP_DEFAULTS,
  SETUP_LENGTH_FIELDS,
  setupFieldLabels,
  setupSchema,
  toSetupInput,
  type SetupForm,
} from './setup-form';
import { SetupResultView } from './setup-result';
import { useCurrentGear } from './use-current-gear';
import { useOpenedSetup } from './use-opened-setup';
import { useReopenForm } from './use-reopen-form';

/** Roles that may save setups (the server checks `setups:manage` too). */
const SAVERS: readonly Role[] = ['owner', 'admin', 'photographer'];

export function SetupPanel() {
  const { moment, conditions, setConditions, requestPlace } = usePlaygroundScene();
  const { setupId, opened, openedInputs, place, fromSaved } = useOpenedSetup(moment);
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
    schema: setupSchema,
    defaults: SETUP_DEFAULTS,
    lengthFields: SETUP_LENGTH_FIELDS,
    toInput: (values, displayUnit) =>
      toSetupInput(values, displayUnit, place, conditions, carried, kitGelList),
    compute: planDuskSetup,
  });

  const restored = useReopenForm({
    setup: opened.data,
    resolved: openedInputs,
    unit,
    form,
    setConditions,
    requestPlace,
    setCarried,
    setPicked,
  });
  // Saving names gear by id only while the boxes hold its values as the studio's gear has them now.
  const { current, checkBeforeSave } = useCurrentGear(picked);
  const toSave = input ? withGearIds(input, current) : undefined;
  // The pickers show the gear saving would name by id: picked, and its values still in the boxes.
  const linked = toSave ? savedGearIds(toSave) : pickedIds(current);
  const fields = { form, numberField, unit, picked, linked, onPicked: pick };

  return (
    <div className="flex flex-col gap-4">
      <OpenedSetupNotice
        setupId={setupId}
        opened={opened}
        carried={carried}
        onDropCarried={() => setCarried(NOTHING_CARRIED)}
        restored={restored}
      />
      {saved ? (
        <Notice tone="ok">
          Saved setup {describeSetup(saved)}.{' '}
          <Link to={paths.setups} className="font-medium text-accent underline">
            See it in Setups
          </Link>
        </Notice>
      ) : null}
      <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
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
          <CameraFieldset {...fields} />
          <KeyFieldset {...fields} />
          <RimFieldset {...fields} />
        </form>
        <CalculationResult calculation="setup" preview={preview} fieldLabels={setupFieldLabels}>
          {(plan, input) => <SetupResultView plan={plan} input={input} />}
        </CalculationResult>
      </div>
      {maySave && input && toSave ? (
        <SaveSetupDialog
          open={saving}
          onClose={() => setSaving(false)}
          input={toSave}
          checkBeforeSave={() => checkBeforeSave(input)}
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
