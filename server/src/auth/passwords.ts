// Password hashing (argon2id via @node-rs/argon2) and the minimum strength rules.
import { Algorithm, hash, verify } from '@node-rs/argon2';
import type { FieldProblem } from '../common/errors/domain-error.js';

// OWASP Password Storage Cheat Sheet's argon2id baseline: m=19 MiB, t=2, p=1.
const OPTIONS = { algorithm: Algorithm.Argon2id, memoryCost: 19456, timeCost: 2, parallelism: 1 };

export const PASSWORD_MIN = 10;
export const PASSWORD_MAX = 200;

/** A few of the most-used passwords (common practice, no source): refused outright. */
const COMMON = new Set([
  'password',
  'password1',
  'password12',
  'password123',
  'passw0rd',
  '1234567890',
  '0123456789',
  'qwertyuiop',
  'qwerty1234',
  '1q2w3e4r5t',
  'iloveyou12',
  'letmein123',
  'welcome123',
  'abcdefghij',
  'aaaaaaaaaa',
  'photography',
  'photographer',
]);

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(phc: string, password: string): Promise<boolean> {
  try {
    return await verify(phc, password);
  } catch {
    return false;
  }
}

let dummy: Promise<string> | null = null;
/** Spends the same work as a real check, so an unknown e-mail answers as slowly as a known one. */
export async function verifyAgainstDummy(password: string): Promise<void> {
  dummy ??= hashPassword('dummy-password-for-timing');
  await verifyPassword(await dummy, password);
}

/** Minimum strength: length, not a well-known password, not the e-mail or name. */
export function passwordProblems(
  password: string,
  context: { email?: string; name?: string } = {},
  field = 'password',
): FieldProblem[] {
  const fail = (reason: string) => [{ field, reason }];
  if (password.length < PASSWORD_MIN) return fail(`must be at least ${PASSWORD_MIN} characters`);
  if (password.length > PASSWORD_MAX) return fail(`must be at most ${PASSWORD_MAX} characters`);
  const lower = password.toLowerCase();
  if (COMMON.has(lower)) return fail('is one of the most common passwords; choose another');
  if (new Set(lower).size < 4) return fail('must use at least 4 different characters');
  const local = context.email?.split('@')[0]?.toLowerCase();
  if (context.email && (lower === context.email.toLowerCase() || (local && lower === local))) {
    return fail('must not be your e-mail address');
  }
  if (context.name && lower === context.name.toLowerCase()) return fail('must not be your name');
  return [];
}
