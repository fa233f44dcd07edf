import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { EntityManager, Repository } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import type { RequestMeta } from '../auth/request-context.js';
import { AuditEventEntity } from './audit-event.entity.js';

export type AuditAction =
  | 'auth.sign_up'
  | 'auth.sign_in'
  | 'auth.sign_in_failed'
  | 'auth.sign_out'
  | 'auth.sign_out_everywhere'
  | 'auth.password_reset_requested'
  | 'auth.password_reset'
  | 'auth.password_changed'
  | 'auth.email_change_requested'
  | 'auth.email_changed'
  | 'auth.name_changed'
  | 'key.created'
  | 'key.revoked'
  | 'key.rotated'
  | 'member.role_changed'
  | 'member.removed'
  | 'member.joined'
  | 'invite.created'
  | 'invite.resent'
  | 'invite.canceled'
  | 'invite.accepted'
  | 'organization.renamed'
  | 'organization.ownership_transferred'
  | 'frame.deleted'
  | 'setup.deleted';

export interface AuditInput {
  organizationId: string | null;
  action: AuditAction;
  actorUserId?: string | null;
  actorKeyId?: string | null;
  targetType?: string;
  targetId?: string;
  meta?: RequestMeta;
  metadata?: Record<string, unknown>;
}

export interface AuditPage {
  data: AuditEventEntity[];
  nextCursor: string | null;
}

@Injectable()
export class AuditService {
  constructor(
    @InjectRepository(AuditEventEntity) private readonly repo: Repository<AuditEventEntity>,
  ) {}

  /** Records one event; given a transaction's manager, inside that transaction. */
  async record(e: AuditInput, within?: EntityManager): Promise<void> {
    const repo = within ? within.getRepository(AuditEventEntity) : this.repo;
    await repo.insert({
      organizationId: e.organizationId,
      action: e.action,
      actorUserId: e.actorUserId ?? null,
      actorKeyId: e.actorKeyId ?? null,
      targetType: e.targetType ?? null,
      targetId: e.targetId ?? null,
      ip: e.meta?.ip ?? null,
      userAgent: e.meta?.userAgent ?? null,
      metadata: (e.metadata ?? {}) as AuditEventEntity['metadata'] & object,
    } as never);
  }

  /** Newest first; the cursor encodes (createdAt, id) of the last row returned. */
  async list(
    organizationId: string,
    opts: { limit: number; cursor?: string; action?: string },
  ): Promise<AuditPage> {
    const qb = this.repo
      .createQueryBuilder('e')
      .where('e.organization_id = :organizationId', { organizationId })
      .orderBy('e.created_at', 'DESC')
      .addOrderBy('e.id', 'DESC')
      .take(opts.limit + 1);
    if (opts.action) qb.andWhere('e.action = :action', { action: opts.action });
    if (opts.cursor) {
      // Row comparison against the cursor row keeps PostgreSQL's microsecond ordering exact.
      qb.andWhere(
        '(e.created_at, e.id) < (SELECT c.created_at, c.id FROM audit_events c WHERE c.id = :cid)',
        { cid: decodeCursor(opts.cursor) },
      );
    }
    const rows = await qb.getMany();
    const more = rows.length > opts.limit;
    const data = more ? rows.slice(0, opts.limit) : rows;
    const last = data[data.length - 1];
    return { data, nextCursor: more && last ? encodeCursor(last.id) : null };
  }
}

/** Cursors are opaque to callers: the base64url of the last row's id. */
export function encodeCursor(id: string): string {
  return Buffer.from(id, 'utf8').toString('base64url');
}

export function decodeCursor(cursor: string): string {
  const id = Buffer.from(cursor, 'base64url').toString('utf8');
  if (/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/.test(id)) return id;
  throw new DomainError('invalid_input', 'The cursor is not valid.', [
    { field: 'cursor', reason: 'is not a cursor this API returned' },
  ]);
}
