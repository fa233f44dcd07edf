// Starting and ending console sessions (the store is PostgreSQL; see session.plugin.ts).
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { FastifyRequest } from 'fastify';
import { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';

@Injectable()
export class SessionManager {
  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  /** A fresh session id at every sign-in (no fixation), bound to the user and organisation. */
  async start(req: FastifyRequest, userId: string, organizationId: string): Promise<void> {
    // Requests carrying a Bearer key and no cookie get no session (see session.plugin.ts).
    if (!(req as { session?: unknown }).session) {
      throw new DomainError('invalid_input', 'Sign in without an Authorization header.', [
        { field: 'Authorization', reason: 'must be absent when signing in' },
      ]);
    }
    await req.session.regenerate();
    req.session.userId = userId;
    req.session.organizationId = organizationId;
    req.session.signedInAt = Date.now();
    await req.session.save();
  }

  async switchOrganization(req: FastifyRequest, organizationId: string): Promise<void> {
    req.session.organizationId = organizationId;
    await req.session.save();
  }

  async end(req: FastifyRequest): Promise<void> {
    if (req.session?.userId) await req.session.destroy();
  }

  /** Ends every session of a user, optionally keeping one (the caller's). */
  async endAllFor(userId: string, exceptSessionId?: string): Promise<number> {
    const rows: unknown[] = await this.ds.query(
      `DELETE FROM sessions WHERE sess->>'userId' = $1 AND ($2::text IS NULL OR sid <> $2) RETURNING sid`,
      [userId, exceptSessionId ?? null],
    );
    return Array.isArray(rows[0]) ? (rows[0] as unknown[]).length : rows.length;
  }
}
