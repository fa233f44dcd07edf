import { describe, expect, it } from 'vitest';
import { createKeySchema, toCreateKeyBody } from './schemas';

describe('create-key form', () => {
  const schema = createKeySchema('2026-12-02');

  it('needs a name and refuses an expiry date that is not after today', () => {
    const result = schema.safeParse({ name: '  ', environment: 'test', expiresOn: '2026-12-02' });
    expect(result.success).toBe(false);
    const issues = Object.fromEntries(result.error!.issues.map((i) => [i.path[0], i.message]));
    expect(issues).toEqual({
      name: 'Name the key after the app that uses it',
      expiresOn: 'Pick a date after today',
    });
  });

  it('sends no expiresAt without a date, and the end of the UTC day with one', () => {
    expect(toCreateKeyBody({ name: 'Booking app', environment: 'live', expiresOn: '' })).toEqual({
      name: 'Booking app',
      environment: 'live',
    });
    const parsed = schema.parse({
      name: 'Booking app',
      environment: 'test',
      expiresOn: '2027-01-31',
    });
    expect(toCreateKeyBody(parsed)).toEqual({
      name: 'Booking app',
      environment: 'test',
      expiresAt: '2027-01-31T23:59:59.000Z',
    });
  });
});
