// PostgreSQL text cannot hold U+0000, and no field of this API needs it: a NUL anywhere in a JSON
// body or a query string is refused up front with a 422 naming the field, instead of failing
// later in the database.
import { DomainError } from '../errors/domain-error.js';

const REASON = 'must not contain the NUL character (U+0000)';

/** Path of the first string (or key) holding U+0000, as `a.b[2].c`; null when there is none. */
export function findNul(value: unknown, path = ''): string | null {
  if (typeof value === 'string') return value.includes('\u0000') ? path || 'body' : null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const hit = findNul(value[i], `${path}[${i}]`);
      if (hit !== null) return hit;
    }
    return null;
  }
  if (value !== null && typeof value === 'object') {
    for (const [key, v] of Object.entries(value)) {
      const at = path ? `${path}.${key}` : key;
      if (key.includes('\u0000')) return at;
      const hit = findNul(v, at);
      if (hit !== null) return hit;
    }
  }
  return null;
}

export function nulProblem(field: string): DomainError {
  return new DomainError('invalid_input', `${field} ${REASON}.`, [{ field, reason: REASON }]);
}

/** Field of the first query parameter holding U+0000 (`%00` in the URL), or null. */
export function queryNul(url: string): string | null {
  const q = url.indexOf('?');
  if (q < 0 || !url.includes('%00', q)) return null;
  for (const [key, v] of new URLSearchParams(url.slice(q + 1))) {
    if (key.includes('\u0000') || v.includes('\u0000'))
      return key.replaceAll('\u0000', '') || 'query';
  }
  return null;
}
