/**
 * A generic correction-gel kit. Every value is common practice, from memory: typical published
 * ranges for the trade's generic grades, not any maker's data. Mired shift: + warms (CTO family),
 * - cools (CTB family). Green shift in CC units: + adds green, - adds magenta. Light loss in
 * stops is rough.
 */

export interface Gel {
  name: string;
  /** Mired shift, + warms. */
  miredShift: number;
  /** Green-magenta shift in CC units, + green. */
  greenShift: number;
  /** Light loss, stops. */
  lossStops: number;
  /** Where the value comes from. */
  source: string;
}

const MEMORY = 'common practice, from memory';

const g = (name: string, miredShift: number, greenShift: number, lossStops: number): Gel => ({
  name,
  miredShift,
  greenShift,
  lossStops,
  source: MEMORY,
});

/** The generic kit: CTO and CTB in full, 3/4, 1/2, 1/4, 1/8; plus/minus green full, 1/2, 1/4. */
export const GEL_CATALOGUE: readonly Gel[] = Object.freeze([
  g('full CTO', 159, 0, 0.67), // range +131..+167
  g('3/4 CTO', 124, 0, 0.5),
  g('1/2 CTO', 93, 0, 0.4), // range +81..+109
  g('1/4 CTO', 53, 0, 0.25), // range +42..+64
  g('1/8 CTO', 23, 0, 0.15), // range +20..+26
  g('full CTB', -134, 0, 1.5), // range -131..-137
  g('3/4 CTB', -100, 0, 1.1),
  g('1/2 CTB', -73, 0, 0.67), // range -68..-78
  g('1/4 CTB', -32, 0, 0.4), // range -30..-35
  g('1/8 CTB', -15, 0, 0.2), // range -12..-18
  g('full plus green', 0, 30, 0.5), // ~CC30
  g('1/2 plus green', 0, 15, 0.3), // ~CC15
  g('1/4 plus green', 0, 7.5, 0.15), // ~CC7.5
  g('full minus green', 0, -30, 0.5),
  g('1/2 minus green', 0, -15, 0.3),
  g('1/4 minus green', 0, -7.5, 0.15),
]);
