import { zodResolver } from '@hookform/resolvers/zod';
import {
  computeTwilight,
  toMetres,
  type TwilightInput,
  type TwilightResult,
} from '@lumenwright/shared';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { useLengthUnit } from '../../hooks/use-length-unit';
import { usePreview } from '../../hooks/use-preview';
import { todayIso, knownTimeZones } from '../../utils/dates';
import { CalculationResult } from '../calculation-result';
import { FormGrid } from '../form-grid';
import { usePlaygroundScene } from '../playground-scene';
import { TwilightResultView } from './twilight-result';

const number = z.number({ error: 'Enter a number' });
const twilightForm = z.object({
  latitude: number,
  longitude: number,
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick a date'),
  timeZone: z.string().min(1, 'Enter a time zone such as Europe/Zurich'),
  sky: z.enum(['clear', 'partly-cloudy', 'overcast']),
  elevation: number,
  goldenHour: z.object({ upperDeg: number, lowerDeg: number }),
  blueHour: z.object({ upperDeg: number, lowerDeg: number }),
});
type TwilightForm = z.infer<typeof twilightForm>;

export const twilightFieldLabels: Record<string, string> = {
  latitude: 'Latitude',
  longitude: 'Longitude',
  date: 'Date',
  timeZone: 'Time zone',
  elevation: 'Height above the horizon',
  sky: 'Sky',
  'goldenHour.upperDeg': 'Golden hour starts at',
  'goldenHour.lowerDeg': 'Golden hour ends at',
  'blueHour.upperDeg': 'Blue hour starts at',
  'blueHour.lowerDeg': 'Blue hour ends at',
};

/** Demo scenario: an invented lakeside terrace; coordinates are round numbers. */
function demoValues(): TwilightForm {
  return {
    latitude: 47,
    longitude: 8,
    date: todayIso(),
    timeZone: 'Europe/Zurich',
    sky: 'clear',
    elevation: 0,
    goldenHour: { upperDeg: 6, lowerDeg: -4 },
    blueHour: { upperDeg: -4, lowerDeg: -8 },
  };
}

/** Form values -> the shared function's input; bands only when they differ from the defaults. */
export function toTwilightInput(form: TwilightForm, unit: 'm' | 'ft'): TwilightInput {
  const input: TwilightInput = {
    latitude: form.latitude,
    longitude: form.longitude,
    date: form.date,
    timeZone: form.timeZone,
    sky: form.sky,
  };
  if (form.elevation) input.elevation = toMetres(form.elevation, unit);
  if (form.goldenHour.upperDeg !== 6 || form.goldenHour.lowerDeg !== -4)
    input.goldenHour = form.goldenHour;
  if (form.blueHour.upperDeg !== -4 || form.blueHour.lowerDeg !== -8)
    input.blueHour = form.blueHour;
  return input;
}

/** Start at blue hour (else sunset): the minute most dusk portraits aim for. */
function defaultMinute(result: TwilightResult | null): number {
  const points = result?.ambient.points ?? [];
  const target = result?.blueHour.start ?? result?.sunset;
  if (!target) return 0;
  const epoch = Date.parse(target);
  let best = 0;
  points.forEach((point, i) => {
    const distance = Math.abs(Date.parse(point.time) - epoch);
    if (distance < Math.abs(Date.parse(points[best]?.time ?? '') - epoch)) best = i;
  });
  return best;
}

