import { HttpException } from '@nestjs/common';
import { toProblem } from './problem.filter.js';
import Stripe from 'stripe';

/** Shaped like the errors Fastify raises itself (@fastify/error: name, code, statusCode). */
const fastifyError = (code: string, statusCode: number, message: string) =>
  Object.assign(new Error(message), { name: 'FastifyError', code, statusCode });

describe('toProblem for Fastify body errors', () => {
  // How Nest's Fastify adapter hands them to filters: an HttpException with the error as cause.
  const wrapped = (e: ReturnType<typeof fastifyError>) =>
    new HttpException(e.message, e.statusCode, { cause: e });

  it.each([
    [
      fastifyError(
        'FST_ERR_CTP_INVALID_JSON_BODY',
        400,
        "Body is not valid JSON but content-type is set to 'application/json'",
      ),
      'The request body is not valid JSON.',
      'is not valid JSON',
    ],
    [
      fastifyError('FST_ERR_CTP_INVALID_MEDIA_TYPE', 415, 'Unsupported Media Type'),
      'Send the request body as application/json.',
      'must be sent as application/json',
    ],
    [
      fastifyError('FST_ERR_CTP_EMPTY_JSON_BODY', 400, 'Body cannot be empty'),
      'The request body is empty; send a JSON object.',
      'is empty; send a JSON object',
    ],
  ])('%s reads the same wrapped or not', (err, detail, reason) => {
    for (const thrown of [err, wrapped(err)]) {
      const { problem } = toProblem(thrown);
      expect(problem).toMatchObject({
        status: err.statusCode,
        detail,
        errors: [{ field: 'body', reason }],
      });
    }
  });

  it('leaves other HttpExceptions as they are', () => {
    const { problem } = toProblem(new HttpException('Sign in first.', 401));
    expect(problem).toMatchObject({ status: 401, detail: 'Sign in first.' });
    expect(problem.errors).toBeUndefined();
  });
});

describe('toProblem for the payments service', () => {
  // The payments SDK's own error classes, as its client throws them.
  const { errors } = Stripe;

  it('a refusal of our request to it is our fault: 500, never a 400 blaming the body', () => {
    for (const e of [
      new errors.StripeInvalidRequestError({ message: 'No such customer.', statusCode: 404 }),
      new errors.StripeInvalidRequestError({ message: 'Bad param.', statusCode: 400 }),
      new errors.StripeAuthenticationError({ message: 'Invalid key.', statusCode: 401 }),
      new errors.StripePermissionError({ message: 'Not allowed.', statusCode: 403 }),
    ]) {
      const { problem, headers } = toProblem(e);
      expect({ type: e.type, status: problem.status, errors: problem.errors }).toEqual({
        type: e.type,
        status: 500,
        errors: undefined,
      });
      expect(problem.type).toMatch(/\/internal$/);
      expect(headers).toEqual({});
    }
  });

  it('the service away, failing or busy is a 503 with Retry-After', () => {
    for (const e of [
      new errors.StripeConnectionError({ message: 'ECONNREFUSED' }),
      new errors.StripeAPIError({ message: 'Upstream failed.', statusCode: 500 }),
      new errors.StripeRateLimitError({ message: 'Too many.', statusCode: 429 }),
    ]) {
      const { problem, headers } = toProblem(e);
      expect([e.type, problem.status]).toEqual([e.type, 503]);
      expect(headers['Retry-After']).toBeDefined();
    }
  });
});
