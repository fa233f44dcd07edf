import { Segmented } from '@/components/ui/segmented';
import { useLengthUnit, type DisplayUnit } from '../hooks/use-length-unit';

const options = [
  { value: 'm', label: 'm', title: 'Metres' },
  { value: 'ft', label: 'ft', title: 'Feet' },
] as const satisfies readonly { value: DisplayUnit; label: string; title: string }[];

export function UnitToggle() {
  const [unit, setUnit] = useLengthUnit();
  return <Segmented label="Distances in" value={unit} onChange={setUnit} options={options} />;
}
