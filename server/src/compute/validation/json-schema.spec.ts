import { compileSchema, UUID_PATTERN } from './json-schema.js';
import { forDocs } from './schema-dto.js';
import { balanceRequestSchema } from '../schemas/balance.schema.js';
import { twilightRequestSchema } from '../schemas/twilight.schema.js';
import { setupRequestSchema } from '../schemas/setup.schema.js';
import { LightingInputError, planDuskSetup } from '@lumenwright/shared';

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

  it('says what a pattern expects in words, never the expression', () => {
    const limit = compileSchema({
      type: 'string',
      pattern: '^([1-9]|[1-9][0-9]|100)$',
      patternWords: 'a whole number from 1 to 100',
    });
    expect(limit('0')).toEqual([{ field: 'body', reason: 'must be a whole number from 1 to 100' }]);
    expect(limit('100')).toEqual([]);
    // The UUID pattern and format: 'uuid' say "a UUID" without being told.
    const byPattern = compileSchema({ type: 'string', pattern: UUID_PATTERN });
    const byFormat = compileSchema({ type: 'string', format: 'uuid' });
    for (const check of [byPattern, byFormat]) {
      expect(check('not-a-uuid')).toEqual([{ field: 'body', reason: 'must be a UUID' }]);
      expect(check('0b7c6a52-3d0e-4c55-9f59-2B1F4E0D8A11')).toEqual([]);
    }
    // A pattern nobody put words to still does not show the expression.
    const bare = compileSchema({ type: 'string', pattern: '^[a-z]+$' });
    expect(bare('ABC')[0]?.reason).not.toContain('[a-z]');
  });

  it('gives a field one problem: the first check it fails', () => {
    const day = compileSchema({
      type: 'string',
      pattern: '^\\d{4}-\\d{2}-\\d{2}$',
      format: 'date',
    });
    expect(day('2026-12-03T10:00:00Z')).toEqual([
      { field: 'body', reason: 'must be a calendar date, YYYY-MM-DD' },
    ]);
    const name = compileSchema({ type: 'string', minLength: 3, pattern: '^[a-z]+$' });
    expect(name('A')).toEqual([{ field: 'body', reason: 'must have at least 3 characters' }]);
  });

  it('refuses an unknown modifier kind in the same words as the math library', () => {
    const body = {
      latitude: 51.507,
      longitude: -0.1,
      date: '2026-06-20',
      timeZone: 'Europe/London',
      key: { guideNumber: 60, distance: 2.5, modifier: 'parabolic-dish' },
    };
    const [problem, ...rest] = compileSchema(setupRequestSchema)(body);
    expect(rest).toEqual([]);
    let fromLibrary: LightingInputError | undefined;
    try {
      planDuskSetup(body as never);
    } catch (e) {
      fromLibrary = e as LightingInputError;
    }
    expect(fromLibrary).toBeInstanceOf(LightingInputError);
    expect(problem).toEqual({ field: fromLibrary!.field, reason: fromLibrary!.reason });
  });

  it('publishes schemas without the wording hints', () => {
    const schema = {
      type: 'object' as const,
      properties: { limit: { type: 'string' as const, pattern: '^1$', patternWords: 'one' } },
    };
    expect(forDocs(schema)).toEqual({
      type: 'object',
      properties: { limit: { type: 'string', pattern: '^1$' } },
    });
    expect(schema.properties.limit.patternWords).toBe('one');
  });
});
