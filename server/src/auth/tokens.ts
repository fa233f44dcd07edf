// Random tokens for e-mailed links and keys: only their SHA-256 is ever stored.
import { hash, randomBytes, randomInt, timingSafeEqual } from 'node:crypto';

const BASE62 = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/** `length` characters from [0-9A-Za-z], uniformly (crypto.randomInt has no modulo bias). */
export function randomBase62(length: number): string {
  let out = '';
  for (let i = 0; i < length; i++) out += BASE62[randomInt(62)];
  return out;
}

/** A URL-safe token with 256 bits of randomness, for e-mailed links. */
export function newLinkToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * One-shot digest: crypto.hash makes no Hash object, so the per-call key check leaves no native
 * object behind for the garbage collector (see the README's performance section).
 */
export function sha256Hex(value: string): string {
  return hash('sha256', value, 'hex');
}

/** Constant-time comparison of two hex digests of equal length. */
export function sameDigest(aHex: string, bHex: string): boolean {
  const a = Buffer.from(aHex, 'hex');
  const b = Buffer.from(bHex, 'hex');
  return a.length === b.length && a.length > 0 && timingSafeEqual(a, b);
}
