// What every route taking Idempotency-Key shares: its guard before the metered-call guard (so a
// replay or a refused retry takes nothing from the rate limit or quota), the replay filter, and
// the documented header and refusals. The route also says `@RouteConfig({ idempotent: true })`
// (with its `meter`) so the answer is stored as it is sent (idempotency.hook.ts).
import { applyDecorators, UseFilters, UseGuards } from '@nestjs/common';
import { ApiHeader } from '@nestjs/swagger';
import { problem, RETRY_AFTER } from '../common/decorators/problem-responses.js';
import {
  IDEMPOTENCY_KEY_HEADER,
  IDEMPOTENCY_KEY_MAX,
  IDEMPOTENCY_REPLAYED_HEADER,
} from './idempotency-header.js';
import { IdempotentMeteredCallGuard } from './idempotency.guard.js';
import { IdempotentReplayFilter } from './idempotent-replay.filter.js';

export const IDEMPOTENCY_KEY_DOC =
  'Makes a retry safe (IETF draft "The Idempotency-Key HTTP Header Field"). The first request ' +
  'with a key runs; a retry with the same key and the same request (method, path and body, JSON ' +
  'compared in its RFC 8785 canonical form; for an upload, the file bytes and fields) within 24 hours gets the first answer again, byte for ' +
  `byte, with \`${IDEMPOTENCY_REPLAYED_HEADER}: true\`, and is not metered, rate limited, counted ` +
  'against the quota or billed again. Successes and client errors (4xx) are kept; 5xx, 429, ' +
  '401 and 403 are not, so a retry after them runs again. A retry while the first is still ' +
  'running gets 409 (…/idempotency-key-in-use, Retry-After); the same key with another request ' +
  'gets 422 (…/idempotency-key-reused). Keys are per API key (per user and organisation for the ' +
  `console): 1 to ${IDEMPOTENCY_KEY_MAX} printable ASCII characters, bare or as a quoted ` +
  'structured-field string; a random UUID is a good key.';

export const IDEMPOTENCY_REPLAYED_DOC = {
  [IDEMPOTENCY_REPLAYED_HEADER]: {
    description: `\`true\` when this is the stored answer to an earlier request with the same ${IDEMPOTENCY_KEY_HEADER}.`,
    schema: { type: 'string' },
  },
};

export function IdempotentMeteredCall() {
  return applyDecorators(
    UseGuards(IdempotentMeteredCallGuard),
    UseFilters(IdempotentReplayFilter),
    ApiHeader({
      name: IDEMPOTENCY_KEY_HEADER,
      required: false,
      description: IDEMPOTENCY_KEY_DOC,
      schema: { type: 'string', minLength: 1, example: '"5d0b6c1e-8f3a-4e52-9b7d-2a41c9e0f6b3"' },
    }),
    problem(
      409,
      `A request with the same ${IDEMPOTENCY_KEY_HEADER} is still running ` +
        '(type …/idempotency-key-in-use); retry after Retry-After for its answer.',
      RETRY_AFTER,
    ),
  );
}
