import { describe, expect, it } from 'vitest';
import { safeNext, signInPath } from './redirect';
import { acceptInviteSchema, newPasswordSchema, signInSchema, signUpSchema } from './schemas';

const messages = (result: {
  success: boolean;
  error?: { issues: { path: PropertyKey[]; message: string }[] };
}) =>
  Object.fromEntries(
    (result.error?.issues ?? []).map((issue) => [issue.path.join('.'), issue.message]),
  );

describe('auth form validation', () => {
  it('sign-up needs a name, a studio, a valid email and 10+ character password', () => {
    const result = signUpSchema.safeParse({
      name: ' ',
      organizationName: '',
      email: 'not-an-email',
      password: 'short',
    });
    expect(result.success).toBe(false);
    expect(messages(result)).toEqual({
      name: 'Enter your name',
      organizationName: 'Give your studio a name',
      email: 'Enter a valid email address',
      password: 'Use at least 10 characters',
    });
    expect(
      signUpSchema.safeParse({
        name: 'Ines Quarry',
        organizationName: 'Lantern Lane Studio',
        email: 'ines@lantern-lane.test',
        password: 'dusk-over-the-harbour',
      }).success,
    ).toBe(true);
  });

  it('sign-in asks for both fields', () => {
    expect(messages(signInSchema.safeParse({ email: '', password: '' }))).toEqual({
      email: 'Enter the email you signed up with',
      password: 'Enter your password',
    });
  });

  it('a new password must be typed twice the same', () => {
    expect(
      messages(
        newPasswordSchema.safeParse({ password: 'blue-hour-fill', confirm: 'blue-hour-fil' }),
      ),
    ).toEqual({ confirm: 'The two passwords differ' });
    expect(
      newPasswordSchema.safeParse({ password: 'blue-hour-fill', confirm: 'blue-hour-fill' })
        .success,
    ).toBe(true);
  });

  it('accepting an invite needs name and password only for a new account', () => {
    expect(acceptInviteSchema(true).safeParse({}).success).toBe(true);
    expect(messages(acceptInviteSchema(false).safeParse({ name: '', password: 'x' }))).toEqual({
      name: 'Enter your name',
      password: 'Use at least 10 characters',
    });
  });
});

describe('redirect after sign-in', () => {
  it('keeps local paths and refuses anything that leaves the site', () => {
    expect(safeNext('/keys?cursor=abc')).toBe('/keys?cursor=abc');
    expect(safeNext('//evil.test/x')).toBe('/');
    expect(safeNext('/\\evil.test')).toBe('/');
    expect(safeNext('https://evil.test')).toBe('/');
    expect(safeNext('javascript:alert(1)')).toBe('/');
    expect(safeNext(null)).toBe('/');
  });

  it('builds the sign-in link that returns to the current page', () => {
    expect(signInPath({ pathname: '/', search: '' })).toBe('/sign-in');
    expect(signInPath({ pathname: '/usage', search: '?status=429' })).toBe(
      '/sign-in?next=%2Fusage%3Fstatus%3D429',
    );
  });
});
