// The Idempotency-Key value: an RFC 8941 sf-string (§3.3.3: DQUOTE *chr DQUOTE, chr = unescaped
// %x20-21 / %x23-5B / %x5D-7E or "\" followed by DQUOTE or "\"; parsing per §4.2.5), or the key
// bare. The examples below are written from those rules, not from the parser.
import { DomainError } from '../common/errors/domain-error.js';
import { parseIdempotencyKey } from './idempotency-header.js';
import { isStoredStatus } from './idempotency.hook.js';

const refusal = (raw: string | string[]) => {
  try {
    parseIdempotencyKey(raw);
  } catch (e) {
    return e;
  }
  return null;
};

describe('parseIdempotencyKey', () => {
  it('is undefined without the header', () => {
    expect(parseIdempotencyKey(undefined)).toBeUndefined();
  });

  it("reads the draft's example key (a quoted UUID) and the same key sent bare", () => {
    // draft-ietf-httpapi-idempotency-key-header, section "Syntax", its example.
    expect(parseIdempotencyKey('"8e03978e-40d5-43e8-bc93-6894a57f9324"')).toBe(
      '8e03978e-40d5-43e8-bc93-6894a57f9324',
    );
    expect(parseIdempotencyKey('8e03978e-40d5-43e8-bc93-6894a57f9324')).toBe(
      '8e03978e-40d5-43e8-bc93-6894a57f9324',
    );
  });

  it('unescapes \\" and \\\\ inside a quoted key (RFC 8941 §4.2.5)', () => {
    expect(parseIdempotencyKey('"a\\"b\\\\c"')).toBe('a"b\\c');
    expect(parseIdempotencyKey('" spaced key "')).toBe(' spaced key ');
  });

  it('takes 255 characters and refuses 256', () => {
    expect(parseIdempotencyKey('k'.repeat(255))).toHaveLength(255);
    expect(parseIdempotencyKey(`"${'k'.repeat(255)}"`)).toHaveLength(255);
    expect(refusal('k'.repeat(256))).toBeInstanceOf(DomainError);
    expect(refusal(`"${'k'.repeat(256)}"`)).toBeInstanceOf(DomainError);
  });

  it.each([
    ['empty', ''],
    ['blank', '   '],
    ['an empty quoted string', '""'],
    ['no closing quote', '"open'],
    ['text after the closing quote', '"a"b'],
    ['an escape other than \\" or \\\\', '"a\\nb"'],
    ['a bare quote inside', '"a"b"'],
    ['a character outside printable ASCII', 'ke\u00e9y'],
    ['two values (the header sent twice)', ['a', 'b']],
  ])('refuses %s with a 422 naming the header', (_what, raw) => {
    const e = refusal(raw) as DomainError;
    expect(e).toBeInstanceOf(DomainError);
    expect(e.code).toBe('invalid_input');
    expect(e.errors).toEqual([{ field: 'Idempotency-Key', reason: expect.any(String) }]);
  });
});

describe('isStoredStatus', () => {
  // The draft, "Idempotency Enforcement Scenarios": a retry after completion gets "the result
  // of the previously completed operation, success or an error". Our choice on top (common
  // practice, no source): server faults and refusals that depend on timing or the account's
  // state are not kept.
  it('keeps successes and client errors about the request', () => {
    for (const s of [200, 201, 400, 404, 413, 415, 422]) expect(isStoredStatus(s)).toBe(true);
  });
  it('does not keep 5xx, limits, access refusals or timing conflicts', () => {
    for (const s of [500, 502, 503, 504, 429, 401, 403, 408, 409, 425, 301]) {
      expect(isStoredStatus(s)).toBe(false);
    }
  });
});
