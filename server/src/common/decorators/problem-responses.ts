// Documented problem responses: every refusal is RFC 9457 problem+json (the document's `Problem`
// schema). Routes state the refusals only they make (a 409 for a taken name, a 429 from a
// throttle); the ones every route of a kind shares (bad bodies, missing credentials, CSRF,
// unknown ids, an unavailable database) are added when the document is built
// (src/openapi-problems.ts), from the route's access rule and its parameters.
import { ApiResponse } from '@nestjs/swagger';

export const PROBLEM_CONTENT = {
  'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } },
};

export type HeaderDocs = Record<string, { description: string; schema: { type: string } }>;

export const RETRY_AFTER: HeaderDocs = {
  'Retry-After': {
    description: 'Seconds to wait before trying again.',
    schema: { type: 'integer' },
  },
};

/** What a metered route's 429 carries besides Retry-After (draft-ietf-httpapi-ratelimit-headers). */
export const RATE_LIMIT_HEADERS: HeaderDocs = {
  ...RETRY_AFTER,
  RateLimit: {
    description: 'Calls left in the window and seconds until it refills, e.g. `"key";r=0;t=1`.',
    schema: { type: 'string' },
  },
  'RateLimit-Policy': {
    description: 'The limit: burst size and window in seconds, e.g. `"key";q=100;w=2`.',
    schema: { type: 'string' },
  },
};

/** One documented problem response. */
export const problem = (status: number, description: string, headers?: HeaderDocs) =>
  ApiResponse({
    status,
    description,
    content: PROBLEM_CONTENT,
    ...(headers ? { headers } : {}),
  });

/** A 429 from a throttle; it always says when to come back (Retry-After). */
export const tooManyRequests = (description: string, headers: HeaderDocs = RETRY_AFTER) =>
  problem(429, description, headers);

/** The 429 of a metered route (computations, frame uploads): per-key rate or monthly quota. */
export const meteredTooManyRequests = () =>
  tooManyRequests(
    'Rate limited (type …/rate-limited; Retry-After, RateLimit, RateLimit-Policy) or the ' +
      'monthly quota is used up (type …/quota-exceeded, with resetAt and Retry-After).',
    RATE_LIMIT_HEADERS,
  );
