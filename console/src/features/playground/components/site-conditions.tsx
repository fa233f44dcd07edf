import { usePlaygroundScene } from './playground-scene';

const flags = [
  { key: 'nearRoad', label: 'Near a road' },
  { key: 'nearWater', label: 'Near water' },
  { key: 'coldFogOrHaze', label: 'Fog or haze' },
  { key: 'modellingLamps', label: 'Modelling lamps on' },
] as const;

/**
 * Where the shoot is: this only changes the cautions shown with each result. Open at first, so
 * the safety questions are seen before any plan; it can be folded away.
 */
export function SiteConditions() {
  const { conditions, setConditions } = usePlaygroundScene();
  return (
    <details open className="rounded-card border border-edge bg-panel p-4">
      <summary className="cursor-pointer text-small font-semibold">
        Site conditions <span className="font-normal text-ink-muted">(for the cautions)</span>
      </summary>
      <div className="mt-3 flex flex-wrap items-end gap-x-6 gap-y-3">
        {flags.map((flag) => (
          <label key={flag.key} className="flex items-center gap-2 text-small">
            <input
              type="checkbox"
              checked={conditions[flag.key]}
              onChange={(event) =>
                setConditions({ ...conditions, [flag.key]: event.target.checked })
              }
              className="size-4 accent-(--color-accent)"
            />
            {flag.label}
          </label>
        ))}
        <label className="flex flex-col gap-1 text-small">
          Forecast wind (km/h)
          <input
            type="number"
            min={0}
            max={400}
            inputMode="numeric"
            value={conditions.windKmh ?? ''}
            onChange={(event) => {
              const value = event.target.valueAsNumber;
              setConditions({
                ...conditions,
                windKmh: Number.isFinite(value) && value >= 0 ? value : undefined,
              });
            }}
            className="w-28 rounded-control border border-edge-strong bg-panel px-3 py-1.5 text-ink"
          />
        </label>
      </div>
    </details>
  );
}
