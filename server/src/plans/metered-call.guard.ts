// Per-key rate limits (token bucket through @nestjs/throttler's storage interface), the monthly
// quota and metering back-pressure, for every metered route (computations and frame uploads).
// Runs after the global AccessGuard, so it is keyed by the API key (or, for console sessions,
// the user) rather than by address.
import { CanActivate, ExecutionContext, Inject, Injectable } from '@nestjs/common';
import type { ThrottlerStorage } from '@nestjs/throttler';
import type { FastifyReply } from 'fastify';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal, RequestWithPrincipal } from '../common/guards/access.guard.js';
import { isPromise, type MaybePromise } from '../common/maybe-promise.js';
import type { MeteredRequestExtras } from '../usage/usage-event.js';
import { UsageWriter } from '../usage/usage-writer.service.js';
import { CONSOLE_RATE, TEST_KEY_RATE } from './plan-catalogue.js';
import type { PlanEntity } from './plan.entity.js';
import { PlansService } from './plans.service.js';
import { QuotaService } from './quota.service.js';
import { MemoryRateLimitStorage, RATE_LIMIT_STORAGE } from './rate-limit.storage.js';

export function rateFor(plan: PlanEntity, p: Principal): { rate: number; burst: number } {
  if (p.kind === 'session') return { rate: CONSOLE_RATE.ratePerSecond, burst: CONSOLE_RATE.burst };
  if (p.keyMode === 'test') {
    return {
      rate: Math.min(plan.ratePerSecond, TEST_KEY_RATE.ratePerSecond),
      burst: Math.min(plan.burst, TEST_KEY_RATE.burst),
    };
  }
  return { rate: plan.ratePerSecond, burst: plan.burst };
}

@Injectable()
export class MeteredCallGuard implements CanActivate {
  constructor(
    @Inject(RATE_LIMIT_STORAGE) private readonly buckets: ThrottlerStorage,
    private readonly plans: PlansService,
    private readonly quota: QuotaService,
    private readonly usage: UsageWriter,
  ) {}

  /**
   * Synchronous (no promise) when nothing needs a round trip: room in the usage buffer, the plan
   * cached, in-memory buckets and calls left in the quota lease; each step waits only when its
   * answer is not at hand.
   */
  canActivate(ctx: ExecutionContext): MaybePromise<boolean> {
    const http = ctx.switchToHttp();
    const req = http.getRequest<RequestWithPrincipal & MeteredRequestExtras>();
    const reply = http.getResponse<FastifyReply>();
    const p = req.principal;
    if (!p) throw new DomainError('unauthenticated', 'Sign in or send an API key.');
    const room = this.usage.waitForRoom();
    if (room) return room.then(() => this.withPlan(req, reply, p));
    return this.withPlan(req, reply, p);
  }

  private withPlan(req: MeteredRequest, reply: FastifyReply, p: Principal): MaybePromise<boolean> {
    const plan =
      this.plans.cachedForOrganization(p.organizationId) ??
      this.plans.forOrganization(p.organizationId);
    return isPromise(plan)
      ? plan.then((loaded) => this.limit(req, reply, p, loaded))
      : this.limit(req, reply, p, plan);
  }

  private limit(
    req: MeteredRequest,
    reply: FastifyReply,
    p: Principal,
    plan: PlanEntity,
  ): MaybePromise<boolean> {
    const { rate, burst } = rateFor(plan, p);
    const ttl = (1000 * burst) / rate;
    const key = p.kind === 'api-key' ? `k:${p.keyId}` : `u:${p.userId}`;
    const rec =
      this.buckets instanceof MemoryRateLimitStorage
        ? this.buckets.take(key, ttl, burst)
        : this.buckets.increment(key, ttl, burst, 0, 'key');
    return isPromise(rec)
      ? rec.then((r) => this.charge(req, reply, p, plan, rate, burst, r))
      : this.charge(req, reply, p, plan, rate, burst, rec);
  }

  private charge(
    req: MeteredRequest,
    reply: FastifyReply,
    p: Principal,
    plan: PlanEntity,
    rate: number,
    burst: number,
    rec: BucketRecord,
  ): MaybePromise<boolean> {
    const headers = {
      'RateLimit-Policy': `"key";q=${burst};w=${Math.max(1, Math.round(burst / rate))}`,
      RateLimit: `"key";r=${Math.max(0, burst - rec.totalHits)};t=${rec.timeToExpire}`,
    };
    if (rec.isBlocked) {
      throw new DomainError(
        'rate_limited',
        `This ${p.kind === 'api-key' ? 'key' : 'session'} is limited to ${rate} calls per second (bursts of ${burst}); retry after ${rec.timeToBlockExpire} s.`,
        [],
        { ...headers, 'Retry-After': String(rec.timeToBlockExpire) },
        { retryAfterSeconds: rec.timeToBlockExpire },
      );
    }
    void reply.headers(headers);
    const refund = this.quota.take(plan, p);
    return isPromise(refund) ? refund.then((r) => keepRefund(req, r)) : keepRefund(req, refund);
  }
}

type MeteredRequest = RequestWithPrincipal & MeteredRequestExtras;
type BucketRecord = Awaited<ReturnType<ThrottlerStorage['increment']>>;

function keepRefund(req: MeteredRequest, refund: (() => void) | null): true {
  if (refund) req.quotaRefund = refund;
  return true;
}
