// Stores the answer of a request that holds an Idempotency-Key, as it is sent: a route-level
// Fastify onSend hook on the routes marked `@RouteConfig({ idempotent: true })` (the payload is
// already serialised there, so a replay sends the very same bytes). Written before the answer
// leaves, so a client that retries after reading it is replayed, never told "in progress".
//
// What is stored follows the draft ("respond with the result of the previously completed
// operation, success or an error"): 2xx answers and the 4xx that say the request itself is wrong
// (422 a field out of range, 404 an unknown gear id, 413/415 a body we cannot take). Not stored,
// so a retry with the same key runs again: 5xx (our fault: the retry may succeed), 429 (limits:
// nothing was done; retry after Retry-After), 401/403 (who may call, or a plan without the
// feature: an upgrade must not be masked by a stored refusal), 408/409/425 (timing).
import { Inject, Injectable, Logger } from '@nestjs/common';
import { HttpAdapterHost } from '@nestjs/core';
import type {
  FastifyInstance,
  onResponseHookHandler,
  onSendHookHandler,
  RouteOptions,
} from 'fastify';
import { appendRouteHook } from '../common/http/scoped-hooks.js';
import type { IdempotentRequest } from './idempotency.guard.js';
import {
  COMPUTE_IDEMPOTENCY_STALE_MS,
  IDEMPOTENCY_STALE_MS,
  IdempotencyService,
} from './idempotency.service.js';

export interface IdempotentRouteConfig {
  /**
   * `true`: the route may store something (an upload). Its answer is written with what it stores;
   * a key whose answer write failed stays in flight (a retry is told to wait, never run twice)
   * until it is stale (IDEMPOTENCY_STALE_MS, 10 minutes).
   * `'compute'`: the route changes nothing but the usage count. When the answer's write fails the
   * key is let go, and a key left in flight is stale after COMPUTE_IDEMPOTENCY_STALE_MS (30 s):
   * a retry then runs again (and is counted again) rather than getting 409 for ten minutes.
   */
  idempotent?: true | 'compute';
}

/** How long a key in flight on this route blocks a retry of the same request. */
export function staleMsFor(config: IdempotentRouteConfig | undefined): number {
  return config?.idempotent === 'compute' ? COMPUTE_IDEMPOTENCY_STALE_MS : IDEMPOTENCY_STALE_MS;
}

const NOT_STORED = new Set([401, 403, 408, 409, 425, 429]);

/** The Content-Type Fastify gives a JSON answer (an object sent without a schema). */
export const JSON_CONTENT_TYPE = 'application/json; charset=utf-8';

/** Whether an answer with this status is kept for replays. */
export function isStoredStatus(status: number): boolean {
  return (
    status >= 200 && status < 500 && !(status >= 300 && status < 400) && !NOT_STORED.has(status)
  );
}

/**
 * Headers replayed with the body: what describes the body and where a created thing is. Not the
 * RateLimit fields (they describe the bucket when the first request ran; a replay takes nothing
 * from it), not X-Request-Id (each request has its own), not the security headers (added to
 * every /v1 answer anyway), not Content-Length (recomputed).
 */
export const REPLAYED_HEADERS = [
  'content-type',
  'content-language',
  'location',
  'content-location',
];

@Injectable()
export class IdempotencyHook {
  private readonly logger = new Logger('Idempotency');

  constructor(
    host: HttpAdapterHost,
    @Inject(IdempotencyService) private readonly keys: IdempotencyService,
  ) {
    // Built before Nest adds the routes (at init), so the onRoute hook sees them all.
    host.httpAdapter
      ?.getInstance<FastifyInstance>()
      .addHook('onRoute', (route) => this.attach(route));
  }

  attach(route: RouteOptions): void {
    const kind = (route.config as IdempotentRouteConfig | undefined)?.idempotent;
    if (!kind) return;
    const onSend: onSendHookHandler = (req, reply, payload, done) => {
      const held = (req as IdempotentRequest).idempotency;
      if (!held || held.settled) return done(null, payload);
      held.settled = true;
      const status = reply.statusCode;
      const body =
        typeof payload === 'string'
          ? Buffer.from(payload)
          : Buffer.isBuffer(payload)
            ? payload
            : null;
      const write =
        body && isStoredStatus(status)
          ? this.keys.complete(held, { status, headers: replayedHeaders(reply.getHeaders()), body })
          : this.keys.release(held);
      // A failed write leaves the key in flight (a retry is told to wait, never run twice) until
      // it goes stale; the caller still gets this answer. A computation's key is let go instead
      // (best effort: the database may still be away, and then the short stale time frees it).
      write
        .catch(async (err: unknown) => {
          this.logger.warn(`idempotency key not settled: ${(err as Error).message}`);
          if (kind === 'compute') await this.keys.release(held);
        })
        .then(
          () => done(null, payload),
          (err: unknown) => {
            this.logger.warn(`idempotency key not let go: ${(err as Error).message}`);
            done(null, payload);
          },
        );
    };
    // An answer that never went through onSend (the connection closed first): let the key go.
    const onResponse: onResponseHookHandler = (req, _reply, done) => {
      const held = (req as IdempotentRequest).idempotency;
      if (held && !held.settled) {
        held.settled = true;
        this.keys.release(held).catch(() => undefined);
      }
      done();
    };
    appendRouteHook(route, 'onSend', onSend);
    appendRouteHook(route, 'onResponse', onResponse);
  }
}

function replayedHeaders(all: Record<string, unknown>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const name of REPLAYED_HEADERS) {
    const v = all[name];
    if (typeof v === 'string' || typeof v === 'number') out[name] = String(v);
  }
  return out;
}
