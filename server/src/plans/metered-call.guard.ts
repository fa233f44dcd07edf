// Per-key rate limits (token bucket through @nestjs/throttler's storage interface), the monthly
// quota and metering back-pressure, for every metered route (computations and frame uploads).
// Runs after the global AccessGuard, so it is keyed by the API key (or, for console sessions,
// the user) rather than by address.
import { CanActivate, ExecutionContext, Inject, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { ThrottlerGuard, ThrottlerStorage } from '@nestjs/throttler';
import type { FastifyReply } from 'fastify';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal, RequestWithPrincipal } from '../common/guards/access.guard.js';
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
export class MeteredCallGuard extends ThrottlerGuard {
  constructor(
    @Inject(RATE_LIMIT_STORAGE) private readonly buckets: ThrottlerStorage,
    // Explicit: the parent's parameter decorators would otherwise claim this slot.
    @Inject(Reflector) reflector: Reflector,
    private readonly plans: PlansService,
    private readonly quota: QuotaService,
    private readonly usage: UsageWriter,
  ) {
    super({ throttlers: [{ name: 'key', ttl: 1000, limit: 1 }] }, buckets, reflector);
  }

  override async canActivate(ctx: ExecutionContext): Promise<boolean> {
    const http = ctx.switchToHttp();
    const req = http.getRequest<RequestWithPrincipal & MeteredRequestExtras>();
    const reply = http.getResponse<FastifyReply>();
    const p = req.principal;
    if (!p) throw new DomainError('unauthenticated', 'Sign in or send an API key.');
    const room = this.usage.waitForRoom();
    if (room) await room;
    const plan = await this.plans.forOrganization(p.organizationId);
    const limit = takeFromBucket(this.buckets, plan, p);
    void reply.headers(limit instanceof Promise ? await limit : limit);
    const refund = await this.quota.take(plan, p);
    if (refund) req.quotaRefund = refund;
    return true;
  }
}

/**
 * Takes one call from the caller's token bucket: the RateLimit headers to send, or a 429 problem
 * when the bucket is empty. The in-memory store answers at once (no promise on the hot path).
 */
export function takeFromBucket(
  buckets: ThrottlerStorage,
  plan: PlanEntity,
  p: Principal,
): Record<string, string> | Promise<Record<string, string>> {
  const { rate, burst } = rateFor(plan, p);
  const ttl = (1000 * burst) / rate;
  const key = p.kind === 'api-key' ? `k:${p.keyId}` : `u:${p.userId}`;
  if (buckets instanceof MemoryRateLimitStorage) {
    return bucketAnswer(buckets.take(key, ttl, burst), rate, burst, p);
  }
  return buckets
    .increment(key, ttl, burst, 0, 'key')
    .then((rec) => bucketAnswer(rec, rate, burst, p));
}

function bucketAnswer(
  rec: { totalHits: number; timeToExpire: number; isBlocked: boolean; timeToBlockExpire: number },
  rate: number,
  burst: number,
  p: Principal,
): Record<string, string> {
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
  return headers;
}

/**
 * Reads made with an API key (the gear list, test frames) share the key's rate limit with its
 * computations, so a loop of reads cannot run unbounded; they use no quota and are not metered.
 * Console sessions pass: their reads are the console's own pages.
 */
@Injectable()
export class KeyReadGuard implements CanActivate {
  constructor(
    @Inject(RATE_LIMIT_STORAGE) private readonly buckets: ThrottlerStorage,
    private readonly plans: PlansService,
  ) {}

  async canActivate(ctx: ExecutionContext): Promise<boolean> {
    const http = ctx.switchToHttp();
    const p = http.getRequest<RequestWithPrincipal>().principal;
    if (p?.kind !== 'api-key') return true;
    const plan = await this.plans.forOrganization(p.organizationId);
    const limit = takeFromBucket(this.buckets, plan, p);
    void http.getResponse<FastifyReply>().headers(limit instanceof Promise ? await limit : limit);
    return true;
  }
}
