// Deny by default: a route without an access rule is refused, whoever calls it.
import { CanActivate, ExecutionContext, Inject, Injectable, Optional } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { FastifyRequest } from 'fastify';
import { ACCESS_KEY, AccessRule, Role } from '../decorators/access.decorator.js';
import { DomainError } from '../errors/domain-error.js';

export interface Principal {
  kind: 'session' | 'api-key';
  userId: string | null;
  organizationId: string;
  role: Role | null;
  keyId: string | null;
  keyMode: 'test' | 'live' | null;
}

/** Resolves the caller from a request; provided by the auth module. */
export interface Authenticator {
  fromSession(req: FastifyRequest): Promise<Principal | null>;
  fromApiKey(req: FastifyRequest): Promise<Principal | null>;
}

export const AUTHENTICATOR = Symbol('AUTHENTICATOR');

export type RequestWithPrincipal = FastifyRequest & { principal?: Principal };

@Injectable()
export class AccessGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    @Optional() @Inject(AUTHENTICATOR) private readonly auth?: Authenticator,
  ) {}

  async canActivate(ctx: ExecutionContext): Promise<boolean> {
    const rule = this.reflector.getAllAndOverride<AccessRule | undefined>(ACCESS_KEY, [
      ctx.getHandler(),
      ctx.getClass(),
    ]);
    if (!rule) throw new DomainError('forbidden', 'This route has no access rule.');
    if (rule.kind === 'public') return true;
    const req = ctx.switchToHttp().getRequest<RequestWithPrincipal>();
    const hasBearer = /^Bearer\s/i.test(req.headers.authorization ?? '');
    let principal: Principal | null;
    if (rule.kind === 'api-key-or-session' && hasBearer) {
      principal = (await this.auth?.fromApiKey(req)) ?? null;
      if (!principal) {
        throw new DomainError(
          'unauthenticated',
          'The API key is missing, unknown or revoked.',
          [],
          {
            'WWW-Authenticate': 'Bearer realm="lumenwright", error="invalid_token"',
          },
        );
      }
      req.principal = principal;
      return true;
    }
    principal = (await this.auth?.fromSession(req)) ?? null;
    if (!principal) {
      const headers: Record<string, string> =
        rule.kind === 'api-key-or-session'
          ? { 'WWW-Authenticate': 'Bearer realm="lumenwright"' }
          : {};
      const detail =
        rule.kind === 'api-key-or-session'
          ? 'Sign in or send an API key.'
          : hasBearer
            ? 'This route takes a signed-in console session; API keys cannot use it.'
            : 'Sign in first.';
      throw new DomainError('unauthenticated', detail, [], headers);
    }
    if (!principal.role || !rule.roles.includes(principal.role)) {
      throw new DomainError('forbidden', 'Your role does not allow this.');
    }
    req.principal = principal;
    return true;
  }
}
