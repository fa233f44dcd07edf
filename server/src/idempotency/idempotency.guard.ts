// Idempotency-Key on the metered POSTs: runs after the AccessGuard (it scopes keys by caller)
// and before the MeteredCallGuard, so a replayed or refused retry takes nothing from the rate
// limit or the monthly quota. Without the header it returns at once: one header lookup.
import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import {
  CanActivate,
  ExecutionContext,
  Inject,
  Injectable,
  SetMetadata,
  type Type,
} from '@nestjs/common';
import { ModuleRef, Reflector } from '@nestjs/core';
import type { FastifyRequest } from 'fastify';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal, RequestWithPrincipal } from '../common/guards/access.guard.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { KeyReadGuard, MeteredCallGuard } from '../plans/metered-call.guard.js';
import type { MeteredRequestExtras } from '../usage/usage-event.js';
import { IDEMPOTENCY_KEY_HEADER, parseIdempotencyKey } from './idempotency-header.js';
import { staleMsFor, type IdempotentRouteConfig } from './idempotency.hook.js';
import { IdempotencyService, type HeldKey, type StoredAnswer } from './idempotency.service.js';

/**
 * For a route whose handler reads the body itself (a multipart upload): reads it, leaves what it
 * read on the request for the handler, and returns what identifies it (the fingerprint's input).
 */
export type IdempotentBodyReader = (req: FastifyRequest, config: AppConfig) => Promise<string>;
/**
 * A provider whose `beforeRead` refuses a request that could never succeed (a plan without the
 * feature) before its body is read: without it a large upload would be read in full only to be
 * refused.
 */
export interface IdempotentBodyCheck {
  beforeRead(req: RequestWithPrincipal): Promise<void>;
}
interface IdempotentBodySpec {
  reader: IdempotentBodyReader;
  check?: Type<IdempotentBodyCheck>;
}
export const IDEMPOTENT_BODY = 'lumenwright:idempotent-body';
export const IdempotentBody = (reader: IdempotentBodyReader, check?: Type<IdempotentBodyCheck>) =>
  SetMetadata(IDEMPOTENT_BODY, { reader, check } satisfies IdempotentBodySpec);

export interface IdempotentRequest extends RequestWithPrincipal, MeteredRequestExtras {
  rawBody?: Buffer;
  /** The key this request holds: its answer is stored when it is sent (idempotency.hook.ts). */
  idempotency?: HeldKey & { settled?: boolean };
}

/** Thrown to answer with a stored response; IdempotentReplayFilter sends it. */
export class IdempotentReplay {
  constructor(readonly answer: StoredAnswer) {}
}

/** A caller's keys are its own: an API key's, or a console user's in one organisation. */
export function callerOf(p: Principal): string {
  return p.kind === 'api-key' ? `key:${p.keyId}` : `user:${p.userId}:${p.organizationId}`;
}

/** SHA-256 of the method, the route and the body: a retry must send the same request. */
export function fingerprintOf(method: string, route: string, body: Buffer | string): string {
  return createHash('sha256').update(`${method} ${route}\n`).update(body).digest('hex');
}

/**
 * What identifies a JSON body: its JSON Canonicalization Scheme form (RFC 8785), so a retry that
 * re-serialises the same request (another key order, spacing or number spelling) is the same
 * request. Other bodies count by their bytes.
 */
export function jsonBodyIdentity(req: IdempotentRequest): Buffer | string {
  const parsed: unknown = req.body;
  if (parsed !== undefined && req.rawBody !== undefined) return canonicalize(parsed) ?? '';
  return req.rawBody ?? '';
}

@Injectable()
export class IdempotencyGuard implements CanActivate {
  constructor(
    @Inject(Reflector) private readonly reflector: Reflector,
    private readonly keys: IdempotencyService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly moduleRef: ModuleRef,
  ) {}

  canActivate(ctx: ExecutionContext): boolean | Promise<boolean> {
    const req = ctx.switchToHttp().getRequest<IdempotentRequest>();
    const raw = req.headers['idempotency-key'];
    if (raw === undefined) return true;
    return this.claim(ctx, req, raw);
  }

  private async claim(
    ctx: ExecutionContext,
    req: IdempotentRequest,
    raw: string | string[],
  ): Promise<boolean> {
    const key = parseIdempotencyKey(raw)!;
    const p = req.principal;
    if (!p) throw new DomainError('unauthenticated', 'Sign in or send an API key.');
    const spec = this.reflector.get<IdempotentBodySpec | undefined>(
      IDEMPOTENT_BODY,
      ctx.getHandler(),
    );
    if (spec?.check) await this.moduleRef.get(spec.check, { strict: false }).beforeRead(req);
    const body = spec ? await spec.reader(req, this.config) : jsonBodyIdentity(req);
    const fingerprint = fingerprintOf(req.method, req.routeOptions.url ?? req.url, body);
    const claim = await this.keys.claim(
      callerOf(p),
      key,
      p.organizationId,
      fingerprint,
      staleMsFor(req.routeOptions.config as IdempotentRouteConfig | undefined),
    );
    switch (claim.kind) {
      case 'held':
        req.idempotency = claim.held;
        return true;
      case 'replay':
        req.idempotentReplay = true;
        throw new IdempotentReplay(claim.answer);
      case 'in-flight':
        throw new DomainError(
          'idempotency_key_in_use',
          `A request with this ${IDEMPOTENCY_KEY_HEADER} is still being processed; retry after Retry-After to get its answer.`,
          [{ field: IDEMPOTENCY_KEY_HEADER, reason: 'is held by a request still in progress' }],
          { 'Retry-After': '1' },
        );
      case 'mismatch':
        throw new DomainError(
          'idempotency_key_reused',
          `This ${IDEMPOTENCY_KEY_HEADER} was used with a different request (another body or endpoint) in the last 24 hours; send a new key for a new request.`,
          [{ field: IDEMPOTENCY_KEY_HEADER, reason: 'was already used for a different request' }],
        );
    }
  }
}

/**
 * Refusals before the work (about the key itself, or a plan without the feature): they did no
 * work, but they still cost the caller a token.
 */
const KEY_REFUSALS = new Set([
  'idempotency_key_in_use',
  'idempotency_key_reused',
  'invalid_input',
  'forbidden',
]);

/**
 * The metered routes' one guard: Idempotency-Key (above), then the metered call's rate limit and
 * quota. One guard rather than two, so a call without the header pays a header lookup and
 * nothing else: Nest awaits each guard in turn. A replay takes nothing from the rate limit; a
 * refusal of the key (in use, reused, malformed) takes one token like a read (no quota), so a
 * loop of clashing retries is limited like any other loop of calls.
 */
@Injectable()
export class IdempotentMeteredCallGuard implements CanActivate {
  constructor(
    private readonly idempotency: IdempotencyGuard,
    private readonly metered: MeteredCallGuard,
    private readonly refusals: KeyReadGuard,
  ) {}

  canActivate(ctx: ExecutionContext): boolean | Promise<boolean> {
    const req = ctx.switchToHttp().getRequest<IdempotentRequest>();
    if (req.headers['idempotency-key'] === undefined) return this.metered.canActivate(ctx);
    return Promise.resolve()
      .then(() => this.idempotency.canActivate(ctx))
      .then(
        (ok) => (ok ? this.metered.canActivate(ctx) : false),
        async (err: unknown) => {
          if (err instanceof DomainError && KEY_REFUSALS.has(err.code)) {
            await this.refusals.canActivate(ctx); // a 429 here replaces the refusal
          }
          throw err;
        },
      );
  }
}
