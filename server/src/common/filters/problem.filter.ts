// One filter renders every error as RFC 9457 problem+json, with the request id for support.
import {
  ArgumentsHost,
  Catch,
  ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
  NotFoundException,
} from '@nestjs/common';
import type { FastifyReply, FastifyRequest } from 'fastify';
import '../http/allowed-methods.js';
import { isDatabaseUnavailable } from '../errors/transient.js';
import { DomainError, FieldProblem, STATUS_BY_CODE } from '../errors/domain-error.js';

export const PROBLEM_BASE = 'https://lumenwright.test/problems/';

export interface Problem {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  requestId?: string;
  errors?: FieldProblem[];
  [k: string]: unknown;
}

const TITLES: Record<number, string> = {
  400: 'Bad request',
  401: 'Authentication required',
  403: 'Forbidden',
  404: 'Not found',
  405: 'Method not allowed',
  408: 'Request timeout',
  409: 'Conflict',
  413: 'Payload too large',
  414: 'URI too long',
  415: 'Unsupported media type',
  422: 'Invalid input',
  429: 'Too many requests',
  431: 'Request headers too large',
  500: 'Internal server error',
  503: 'Service unavailable',
};

const SLUG: Record<number, string> = {
  400: 'bad-request',
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not-found',
  405: 'method-not-allowed',
  408: 'request-timeout',
  409: 'conflict',
  413: 'payload-too-large',
  414: 'uri-too-long',
  415: 'unsupported-media-type',
  422: 'invalid-input',
  429: 'rate-limited',
  431: 'headers-too-large',
  500: 'internal',
  503: 'unavailable',
};

function unavailable(detail: string): { problem: Problem; headers: Record<string, string> } {
  return {
    problem: { type: PROBLEM_BASE + 'unavailable', title: TITLES[503]!, status: 503, detail },
    headers: { 'Retry-After': '5' },
  };
}

/** What a Fastify body error says: the detail sentence and the reason given for `body`. */
const FASTIFY_BODY_ERRORS: Record<string, { detail: string; reason: string }> = {
  FST_ERR_CTP_BODY_TOO_LARGE: {
    detail: 'The request body is larger than the limit.',
    reason: 'is larger than the limit',
  },
  FST_ERR_CTP_INVALID_MEDIA_TYPE: {
    detail: 'Send the request body as application/json.',
    reason: 'must be sent as application/json',
  },
  FST_ERR_CTP_EMPTY_JSON_BODY: {
    detail: 'The request body is empty; send a JSON object.',
    reason: 'is empty; send a JSON object',
  },
  FST_ERR_CTP_INVALID_JSON_BODY: {
    detail: 'The request body is not valid JSON.',
    reason: 'is not valid JSON',
  },
};

type FastifyClientError = { statusCode: number; code?: string; message?: string };

/** A 4xx error Fastify raised itself (it carries `statusCode` and an `FST_` code). */
function isFastifyClientError(e: unknown): e is FastifyClientError {
  const f = e as { statusCode?: unknown; code?: unknown } | null | undefined;
  return (
    typeof f?.statusCode === 'number' &&
    f.statusCode >= 400 &&
    f.statusCode < 500 &&
    typeof f.code === 'string' &&
    f.code.startsWith('FST_')
  );
}

