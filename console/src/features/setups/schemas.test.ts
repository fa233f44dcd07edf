import { describe, expect, it } from 'vitest';
import { playgroundHref, saveSetupSchema, toCreateSetupBody } from './schemas';

const valid = {
  name: 'Harbour wall portraits',
  venue: 'North pier',
  date: '2026-12-12',
  timeZone: 'Europe/Lisbon',
  latitude: 38.7,
  longitude: -9.14,
  keyGuideNumber: 40,
  keyDistance: 2,
  notes: '',
};

describe('save-setup form', () => {
  it('checks coordinates and the key light', () => {
    const result = saveSetupSchema.safeParse({
      ...valid,
      latitude: 91,
      longitude: Number.NaN,
      keyDistance: 0,
    });
    expect(result.success).toBe(false);
    const issues = Object.fromEntries(result.error!.issues.map((i) => [i.path[0], i.message]));
    expect(issues.latitude).toBe('Between -90 and 90');
    expect(issues.longitude).toBeDefined();
    expect(issues.keyDistance).toBe('Must be above 0');
  });

  it('builds the API body with metre units and no empty optional text', () => {
    expect(toCreateSetupBody(saveSetupSchema.parse(valid))).toEqual({
      name: 'Harbour wall portraits',
      venue: 'North pier',
      inputs: {
        date: '2026-12-12',
        timeZone: 'Europe/Lisbon',
        latitude: 38.7,
        longitude: -9.14,
        key: { guideNumber: 40, guideNumberUnit: 'm', distance: 2, distanceUnit: 'm' },
      },
    });
  });

  it('reopens a setup on the playground’s setup tab', () => {
    expect(playgroundHref('/playground', 'a b')).toBe('/playground?setup=a%20b&calc=setup');
  });
});
