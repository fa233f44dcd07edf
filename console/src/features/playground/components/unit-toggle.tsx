import { Segmented } from '@/components/ui/segmented';
import { problemMessage } from '@/lib/form-errors';
import { useLengthUnit, type DisplayUnit } from '../hooks/use-length-unit';

const options = [
  { value: 'm', label: 'm', title: 'Metres' },
  { value: 'ft', label: 'ft', title: 'Feet' },
] as const satisfies readonly { value: DisplayUnit; label: string; title: string }[];

export function UnitToggle() {
  const [unit, setUnit, saveError] = useLengthUnit();
  return (
    <div className="flex flex-wrap items-center gap-2">
      <Segmented label="Distances in" value={unit} onChange={setUnit} options={options} />
      {saveError ? (
        <p role="alert" className="text-small text-fault">
          Not saved to your account: {problemMessage(saveError)}
        </p>
      ) : null}
    </div>
  );
}
