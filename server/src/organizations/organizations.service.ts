import { Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, Repository } from 'typeorm';
import { KEY_CHANNEL } from '../api-keys/key-verifier.service.js';
import { AuditService } from '../audit/audit.service.js';
import type { RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { DomainError } from '../common/errors/domain-error.js';
import { OrganizationEntity } from './organization.entity.js';

@Injectable()
export class OrganizationsService {
  constructor(
    @InjectRepository(OrganizationEntity) private readonly orgs: Repository<OrganizationEntity>,
    @InjectDataSource() private readonly ds: DataSource,
    private readonly audit: AuditService,
  ) {}

  async get(id: string): Promise<OrganizationEntity> {
    const org = await this.orgs.findOneBy({ id });
    if (!org) throw new DomainError('not_found', 'No such organisation.');
    return org;
  }

  async rename(p: SessionPrincipal, name: string, meta: RequestMeta): Promise<OrganizationEntity> {
    const before = await this.get(p.organizationId);
    await this.orgs.update({ id: p.organizationId }, { name });
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'organization.renamed',
      actorUserId: p.userId,
      targetType: 'organization',
      targetId: p.organizationId,
      meta,
      metadata: { from: before.name, to: name },
    });
    return this.get(p.organizationId);
  }

  /** Cascades to memberships, invitations, keys and audit events (foreign keys ON DELETE CASCADE). */
  async delete(p: SessionPrincipal, confirmName: string): Promise<void> {
    const org = await this.get(p.organizationId);
    if (confirmName !== org.name) {
      throw new DomainError('invalid_input', "Type the organisation's exact name to confirm.", [
        { field: 'confirmName', reason: "does not match the organisation's name" },
      ]);
    }
    // A paid subscription would go on being charged by the payments service with nobody left to
    // stop it: it is cancelled first, on the Billing page, and then the studio can go.
    const [running] = (await this.ds.query(
      `SELECT plan_code AS "planCode", status FROM billing_subscriptions
        WHERE organization_id = $1 AND status NOT IN ('canceled', 'incomplete_expired')
        ORDER BY started_at DESC LIMIT 1`,
      [org.id],
    )) as { planCode: string; status: string }[];
    if (running) {
      throw new DomainError(
        'conflict',
        `This studio still has a ${running.status.replace(/_/g, ' ')} subscription (${running.planCode} plan). Cancel it on the Billing page first, so the payments service stops charging, then delete the studio.`,
        [{ field: 'subscription', reason: `is ${running.status}: cancel it first` }],
      );
    }
    try {
      await this.ds.transaction(async (m) => {
        await m.delete(OrganizationEntity, { id: org.id });
        // Every instance drops its cached keys (they no longer exist).
        await m.query(`SELECT pg_notify($1, '')`, [KEY_CHANNEL]);
      });
    } catch (e) {
      if ((e as { code?: string }).code === '23503') {
        throw new DomainError(
          'conflict',
          'Other records still refer to this organisation; contact support.',
        );
      }
      throw e;
    }
  }
}
