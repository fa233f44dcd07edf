// The key format: lw_<environment>_<publicId>_<secret>.
// publicId: 12 base62 characters (~71 bits; the lookup handle, not secret).
// secret: 32 base62 characters (32 * log2(62) ≈ 190 bits of randomness).
import { randomBase62 } from '../auth/tokens.js';
import type { KeyEnvironment } from './api-key.entity.js';

export const PUBLIC_ID_LENGTH = 12;
export const SECRET_LENGTH = 32;
const PATTERN = /^lw_(test|live)_([0-9A-Za-z]{12})_([0-9A-Za-z]{32})$/;

export interface ParsedKey {
  environment: KeyEnvironment;
  publicId: string;
  secret: string;
}

export function newPublicId(): string {
  return randomBase62(PUBLIC_ID_LENGTH);
}

export function newSecret(): string {
  return randomBase62(SECRET_LENGTH);
}

/** The visible part shown in lists: names the product, the environment and the public id. */
export function keyPrefix(environment: KeyEnvironment, publicId: string): string {
  return `lw_${environment}_${publicId}`;
}

export function formatKey(environment: KeyEnvironment, publicId: string, secret: string): string {
  return `${keyPrefix(environment, publicId)}_${secret}`;
}

export function parseKey(token: string): ParsedKey | null {
  const m = PATTERN.exec(token);
  if (!m) return null;
  return { environment: m[1] as KeyEnvironment, publicId: m[2]!, secret: m[3]! };
}
