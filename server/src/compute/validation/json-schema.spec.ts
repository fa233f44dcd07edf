import { compileSchema } from './json-schema.js';
import { balanceRequestSchema } from '../schemas/balance.schema.js';
import { twilightRequestSchema } from '../schemas/twilight.schema.js';

describe('compiled JSON-schema validator', () => {
  const balance = compileSchema(balanceRequestSchema);
  const twilight = compileSchema(twilightRequestSchema);

  it('accepts a valid body', () => {
    expect(
      balance({
        cameraKelvin: 3800,
        flashKelvin: 5600,
        gels: [{ name: 'Half warming', miredShift: 81, lossStops: 0.33 }],
      }),
    ).toEqual([]);
  });

  it('never coerces types: strings, booleans and null are not numbers', () => {
    for (const v of ['3800', true, null, [3800], { k: 3800 }]) {
      expect(balance({ cameraKelvin: v })).toEqual([
        { field: 'cameraKelvin', reason: 'must be a number' },
      ]);
    }
  });

  it('refuses non-finite numbers (JSON.parse turns 1e400 into Infinity)', () => {
    expect(balance({ cameraKelvin: JSON.parse('1e400') })).toEqual([
      { field: 'cameraKelvin', reason: 'must be a finite number' },
    ]);
    expect(balance({ cameraKelvin: NaN })[0]?.reason).toBe('must be a finite number');
  });

  it('names nested fields the way the math library does', () => {
    expect(
      balance({
        cameraKelvin: 3800,
        gels: [
          { name: 'a', miredShift: 1, lossStops: 0 },
          { name: 'b', lossStops: 0 },
        ],
      }),
    ).toEqual([{ field: 'gels[1].miredShift', reason: 'is required' }]);
  });

  it('enforces bounds, integers, enums, closed objects and calendar dates', () => {
    expect(balance({ cameraKelvin: 0 })).toEqual([
      { field: 'cameraKelvin', reason: 'must be at least 1500' },
    ]);
    expect(balance({ cameraKelvin: 20001 })).toEqual([
      { field: 'cameraKelvin', reason: 'must be at most 20000' },
    ]);
    const open = compileSchema({ type: 'number', exclusiveMinimum: 0, exclusiveMaximum: 1 });
    expect([open(0), open(1), open(0.5)]).toEqual([
      [{ field: 'body', reason: 'must be greater than 0' }],
      [{ field: 'body', reason: 'must be less than 1' }],
      [],
    ]);
    expect(balance({ cameraKelvin: 3800, maxGels: 1.5 })).toEqual([
      { field: 'maxGels', reason: 'must be a whole number' },
    ]);
    expect(balance({ cameraKelvin: 3800, colour: 'warm' })).toEqual([
      { field: 'colour', reason: 'is not a known field' },
    ]);
    const base = { latitude: 0, longitude: 0, timeZone: 'UTC' };
    expect(twilight({ ...base, date: '2026-02-29' })).toEqual([
      { field: 'date', reason: 'must be a calendar date, YYYY-MM-DD' },
    ]);
    expect(twilight({ ...base, date: '2028-02-29' })).toEqual([]); // 2028 is a leap year (Gregorian rule)
    expect(twilight({ ...base, date: '2026-06-20', sky: 'stormy' })[0]?.field).toBe('sky');
    expect(twilight({ ...base, date: '2026-06-20', latitude: -90.5 })).toEqual([
      { field: 'latitude', reason: 'must be at least -90' },
    ]);
  });

  it('refuses a body that is not an object, and caps the number of problems', () => {
    expect(balance([])).toEqual([{ field: 'body', reason: 'must be an object' }]);
    const many = Object.fromEntries(Array.from({ length: 100 }, (_, i) => [`x${i}`, i]));
    expect(balance({ cameraKelvin: 3800, ...many })).toHaveLength(20);
  });
});
