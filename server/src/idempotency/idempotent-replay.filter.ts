// Sends a stored answer again (an Idempotency-Key retry after the first request finished): the
// same status, body bytes and replayed headers, plus `Idempotency-Replayed: true`.
import { ArgumentsHost, Catch, ExceptionFilter } from '@nestjs/common';
import type { FastifyReply } from 'fastify';
import { IDEMPOTENCY_REPLAYED_HEADER } from './idempotency-header.js';
import { IdempotentReplay } from './idempotency.guard.js';

@Catch(IdempotentReplay)
export class IdempotentReplayFilter implements ExceptionFilter {
  catch(replay: IdempotentReplay, host: ArgumentsHost): void {
    const reply = host.switchToHttp().getResponse<FastifyReply>();
    const { status, headers, body } = replay.answer;
    void reply
      .status(status)
      .headers({ ...headers, [IDEMPOTENCY_REPLAYED_HEADER]: 'true' })
      .send(body);
  }
}
