import { SelectField } from '@/components/ui/select-field';
import { GearChangeNote } from './gear-change-note';
import { followPick } from './gear-changes';

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
      // Nothing picked: the placeholder says nothing on paper.
      className={`col-span-2 ${shown ? '' : 'print:hidden'}`}
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

/**
 * A `GearPicker` that follows its pick (`picked`, the item as it was when picked) in the studio's
 * gear as it is now (`all`, default `items`): changed or deleted since, a note beside it says so
 * and offers to fill the fields anew (`onPick` with the item now) or to forget the pick (`onDrop`).
 */
export function FollowingGearPicker<T extends { id: string; name: string }>({
  picked,
  all,
  changes,
  thing,
  keeping,
  onDrop,
  refillLabel,
  ...picker
}: Parameters<typeof GearPicker<T>>[0] & {
  picked: T | undefined;
  all?: readonly T[] | undefined;
  changes: (was: T, now: T) => string[];
  thing: string;
  keeping: string;
  onDrop?: () => void;
  refillLabel?: string;
}) {
  const followed = followPick(picked, all ?? picker.items, changes);
  // Filled anew only from an item the picker offers (a gel kit emptied since is not).
  const refill =
    followed?.state === 'changed' && picker.items.some((i) => i.id === followed.now.id)
      ? followed.now
      : undefined;
  return (
    <>
      <GearPicker {...picker} />
      <GearChangeNote
        followed={followed}
        thing={thing}
        keeping={keeping}
        refillLabel={refillLabel}
        onRefill={refill ? () => picker.onPick(refill) : undefined}
        onKeep={onDrop}
      />
    </>
  );
}
