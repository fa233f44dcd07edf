// The API key a request presents: `Authorization: Bearer <key>` (RFC 6750 §2.1), and only there.
// The rules are the ones passport-http-bearer 1.0.1 applied when the key check ran through
// passport: the header splits on single spaces into exactly the scheme (any case) and the key;
// a request that also carries an `access_token` in its body or query string has more than one
// credential (RFC 6750 §2: clients MUST NOT use more than one method) and is refused. Keys in the
// body or the query string alone were never accepted (the guard only looks for a Bearer header).
// Calling passport per request cost a middleware closure, a strategy object, five action
// closures, seven properties added to the request and four promises on every metered call.

interface BearerRequest {
  headers: Record<string, string | string[] | undefined>;
  body?: unknown;
  query?: unknown;
}

const hasAccessToken = (v: unknown): boolean =>
  typeof v === 'object' && v !== null && !!(v as { access_token?: unknown }).access_token;

/** The presented key, or null when there is none or the request is ambiguous or malformed. */
export function bearerToken(req: BearerRequest): string | null {
  const header = req.headers.authorization;
  if (typeof header !== 'string') return null;
  const parts = header.split(' ');
  if (parts.length !== 2 || !/^Bearer$/i.test(parts[0]!) || !parts[1]) return null;
  if (hasAccessToken(req.body) || hasAccessToken(req.query)) return null;
  return parts[1];
}