export function TwilightPanel({ initial }: { initial?: Partial<TwilightForm> }) {
  const [unit] = useLengthUnit();
  const zones = useMemo(() => knownTimeZones(), []);
  const {
    register,
    control,
    getValues,
    reset,
    formState: { errors },
  } = useForm<TwilightForm>({
    resolver: zodResolver(twilightForm),
    mode: 'onChange',
    defaultValues: { ...demoValues(), ...initial },
  });
  const values = useWatch({ control });
  const parsed = twilightForm.safeParse(values);
  const input = parsed.success ? toTwilightInput(parsed.data, unit) : undefined;
  const preview = usePreview(computeTwilight, input);
  const sharedError = preview.state === 'invalid' ? preview : null;
  const errorFor = (field: string, own?: string) =>
    own ?? (sharedError?.field === field ? sharedError.reason : undefined);

  const [selectedIndex, setSelectedIndex] = useState<number | null>(null);
  const { setMoment, cautionsFor, placeRequest } = usePlaygroundScene();

  // Another tab (a reopened saved setup) asks for its place and date: show that evening here.
  const appliedRequest = useRef(0);
  useEffect(() => {
    if (!placeRequest || placeRequest.seq === appliedRequest.current) return;
    appliedRequest.current = placeRequest.seq;
    const { latitude, longitude, date, timeZone, sky } = placeRequest;
    reset({ ...getValues(), latitude, longitude, date, timeZone, sky });
    setSelectedIndex(null);
  }, [placeRequest, getValues, reset]);
  const result = preview.state === 'ok' ? preview.result : null;
  const defaultIndex = useMemo(() => defaultMinute(result), [result]);
  const points = result?.ambient.points ?? [];
  const index = Math.min(selectedIndex ?? defaultIndex, Math.max(0, points.length - 1));
  const chosen = points[index];

  useEffect(() => {
    if (!result || !chosen || !input) return;
    setMoment({
      latitude: input.latitude,
      longitude: input.longitude,
      timeZone: input.timeZone,
      date: input.date,
      sky: input.sky ?? 'clear',
      time: chosen.time,
      ev100: chosen.ev100,
      sunAltitudeDeg: chosen.sunAltitudeDeg,
      sunsetAzimuthDeg: result.sunsetAzimuthDeg,
    });
    // Publish when anything published changes (not on every render): a new time zone or sky can
    // leave the chosen instant and the sunset azimuth as they were.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [
    input?.latitude,
    input?.longitude,
    input?.timeZone,
    input?.date,
    input?.sky,
    chosen?.time,
    chosen?.ev100,
    chosen?.sunAltitudeDeg,
    result?.sunsetAzimuthDeg,
    setMoment,
  ]);

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(16rem,22rem)_1fr]">
      <form noValidate onSubmit={(event) => event.preventDefault()} className="flex flex-col gap-4">
        <FormGrid legend="Place and date">
          <TextField
            label="Latitude (°N)"
            type="number"
            step="any"
            inputMode="decimal"
            error={errorFor('latitude', errors.latitude?.message)}
            {...register('latitude', { valueAsNumber: true })}
          />
          <TextField
            label="Longitude (°E)"
            type="number"
            step="any"
            inputMode="decimal"
            error={errorFor('longitude', errors.longitude?.message)}
            {...register('longitude', { valueAsNumber: true })}
          />
          <TextField
            label="Date"
            type="date"
            error={errorFor('date', errors.date?.message)}
            {...register('date')}
          />
          <TextField
            label="Time zone"
            list="lw-time-zones"
            autoComplete="off"
            spellCheck={false}
            error={errorFor('timeZone', errors.timeZone?.message)}
            {...register('timeZone')}
          />
          <datalist id="lw-time-zones">
            {zones.map((zone) => (
              <option key={zone} value={zone} />
            ))}
          </datalist>
          <SelectField
            label="Sky"
            options={[
              { value: 'clear', label: 'Clear' },
              { value: 'partly-cloudy', label: 'Some cloud' },
              { value: 'overcast', label: 'Dark overcast' },
            ]}
            error={errorFor('sky', errors.sky?.message)}
            {...register('sky')}
          />
          <TextField
            label={`Height above horizon (${unit})`}
            type="number"
            step="any"
            min={0}
            inputMode="decimal"
            hint="Raises the horizon you see past"
            error={errorFor('elevation', errors.elevation?.message)}
            {...register('elevation', { valueAsNumber: true })}
          />
        </FormGrid>
        <details className="rounded-card border border-edge bg-panel p-4">
          <summary className="cursor-pointer text-small font-semibold">Window definitions</summary>
          <p className="mt-2 text-caption text-ink-muted">
            Golden and blue hour have no standard; these are sun altitudes in degrees.
          </p>
          <div className="mt-3 grid grid-cols-2 gap-3">
            <TextField
              label="Golden from (°)"
              type="number"
              step="any"
              error={errorFor('goldenHour.upperDeg', errors.goldenHour?.upperDeg?.message)}
              {...register('goldenHour.upperDeg', { valueAsNumber: true })}
            />
            <TextField
              label="Golden to (°)"
              type="number"
              step="any"
              error={errorFor('goldenHour.lowerDeg', errors.goldenHour?.lowerDeg?.message)}
              {...register('goldenHour.lowerDeg', { valueAsNumber: true })}
            />
            <TextField
              label="Blue from (°)"
              type="number"
              step="any"
              error={errorFor('blueHour.upperDeg', errors.blueHour?.upperDeg?.message)}
              {...register('blueHour.upperDeg', { valueAsNumber: true })}
            />
            <TextField
              label="Blue to (°)"
              type="number"
              step="any"
              error={errorFor('blueHour.lowerDeg', errors.blueHour?.lowerDeg?.message)}
              {...register('blueHour.lowerDeg', { valueAsNumber: true })}
            />
          </div>
        </details>
      </form>
      <CalculationResult
        calculation="twilight"
        preview={preview}
        fieldLabels={twilightFieldLabels}
        cautions={cautionsFor(0)}
      >
        {(twilight) => (
          <TwilightResultView result={twilight} selectedIndex={index} onSelect={setSelectedIndex} />
        )}
      </CalculationResult>
    </div>
  );
}
