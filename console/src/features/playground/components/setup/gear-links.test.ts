import type { DuskSetupInput } from '@lumenwright/shared';
import { describe, expect, it } from 'vitest';
import type { GearGelKit, GearLight, GearModifier } from '../../api/gear-options';
import { currentPicks, withGearIds } from './gear-links';

// Invented gear; only the fields the links read matter here.
const light = { id: 'light-1', guideNumber: 36, guideNumberUnit: 'ft' } as GearLight;
const octa = {
  id: 'mod-1',
  kind: 'octabox',
  lossStops: 2.2,
  size: 1.2,
  sizeUnit: 'm',
  beamAngleDeg: null,
} as GearModifier;
const kit = {
  id: 'kit-1',
  pieces: [{ name: 'Warm half', miredShift: 80, greenShift: 0, lossStops: 0.5, position: 0 }],
} as unknown as GearGelKit;

const base: DuskSetupInput = {
  latitude: 47,
  longitude: 8,
  date: '2026-06-20',
  timeZone: 'Europe/Zurich',
  key: {
    // 36 ft x 0.3048 = 10.9728 m (1 ft = 0.3048 m exactly, international yard and pound, 1959),
    // as the form shows it: 2 decimals.
    guideNumber: 10.97,
    guideNumberUnit: 'm',
    distance: 3,
    distanceUnit: 'm',
    modifier: 'octabox',
    modifierLossStops: 2.2,
    modifierSize: 1.2,
  },
};

describe('withGearIds', () => {
  it('links a light whose guide number the form holds converted to its unit', () => {
    const saved = withGearIds(base, { keyLight: light, keyModifier: octa });
    expect(saved.key).toMatchObject({ lightId: 'light-1', modifierId: 'mod-1' });
    expect(saved.key).not.toHaveProperty('guideNumber');
    expect(saved.key).not.toHaveProperty('modifierSize');
  });

  it('keeps the values when another modifier kind was chosen (the server refuses a mismatch)', () => {
    const saved = withGearIds(
      { ...base, key: { ...base.key, modifier: 'umbrella' } },
      { keyModifier: octa },
    );
    expect(saved.key).not.toHaveProperty('modifierId');
    expect(saved.key).toMatchObject({ modifier: 'umbrella', modifierLossStops: 2.2 });
  });

  it('names no rim gear when the rim is off, and keeps gels that are not the kit’s', () => {
    const gels = [{ name: 'Cool quarter', miredShift: -30, greenShift: 0, lossStops: 0.3 }];
    const saved = withGearIds({ ...base, gels }, { rimLight: light, gelKit: kit });
    expect(saved).not.toHaveProperty('rim');
    expect(saved).not.toHaveProperty('gelKitId');
    expect(saved.gels).toEqual(gels);
  });
});

describe('currentPicks', () => {
  const lists = { lights: [light], modifiers: [octa], gelKits: [kit] };

  it('names gear whose values are unchanged, renamed or not', () => {
    const renamed = { ...light, name: 'Renamed since' };
    const saved = withGearIds(
      base,
      currentPicks({ keyLight: light, keyModifier: octa }, { ...lists, lights: [renamed] }),
    );
    expect(saved.key).toMatchObject({ lightId: 'light-1', modifierId: 'mod-1' });
  });

  it('never names gear whose values now differ from the fields, nor gear deleted since', () => {
    const stronger = { ...light, guideNumber: 48 };
    const picks = currentPicks(
      { keyLight: light, keyModifier: octa, gelKit: kit },
      { lights: [stronger], modifiers: [], gelKits: [kit] },
    );
    expect(picks).toEqual({ keyLight: stronger, gelKit: kit });
    const saved = withGearIds(base, picks);
    expect(saved.key).not.toHaveProperty('lightId');
    expect(saved.key).not.toHaveProperty('modifierId');
    expect(saved.key).toMatchObject({ guideNumber: 10.97, modifierLossStops: 2.2 });
  });

  it('keeps a pick as it was while its list is not known', () => {
    expect(currentPicks({ keyLight: light }, { ...lists, lights: undefined })).toEqual({
      keyLight: light,
    });
  });
});
