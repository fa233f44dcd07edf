// Param decorators for handlers: the authenticated caller and where the request came from.
import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { FastifyRequest } from 'fastify';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal, RequestWithPrincipal } from '../common/guards/access.guard.js';

export interface RequestMeta {
  ip: string | null;
  userAgent: string | null;
}

export function requestMeta(req: FastifyRequest): RequestMeta {
  const ua = req.headers['user-agent'];
  return { ip: req.ip ?? null, userAgent: typeof ua === 'string' ? ua.slice(0, 300) : null };
}

/** The caller the AccessGuard resolved (throws if the route is public). */
export const CurrentPrincipal = createParamDecorator((_: unknown, ctx: ExecutionContext) => {
  const req = ctx.switchToHttp().getRequest<RequestWithPrincipal>();
  if (!req.principal) throw new DomainError('unauthenticated', 'Sign in first.');
  return req.principal;
});

/** A session principal with its user id (management routes are session-only). */
export type SessionPrincipal = Principal & { userId: string };

export const Meta = createParamDecorator((_: unknown, ctx: ExecutionContext) =>
  requestMeta(ctx.switchToHttp().getRequest<FastifyRequest>()),
);
