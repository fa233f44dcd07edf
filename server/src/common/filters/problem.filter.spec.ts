import { HttpException } from '@nestjs/common';
import { toProblem } from './problem.filter.js';

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
