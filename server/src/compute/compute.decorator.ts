// What every compute route shares: POST, 200, API key or console session, metering, limits and
// the documented problem responses (the ones every JSON route shares are added to the document
// in src/openapi-problems.ts; these are the compute routes' own).
import { applyDecorators, HttpCode, Post, UseGuards } from '@nestjs/common';
import { RouteConfig } from '@nestjs/platform-fastify';
import { ApiBody, ApiOkResponse, ApiOperation } from '@nestjs/swagger';
import { ApiKeyAuth } from '../common/decorators/access.decorator.js';
import { meteredTooManyRequests, problem } from '../common/decorators/problem-responses.js';
import { MeteredCallGuard } from '../plans/metered-call.guard.js';
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
    UseGuards(MeteredCallGuard),
    RouteConfig({ meter: endpoint } satisfies MeterRouteConfig),
    ApiOperation({ summary }),
    ApiBody({ type: body }),
    ApiOkResponse({ type: response }),
    ...(opts.gearIds
      ? [problem(404, "A gear id is not one of your organisation's; `errors` names the field.")]
      : []),
    problem(
      422,
      'A field is missing, of the wrong type or outside the range the schema gives; `errors` ' +
        'names each (array items as `gels[1].lossStops`, nested fields as `key.distance`).',
    ),
    meteredTooManyRequests(),
  );
}
