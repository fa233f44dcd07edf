// Reads open to API keys: the key's rate limit applies (shared with its computations), documented.
import { applyDecorators, UseGuards } from '@nestjs/common';
import { RATE_LIMIT_HEADERS, tooManyRequests } from '../common/decorators/problem-responses.js';
import { KeyReadGuard } from './metered-call.guard.js';

export const KeyReadLimited = () =>
  applyDecorators(
    UseGuards(KeyReadGuard),
    tooManyRequests(
      "With an API key: the key's rate limit, shared with its computations (type …/rate-limited; " +
        'Retry-After, RateLimit, RateLimit-Policy). Reads use no quota.',
      RATE_LIMIT_HEADERS,
    ),
  );
