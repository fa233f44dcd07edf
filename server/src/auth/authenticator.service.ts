// The Authenticator the global AccessGuard calls: console sessions and bearer API keys.
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { FastifyRequest } from 'fastify';
import { DataSource } from 'typeorm';
import { BearerStrategy } from '../api-keys/bearer.strategy.js';
import type { Role } from '../common/decorators/access.decorator.js';
import type { Authenticator, Principal } from '../common/guards/access.guard.js';
import { SESSION_ABSOLUTE_MS } from './session.plugin.js';

@Injectable()
export class AccountsAuthenticator implements Authenticator {
  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    private readonly bearer: BearerStrategy,
  ) {}

  /** The session's user and organisation; the role is read fresh so changes apply at once. */
  async fromSession(req: FastifyRequest): Promise<Principal | null> {
    const s = (req as { session?: FastifyRequest['session'] }).session;
    if (!s?.userId || !s.organizationId) return null;
    if (!s.signedInAt || Date.now() - s.signedInAt > SESSION_ABSOLUTE_MS) {
      await s.destroy().catch(() => undefined);
      return null;
    }
    const rows: { role: Role }[] = await this.ds.query(
      `SELECT role FROM memberships WHERE user_id = $1 AND organization_id = $2`,
      [s.userId, s.organizationId],
    );
    const role = rows[0]?.role;
    if (!role) return null; // removed from the organisation (or it was deleted)
    return {
      kind: 'session',
      userId: s.userId,
      organizationId: s.organizationId,
      role,
      keyId: null,
      keyMode: null,
    };
  }

  /** passport-http-bearer (registered through @nestjs/passport) validates the key. */
  fromApiKey(req: FastifyRequest): Promise<Principal | null> {
    return this.bearer.check(req);
  }
}
