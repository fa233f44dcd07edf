import { describe, expect, it } from 'vitest';
import type { GearGelKit } from '../../api/gear-options';
import type { SavedSetupInputs } from '../../api/saved-setups';
import { listed, restoreGear } from './restore-gear';

// Invented gear; only the fields the links read matter here.
const kit = {
  id: 'kit-1',
  name: 'Warm pouch',
  pieces: [{ name: 'Warm half', miredShift: 80, greenShift: 0, lossStops: 0.5, position: 0 }],
} as unknown as GearGelKit;

const resolved = {
  latitude: 47,
  longitude: 8,
  date: '2026-06-20',
  timeZone: 'Europe/Zurich',
  key: { guideNumber: 40, guideNumberUnit: 'm', distance: 3, distanceUnit: 'm' },
  // PostgreSQL's jsonb stores an object's keys shortest first, so the saved gels come back with
  // their fields in another order than the kit's pieces give them.
  gels: [{ name: 'Warm half', lossStops: 0.5, greenShift: 0, miredShift: 80 }],
} as unknown as SavedSetupInputs;

describe('restoreGear', () => {
  it('picks a gel kit again when its pieces are the saved gels, whatever their field order', () => {
    const gear = restoreGear(
      { gelKit: 'kit-1' },
      { lights: [], modifiers: [], gelKits: [kit] },
      resolved,
    );
    expect(gear.picked.gelKit?.id).toBe('kit-1');
    expect(gear.changed).toEqual([]);
  });

  it('names a kit whose pieces changed, and links whose list could not be loaded', () => {
    const changed = { ...kit, pieces: [{ ...kit.pieces[0]!, lossStops: 0.6 }] };
    const gear = restoreGear(
      { gelKit: 'kit-1', keyLight: 'light-1' },
      { lights: undefined, modifiers: [], gelKits: [changed] },
      resolved,
    );
    expect(gear.picked).toEqual({});
    expect(gear.changed).toEqual(['gel kit Warm pouch']);
    expect(gear.unknown).toEqual(['key light']);
  });

  it('lists names as words', () => {
    expect(listed(['key light'])).toBe('the key light');
    expect(listed(['key light', 'rim light', 'gel kit'])).toBe(
      'the key light, the rim light and the gel kit',
    );
  });
});
