// What every compute route shares: POST, 200, API key or console session, Idempotency-Key,
// metering, limits and the documented problem responses (the ones every JSON route shares are added to the document
// in src/openapi-problems.ts; these are the compute routes' own).
import { applyDecorators, HttpCode, Post } from '@nestjs/common';
import { RouteConfig } from '@nestjs/platform-fastify';
import { ApiBody, ApiOkResponse, ApiOperation } from '@nestjs/swagger';
import { ApiKeyAuth } from '../common/decorators/access.decorator.js';
import { meteredTooManyRequests, problem } from '../common/decorators/problem-responses.js';
import type { IdempotentRouteConfig } from '../idempotency/idempotency.hook.js';
import {
  IDEMPOTENCY_REPLAYED_DOC,
  IdempotentMeteredCall,
} from '../idempotency/idempotent.decorator.js';
import type { MeterRouteConfig } from '../usage/metering.hook.js';

export function ComputeRoute(
  endpoint: string,
  summary: string,
  body: new () => object,
  response: new () => object,
  opts: { gearIds?: boolean } = {},
) {
  return applyDecorators(
    Post(endpoint),
    HttpCode(200),
    ApiKeyAuth(),
    IdempotentMeteredCall(),
    // 'compute': nothing stored but the usage count, so a key whose answer write failed is let
    // go and a stuck one is stale after 30 s (idempotency.hook.ts).
    RouteConfig({ meter: endpoint, idempotent: 'compute' } satisfies MeterRouteConfig &
      IdempotentRouteConfig),
    ApiOperation({ summary }),
    ApiBody({ type: body }),
    ApiOkResponse({ type: response, headers: IDEMPOTENCY_REPLAYED_DOC }),
    ...(opts.gearIds
      ? [problem(404, "A gear id is not one of your organisation's; `errors` names the field.")]
      : []),
    problem(
      422,
      'A field is missing, of the wrong type or outside the range the schema gives; `errors` ' +
        'names each (array items as `gels[1].lossStops`, nested fields as `key.distance`). Or ' +
        'the Idempotency-Key is malformed (…/invalid-input) or was used with a different ' +
        'request (…/idempotency-key-reused); `errors` names the header.',
    ),
    meteredTooManyRequests(),
  );
}
