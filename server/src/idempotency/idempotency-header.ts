// The Idempotency-Key request header (IETF httpapi draft "The Idempotency-Key HTTP Header
// Field"): an Item Structured Field whose value is a String (RFC 8941 §3.3.3, `sf-string`), e.g.
// `Idempotency-Key: "8e03978e-40d5-43e8-bc93-6894a57f9324"`. Many clients send the key bare
// (no quotes), so both are accepted: a value starting with a double quote is read as an
// sf-string (escapes `\"` and `\\`), anything else is the key itself. Either way the key is 1 to
// 255 printable ASCII characters (%x20-7E).
import { DomainError } from '../common/errors/domain-error.js';

export const IDEMPOTENCY_KEY_HEADER = 'Idempotency-Key';
/** Sent on a replayed answer. */
export const IDEMPOTENCY_REPLAYED_HEADER = 'Idempotency-Replayed';
export const IDEMPOTENCY_KEY_MAX = 255;

const REASON = `must be 1 to ${IDEMPOTENCY_KEY_MAX} printable ASCII characters, bare or as a quoted string ("…")`;

function refuse(why: string): never {
  throw new DomainError('invalid_input', `The ${IDEMPOTENCY_KEY_HEADER} header ${why}.`, [
    { field: IDEMPOTENCY_KEY_HEADER, reason: REASON },
  ]);
}

/** The sf-string's content, or null when `v` is not one (RFC 8941 §4.2.5). */
function sfString(v: string): string | null {
  let out = '';
  for (let i = 1; i < v.length; i++) {
    const c = v.charCodeAt(i);
    if (c === 0x5c) {
      const next = v[++i];
      if (next !== '"' && next !== '\\') return null;
      out += next;
    } else if (c === 0x22) {
      return i === v.length - 1 ? out : null;
    } else if (c < 0x20 || c > 0x7e) {
      return null;
    } else {
      out += v[i];
    }
  }
  return null; // no closing quote
}

/**
 * The key a request carries: undefined when it sends none; a 422 `invalid-input` problem naming
 * the header when the value is empty, too long, not printable ASCII or a broken quoted string.
 */
export function parseIdempotencyKey(raw: string | string[] | undefined): string | undefined {
  if (raw === undefined) return undefined;
  if (Array.isArray(raw)) refuse('was sent more than once');
  const v = raw.trim();
  let key: string | null = v;
  if (v.startsWith('"')) {
    key = sfString(v);
    if (key === null) refuse('is not a valid quoted string');
  }
  if (key.length === 0) refuse('is empty');
  if (key.length > IDEMPOTENCY_KEY_MAX) refuse(`is longer than ${IDEMPOTENCY_KEY_MAX} characters`);
  if (!/^[\x20-\x7e]+$/.test(key)) refuse('has characters other than printable ASCII');
  return key;
}
