// What every compute route shares: POST, 200, API key or console session, metering, limits and
// the documented problem responses.
import { applyDecorators, HttpCode, Post, UseGuards } from '@nestjs/common';
import { RouteConfig } from '@nestjs/platform-fastify';
import { ApiBody, ApiOkResponse, ApiOperation, ApiResponse } from '@nestjs/swagger';
import { ApiKeyAuth } from '../common/decorators/access.decorator.js';
import { MeteredCallGuard } from '../plans/metered-call.guard.js';
import type { MeterRouteConfig } from '../usage/metering.hook.js';

const problem = (status: number, description: string) =>
  ApiResponse({
    status,
    description,
    content: { 'application/problem+json': { schema: { $ref: '#/components/schemas/Problem' } } },
  });

export function ComputeRoute(
  endpoint: string,
  summary: string,
  body: new () => object,
  response: new () => object,
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
    problem(400, 'The body is not JSON.'),
    problem(401, 'No API key or session, or the key is unknown, revoked or expired.'),
    problem(413, 'The body is larger than 100 kB.'),
    problem(422, 'A field is missing, of the wrong type or out of range; `errors` names each.'),
    problem(
      429,
      'Rate limited (type …/rate-limited; Retry-After, RateLimit, RateLimit-Policy) or the ' +
        'monthly quota is used up (type …/quota-exceeded, with resetAt).',
    ),
    problem(503, 'Temporarily unavailable; retry after Retry-After seconds.'),
  );
}
