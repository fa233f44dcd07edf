// Reads (and frame deletions) open to API keys: the key's rate limit applies (shared with its computations), documented.
import { applyDecorators, UseGuards } from '@nestjs/common';
import { RATE_LIMIT_HEADERS, tooManyRequests } from '../common/decorators/problem-responses.js';
import { KeyReadGuard } from './metered-call.guard.js';

/** `what`: the kind of call, for the documented 429 ("Reads", "Deletions"). */
export const KeyReadLimited = (what = 'Reads') =>
  applyDecorators(
    UseGuards(KeyReadGuard),
    tooManyRequests(
      "With an API key: the key's rate limit, shared with its computations (type …/rate-limited; " +
        `Retry-After, RateLimit, RateLimit-Policy). ${what} use no quota.`,
      RATE_LIMIT_HEADERS,
    ),
  );
