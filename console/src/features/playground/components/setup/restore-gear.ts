import type { DuskSetupInput } from '@lumenwright/shared';
import type { SavedSetupInputs } from '../../api/saved-setups';
import { withGearIds, type GearLists, type PickedGear } from './gear-links';

// Reopening a saved setup that named studio gear by id: which picks come back, and what to say
// about the others. The form always holds the saved (resolved) values; a pick comes back only
// when the gear still stands for those values, so saving again keeps its id.

export type GearSlot = keyof PickedGear;

/** The ids a saved setup named, by the pick each one stands for. */
export type SavedGearIds = Partial<Record<GearSlot, string>>;

/** Where each pick's id sits in the saved inputs, and what the notices call it. */
const SLOTS: { slot: GearSlot; part?: 'key' | 'rim'; field: string; words: string }[] = [
  { slot: 'keyLight', part: 'key', field: 'lightId', words: 'key light' },
  { slot: 'keyModifier', part: 'key', field: 'modifierId', words: 'key modifier' },
  { slot: 'rimLight', part: 'rim', field: 'lightId', words: 'rim light' },
  { slot: 'rimModifier', part: 'rim', field: 'modifierId', words: 'rim modifier' },
  { slot: 'gelKit', field: 'gelKitId', words: 'gel kit' },
];

export function savedGearIds(inputs: SavedSetupInputs): SavedGearIds {
  const record = inputs as unknown as Record<string, Record<string, unknown> | undefined>;
  const out: SavedGearIds = {};
  for (const { slot, part, field } of SLOTS) {
    const value = part ? record[part]?.[field] : (record as Record<string, unknown>)[field];
    if (typeof value === 'string') out[slot] = value;
  }
  return out;
}

/** The ids the picks give, e.g. to show in the pickers. */
export function pickedIds(picked: PickedGear): SavedGearIds {
  const out: SavedGearIds = {};
  for (const { slot } of SLOTS) {
    const id = picked[slot]?.id;
    if (id) out[slot] = id;
  }
  return out;
}

export interface RestoredGear {
  picked: PickedGear;
  /** "key light", "gel kit": named by id, no longer in the studio's gear. */
  missing: string[];
  /** "key light Big pack": still there, but no longer the values the setup was saved with. */
  changed: string[];
  /** Named by id, but its list could not be loaded. */
  unknown: string[];
}

/** Gels compared by value: the stored inputs may list a gel's fields in another order. */
function sameGels(gels: DuskSetupInput['gels']): DuskSetupInput['gels'] {
  return gels?.map((g) => ({
    name: g.name,
    miredShift: g.miredShift,
    greenShift: g.greenShift,
    lossStops: g.lossStops,
  }));
}

const listFor = (slot: GearSlot, lists: GearLists) =>
  slot === 'gelKit'
    ? lists.gelKits
    : slot === 'keyLight' || slot === 'rimLight'
      ? lists.lights
      : lists.modifiers;

/**
 * The picks a reopened setup gets back from the ids it was saved with (`ids`), given the values
 * the server resolved them to then (`resolved`) and the studio's gear now.
 */
export function restoreGear(
  ids: SavedGearIds,
  lists: GearLists,
  resolved: SavedSetupInputs,
): RestoredGear {
  const found: PickedGear = {};
  const out: RestoredGear = { picked: {}, missing: [], changed: [], unknown: [] };
  for (const { slot, words } of SLOTS) {
    const id = ids[slot];
    if (!id) continue;
    const list = listFor(slot, lists);
    if (!list) out.unknown.push(words);
    else {
      const item = list.find((i) => i.id === id);
      if (item) Object.assign(found, { [slot]: item });
      else out.missing.push(words);
    }
  }
  // The same test saving uses: a pick whose gear no longer gives the saved values would not be
  // kept as an id, so it is not picked again (and a changed gel kit would change the plan).
  const values = resolved as unknown as DuskSetupInput;
  const kept = savedGearIds(withGearIds({ ...values, gels: sameGels(values.gels) }, found));
  for (const { slot, words } of SLOTS) {
    const item = found[slot];
    if (!item) continue;
    if (kept[slot] === item.id) Object.assign(out.picked, { [slot]: item });
    else out.changed.push(`${words} ${item.name}`);
  }
  return out;
}

/** "the key light", "the key light and the gel kit", "a, b and c". */
export function listed(words: readonly string[]): string {
  const the = words.map((w) => `the ${w}`);
  return the.length < 2 ? (the[0] ?? '') : `${the.slice(0, -1).join(', ')} and ${the.at(-1)}`;
}
