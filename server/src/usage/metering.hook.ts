// Meters every compute call, whatever its outcome (including bodies Fastify refuses before Nest
// sees them: too large, not JSON): a route-level Fastify onResponse hook, attached as each route
// marked with `@RouteConfig({ meter: '<endpoint>' })` is added. It runs after the response is
// sent, so it costs the caller nothing; the event goes to the batch writer. Other routes carry no
// metering hook at all.
import { Inject, Injectable, Optional } from '@nestjs/common';
import { HttpAdapterHost } from '@nestjs/core';
import type {
  FastifyInstance,
  FastifyReply,
  FastifyRequest,
  onResponseHookHandler,
  RouteOptions,
} from 'fastify';
import {
  AUTHENTICATOR,
  type Authenticator,
  type Principal,
  type RequestWithPrincipal,
} from '../common/guards/access.guard.js';
import type { MeteredRequestExtras, UsageEvent, UsageSource } from './usage-event.js';
import { UsageWriter } from './usage-writer.service.js';
import { appendRouteHook } from '../common/http/scoped-hooks.js';

export interface MeterRouteConfig {
  meter?: string;
}

export function sourceOf(p: Principal): UsageSource {
  if (p.kind === 'session') return 'console';
  return p.keyMode === 'live' ? 'live' : 'test';
}

/** Live keys bill one unit per successful call; test keys and the console are free. */
export function billableUnits(p: Principal, status: number): number {
  return p.kind === 'api-key' && p.keyMode === 'live' && status >= 200 && status < 300 ? 1 : 0;
}

@Injectable()
export class MeteringHook {
  constructor(
    host: HttpAdapterHost,
    private readonly writer: UsageWriter,
    @Optional() @Inject(AUTHENTICATOR) private readonly auth?: Authenticator,
  ) {
    // Providers are built before Nest adds the routes (at init), so the onRoute hook sees them all.
    host.httpAdapter
      ?.getInstance<FastifyInstance>()
      .addHook('onRoute', (route) => this.attach(route));
  }

  /** Adds the metering hook to a metered route's own onResponse hooks. */
  attach(route: RouteOptions): void {
    const endpoint = (route.config as MeterRouteConfig | undefined)?.meter;
    if (!endpoint) return;
    const hook: onResponseHookHandler = (req, reply, done) => {
      this.meter(endpoint, req as RequestWithPrincipal, reply);
      done();
    };
    appendRouteHook(route, 'onResponse', hook);
  }

  private meter(endpoint: string, req: RequestWithPrincipal, reply: FastifyReply) {
    // A replayed answer (Idempotency-Key) was metered when it was first made.
    if ((req as MeteredRequestExtras).idempotentReplay) return;
    const status = reply.statusCode;
    const latencyMs = reply.elapsedTime;
    const occurredAt = new Date();
    // Only successful calls count against the monthly quota.
    if (status >= 300) (req as MeteredRequestExtras).quotaRefund?.();
    if (req.principal) {
      this.writer.record(this.event(req.principal, endpoint, status, latencyMs, occurredAt, req));
      return;
    }
    // Refused before authentication ran (body too large, bad JSON): attribute it if the key is good.
    if (!this.auth || !/^Bearer\s/i.test(req.headers.authorization ?? '') || status === 401) return;
    this.auth
      .fromApiKey(req as FastifyRequest)
      .then((p) => {
        if (p) this.writer.record(this.event(p, endpoint, status, latencyMs, occurredAt, req));
      })
      .catch(() => undefined);
  }

  private event(
    p: Principal,
    endpoint: string,
    status: number,
    latencyMs: number,
    occurredAt: Date,
    req: FastifyRequest,
  ): UsageEvent {
    return {
      occurredAt,
      organizationId: p.organizationId,
      keyId: p.keyId,
      userId: p.userId,
      source: sourceOf(p),
      endpoint,
      status,
      latencyMs,
      billableUnits: billableUnits(p, status),
      requestId: String(req.id),
    };
  }
}
