import { Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, EntityManager, Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import type { Role } from '../common/decorators/access.decorator.js';
import { DomainError } from '../common/errors/domain-error.js';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { seatUsage, type SeatUsage } from './seats.js';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

@Injectable()
export class TeamService {
  constructor(
    @InjectRepository(MembershipEntity) private readonly memberships: Repository<MembershipEntity>,
    @InjectDataSource() private readonly ds: DataSource,
    private readonly audit: AuditService,
  ) {}

  listMembers(organizationId: string) {
    return this.memberships.find({
      where: { organizationId },
      relations: { user: true },
      order: { createdAt: 'ASC' },
    });
  }

  /** Members and pending invitations against the plan's seats. */
  seats(organizationId: string): Promise<SeatUsage> {
    return seatUsage(this.ds, organizationId);
  }

  /**
   * Only owners grant or take away the owner role; an organisation always keeps an owner; nobody
   * changes their own role (another admin or an owner does; an owner may transfer ownership).
   */
  async changeRole(p: SessionPrincipal, userId: string, role: Role, meta: RequestMeta) {
    if (userId.toLowerCase() === p.userId.toLowerCase()) {
      throw new DomainError(
        'forbidden',
        p.role === 'owner'
          ? 'You cannot change your own role. To step down, transfer ownership to another member, or ask another owner to change your role.'
          : 'You cannot change your own role. Another admin or an owner can change it.',
        [{ field: 'userId', reason: 'is you' }],
      );
    }
    const updated = await this.ds.transaction(async (m) => {
      const target = await this.target(m, p.organizationId, userId);
      if ((target.role === 'owner' || role === 'owner') && p.role !== 'owner') {
        throw new DomainError('forbidden', 'Only an owner can grant or change the owner role.');
      }
      if (target.role === role) return { target, from: role };
      if (target.role === 'owner') await assertAnotherOwner(m, p.organizationId);
      const from = target.role;
      await m.update(MembershipEntity, { id: target.id }, { role });
      return { target: { ...target, role }, from };
    });
    if (updated.from !== role) {
      await this.audit.record({
        organizationId: p.organizationId,
        action: 'member.role_changed',
        actorUserId: p.userId,
        targetType: 'user',
        targetId: userId,
        meta,
        metadata: { from: updated.from, to: role },
      });
    }
    return this.memberships.findOneOrFail({
      where: { id: updated.target.id },
      relations: { user: true },
    });
  }

  async removeMember(p: SessionPrincipal, userId: string, meta: RequestMeta): Promise<void> {
    const removed = await this.ds.transaction(async (m) => {
      const target = await this.target(m, p.organizationId, userId);
      if (target.role === 'owner' && p.role !== 'owner') {
        throw new DomainError('forbidden', 'Only an owner can remove an owner.');
      }
      if (target.role === 'owner') await assertAnotherOwner(m, p.organizationId);
      await m.delete(MembershipEntity, { id: target.id });
      return target;
    });
    // Their sessions for this organisation stop at once: the guard re-reads the membership.
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'member.removed',
      actorUserId: p.userId,
      targetType: 'user',
      targetId: userId,
      meta,
      metadata: { role: removed.role },
    });
  }

  /** Makes `userId` an owner and the caller an admin. */
  async transferOwnership(p: SessionPrincipal, userId: string, meta: RequestMeta): Promise<void> {
    if (userId === p.userId) {
      throw new DomainError('invalid_input', 'You already own this organisation.', [
        { field: 'userId', reason: 'is you' },
      ]);
    }
    await this.ds.transaction(async (m) => {
      const target = await this.target(m, p.organizationId, userId);
      await m.update(MembershipEntity, { id: target.id }, { role: 'owner' });
      await m.update(
        MembershipEntity,
        { organizationId: p.organizationId, userId: p.userId },
        { role: 'admin' },
      );
    });
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'organization.ownership_transferred',
      actorUserId: p.userId,
      targetType: 'user',
      targetId: userId,
      meta,
    });
  }

  private async target(m: EntityManager, organizationId: string, userId: string) {
    const target = UUID.test(userId)
      ? await m.findOne(MembershipEntity, {
          where: { organizationId, userId },
          lock: { mode: 'pessimistic_write' },
        })
      : null;
    if (!target) throw new DomainError('not_found', 'No such member in this organisation.');
    return target;
  }
}

/** Locks the owner rows, so two concurrent demotions cannot leave no owner. */
async function assertAnotherOwner(m: EntityManager, organizationId: string) {
  const owners: unknown[] = await m.query(
    `SELECT id FROM memberships WHERE organization_id = $1 AND role = 'owner' FOR UPDATE`,
    [organizationId],
  );
  if (owners.length <= 1) {
    throw new DomainError(
      'conflict',
      'The last owner cannot be removed or demoted; make someone else owner first.',
    );
  }
}
