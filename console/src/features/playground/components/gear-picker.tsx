import { SelectField } from '@/components/ui/select-field';

/**
 * A "from your gear" select: picking an item fills the fields it stands for; hidden when empty.
 * It shows `selected` (an item's id) while the caller says the fields stand for that item, else
 * its placeholder, so the same item can be picked again to fill the fields anew.
 */
export function GearPicker<T extends { id: string }>(props: {
  label: string;
  hint: string;
  placeholder: string;
  items: readonly T[];
  describe: (item: T) => string;
  onPick: (item: T) => void;
  selected?: string | undefined;
}) {
  if (!props.items.length) return null;
  const shown = props.items.some((i) => i.id === props.selected) ? props.selected : '';
  return (
    <SelectField
      label={props.label}
      className="col-span-2"
      hint={props.hint}
      value={shown}
      options={[
        { value: '', label: props.placeholder },
        ...props.items.map((item) => ({ value: item.id, label: props.describe(item) })),
      ]}
      onChange={(event) => {
        const item = props.items.find((i) => i.id === event.target.value);
        if (item) props.onPick(item);
      }}
    />
  );
}