/** Turns anything thrown into a Problem (pure; exported for unit tests). */
export function toProblem(err: unknown): { problem: Problem; headers: Record<string, string> } {
  // Nest's Fastify adapter wraps Fastify's own 4xx errors in an HttpException (the original is
  // its cause): answer those in our words, like the unwrapped ones below.
  if (err instanceof HttpException && isFastifyClientError(err.cause)) {
    return toProblem(err.cause);
  }
  if (err instanceof DomainError) {
    const status = STATUS_BY_CODE[err.code];
    return {
      problem: {
        type: PROBLEM_BASE + err.code.replace(/_/g, '-'),
        title: TITLES[status] ?? 'Error',
        status,
        detail: err.message,
        ...(err.errors.length ? { errors: err.errors } : {}),
        ...err.extra,
      },
      headers: err.headers,
    };
  }
  if (err instanceof HttpException) {
    const status = err.getStatus();
    const body = err.getResponse();
    const detail =
      typeof body === 'string'
        ? body
        : typeof (body as { message?: unknown }).message === 'string'
          ? (body as { message: string }).message
          : err.message;
    let errors = (body as { errors?: FieldProblem[] }).errors;
    // A body Fastify could not parse: name the field, as every other 400 does.
    if (!errors && (status === 400 || status === 415)) errors = [{ field: 'body', reason: detail }];
    // Health checks (terminus) carry the state of each dependency: keep it.
    const checks = (body as { details?: Record<string, unknown> }).details;
    const down = checks
      ? Object.entries(checks)
          .filter(([, v]) => (v as { status?: string }).status !== 'up')
          .map(([k]) => k)
      : [];
    return {
      problem: {
        type: PROBLEM_BASE + (SLUG[status] ?? 'error'),
        title: TITLES[status] ?? 'Error',
        status,
        detail: down.length ? `Down: ${down.join(', ')}.` : detail,
        ...(errors ? { errors } : {}),
        ...(checks ? { checks } : {}),
      },
      headers: status === 503 ? { 'Retry-After': '5' } : {},
    };
  }
  if (isDatabaseUnavailable(err)) {
    return unavailable('The database is not answering; try again in a few seconds.');
  }
  const typed = err as { type?: unknown; name?: unknown };
  const paymentsError = typeof typed?.type === 'string' ? typed.type : String(typed?.name ?? '');
  if (PAYMENTS_BUSY.has(paymentsError)) {
    return unavailable('The payments service is not answering; try again in a few minutes.');
  }
  // Any other refusal of the payments service (it does not know a customer we stored, it refused
  // our credentials) is our request to it going wrong, not the caller's: it carries a 4xx status
  // of its own, which must not be passed on as if the caller's body were at fault.
  if (PAYMENTS_ERROR.test(paymentsError)) return internalProblem();
  // Fastify's own errors (body too large, bad JSON, bad content type) carry statusCode.
  const e = err as { statusCode?: number; code?: string; message?: string };
  if (typeof e?.statusCode === 'number' && e.statusCode >= 400 && e.statusCode < 500) {
    const status = e.statusCode;
    const known =
      (e.code ? FASTIFY_BODY_ERRORS[e.code] : undefined) ??
      (status === 400 && /JSON/i.test(e.message ?? '')
        ? FASTIFY_BODY_ERRORS.FST_ERR_CTP_INVALID_JSON_BODY
        : undefined);
    const detail = known?.detail ?? e.message ?? 'Bad request';
    return {
      problem: {
        type: PROBLEM_BASE + (SLUG[status] ?? 'bad-request'),
        title: TITLES[status] ?? 'Bad request',
        status,
        detail,
        ...(status === 400 || status === 415
          ? { errors: [{ field: 'body', reason: known?.reason ?? detail }] }
          : {}),
      },
      headers: {},
    };
  }
  return internalProblem();
}

/** The payments SDK's errors that mean "not now": the service is away, failing or busy. */
const PAYMENTS_BUSY = new Set(['StripeConnectionError', 'StripeAPIError', 'StripeRateLimitError']);
/** Every error class of the payments SDK (`type` is the class name). */
const PAYMENTS_ERROR = /^Stripe[A-Za-z]*Error$/;

function internalProblem(): { problem: Problem; headers: Record<string, string> } {
  return {
    problem: {
      type: PROBLEM_BASE + 'internal',
      title: TITLES[500]!,
      status: HttpStatus.INTERNAL_SERVER_ERROR,
      detail: 'Something went wrong on our side. Quote the request id if you contact support.',
    },
    headers: {},
  };
}

/**
 * A request that matched no route: 405 with Allow when the path answers to other methods
 * (RFC 9110 §15.5.6), else 404.
 */
export function noRouteProblem(
  req: FastifyRequest,
  path: string,
): { problem: Problem; headers: Record<string, string> } {
  const allow = req.server?.allowedMethods?.for(path) ?? [];
  if (allow.length && !allow.includes(req.method)) {
    return {
      problem: {
        type: PROBLEM_BASE + SLUG[405],
        title: TITLES[405]!,
        status: 405,
        detail: `${path} does not take ${req.method}; it takes ${allow.join(', ')}.`,
      },
      headers: { Allow: allow.join(', ') },
    };
  }
  return toProblem({ statusCode: 404, message: `No route for ${req.method} ${path}` });
}

@Catch()
export class ProblemFilter implements ExceptionFilter {
  private readonly logger = new Logger('ProblemFilter');

  catch(err: unknown, host: ArgumentsHost): void {
    const ctx = host.switchToHttp();
    const req = ctx.getRequest<FastifyRequest>();
    const reply = ctx.getResponse<FastifyReply>();
    const path = req.url?.split('?')[0] ?? '/';
    // Nest's handler for requests no route matched throws "Cannot <METHOD> <url>".
    const noRoute =
      err instanceof NotFoundException && err.message.startsWith(`Cannot ${req.method} `);
    const { problem, headers } = noRoute ? noRouteProblem(req, path) : toProblem(err);
    problem.instance = path;
    problem.requestId = String(req.id);
    if (problem.status >= 500) {
      this.logger.error({ err, requestId: req.id }, 'unhandled error');
    }
    for (const [k, v] of Object.entries(headers)) void reply.header(k, v);
    void reply.status(problem.status).type('application/problem+json').send(problem);
  }
}
