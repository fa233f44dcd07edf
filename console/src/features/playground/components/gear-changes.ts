import type { GearGelKit, GearLight, GearModifier } from '../api/gear-options';
import { fixed } from '../utils/format';

// A pick from the studio's gear is a copy of the item as it was when picked. The gear lists are
// refetched (on focus, after changes on the Gear page), so a pick can be compared with the item as
// it is now: the same, changed in values the fields were filled from, or deleted.

export type Followed<T> =
  /** Still there with the values it was picked with (a new name alone changes nothing). */
  | { state: 'current'; now: T }
  /** Still there, but some of the values it filled in differ now; `what` says which, in words. */
  | { state: 'changed'; was: T; now: T; what: string[] }
  /** No longer in the studio's gear. */
  | { state: 'deleted'; was: T };

/**
 * What became of `was` in the studio's `list` now; undefined when nothing is picked. While the
 * list is not known (not loaded, or failed) the pick is taken as it was.
 */
export function followPick<T extends { id: string }>(
  was: T | undefined,
  list: readonly T[] | undefined,
  changes: (was: T, now: T) => string[],
): Followed<T> | undefined {
  if (!was) return undefined;
  if (!list) return { state: 'current', now: was };
  const now = list.find((item) => item.id === was.id);
  if (!now) return { state: 'deleted', was };
  const what = changes(was, now);
  return what.length ? { state: 'changed', was, now, what } : { state: 'current', now };
}

/** The item saving may name: the current one (changed or not), none when deleted. */
export const currentItem = <T>(followed: Followed<T> | undefined): T | undefined =>
  followed && followed.state !== 'deleted' ? followed.now : undefined;

const now = (label: string, after: string, before: string) =>
  `${label} is now ${after} (was ${before})`;

/** A light fills in its guide number and unit. */
export function lightChanges(was: GearLight, is: GearLight): string[] {
  if (was.guideNumber === is.guideNumber && was.guideNumberUnit === is.guideNumberUnit) return [];
  return [
    now(
      'guide number',
      `${fixed(is.guideNumber, 1)} ${is.guideNumberUnit}`,
      `${fixed(was.guideNumber, 1)} ${was.guideNumberUnit}`,
    ),
  ];
}

// `typeof`: an answer that leaves an optional field out reads as "none", like null.
const size = (m: GearModifier) =>
  typeof m.size === 'number' ? `${fixed(m.size, 2)} ${m.sizeUnit ?? 'm'}` : 'none';
const beam = (m: GearModifier) =>
  typeof m.beamAngleDeg === 'number' ? `${m.beamAngleDeg}°` : 'none';

/** A modifier fills in its kind, loss, size and beam (each where the form has a box for it). */
export function modifierChanges(was: GearModifier, is: GearModifier): string[] {
  const out: string[] = [];
  if ((was.kind ?? null) !== (is.kind ?? null))
    out.push(now('kind', is.kind ?? 'none', was.kind ?? 'none'));
  if (was.lossStops !== is.lossStops)
    out.push(now('loss', `${fixed(is.lossStops, 1)} stops`, `${fixed(was.lossStops, 1)}`));
  if (size(was) !== size(is)) out.push(now('size', size(is), size(was)));
  if (beam(was) !== beam(is)) out.push(now('beam', beam(is), beam(was)));
  return out;
}

/** The gels a kit offers, in its order, as the plan uses them. */
const gelsOf = (kit: GearGelKit) =>
  JSON.stringify(
    [...kit.pieces]
      .sort((a, b) => a.position - b.position)
      .map((p) => [p.name, p.miredShift, p.greenShift, p.lossStops]),
  );

/** A gel kit fills in the gels the balance may choose from. */
export function gelKitChanges(was: GearGelKit, is: GearGelKit): string[] {
  if (gelsOf(was) === gelsOf(is)) return [];
  const count = (kit: GearGelKit) =>
    `${kit.pieces.length} ${kit.pieces.length === 1 ? 'gel' : 'gels'}`;
  return was.pieces.length === is.pieces.length
    ? [`its gels have changed (still ${count(is)})`]
    : [`it has ${count(is)} now (was ${was.pieces.length})`];
}
