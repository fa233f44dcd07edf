import { createPreference, usePreference } from '@/lib/preference';

export type DisplayUnit = 'm' | 'ft';

/** Metres or feet for every distance in the playground; remembered on this device. */
export const lengthUnitPreference = createPreference<DisplayUnit>(
  'lumenwright.length-unit',
  ['m', 'ft'],
  () => 'm',
);

export function useLengthUnit() {
  return usePreference(lengthUnitPreference);
}
