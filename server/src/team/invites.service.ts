import { Inject, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { FastifyRequest } from 'fastify';
import { DataSource, IsNull, LessThanOrEqual, Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { assertPassword } from '../auth/auth.service.js';
import { hashPassword, verifyPassword } from '../auth/passwords.js';
import type { RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { SessionManager } from '../auth/session-manager.js';
import { AttemptThrottle, signInRules } from '../auth/attempt-throttle.service.js';
import { newLinkToken, sha256Hex } from '../auth/tokens.js';
import type { Role } from '../common/decorators/access.decorator.js';
import { DomainError } from '../common/errors/domain-error.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { MailService } from '../mail/mail.service.js';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { InviteEntity } from './invite.entity.js';
import { assertSeatForAccept, assertSeatForInvite, seatUsage } from './seats.js';

export const INVITE_TTL_MS = 7 * 24 * 3600 * 1000;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

@Injectable()
export class InvitesService {
  constructor(
    @InjectRepository(InviteEntity) private readonly invites: Repository<InviteEntity>,
    @InjectRepository(UserEntity) private readonly users: Repository<UserEntity>,
    @InjectRepository(OrganizationEntity) private readonly orgs: Repository<OrganizationEntity>,
    @InjectRepository(MembershipEntity) private readonly memberships: Repository<MembershipEntity>,
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly sessions: SessionManager,
    private readonly throttle: AttemptThrottle,
  ) {}

  list(organizationId: string) {
    return this.invites.find({
      where: { organizationId },
      relations: { invitedBy: true },
      order: { createdAt: 'DESC' },
      take: 200,
    });
  }

  async create(
    p: SessionPrincipal,
    email: string,
    role: Role,
    meta: RequestMeta,
  ): Promise<InviteEntity> {
    if (role === 'owner' && p.role !== 'owner') {
      throw new DomainError('forbidden', 'Only an owner can invite an owner.');
    }
    const existing = await this.users.findOneBy({ email });
    if (
      existing &&
      (await this.memberships.existsBy({ organizationId: p.organizationId, userId: existing.id }))
    ) {
      throw new DomainError('conflict', 'This person is already a member.', [
        { field: 'email', reason: 'is already a member' },
      ]);
    }
    const token = newLinkToken();
    const saved = await this.ds.transaction(async (m) => {
      // The organisation's row is locked first: concurrent invitations take seats one by one.
      const seats = await seatUsage(m, p.organizationId, { lock: true });
      // Expired invitations to the same address make way for the new one.
      await m.update(
        InviteEntity,
        {
          organizationId: p.organizationId,
          email,
          acceptedAt: IsNull(),
          canceledAt: IsNull(),
          expiresAt: LessThanOrEqual(new Date()),
        },
        { canceledAt: new Date() },
      );
      const pending = await m.findOneBy(InviteEntity, {
        organizationId: p.organizationId,
        email,
        acceptedAt: IsNull(),
        canceledAt: IsNull(),
      });
      if (pending) {
        throw new DomainError(
          'conflict',
          'This address already has a pending invitation; re-send it instead.',
          [{ field: 'email', reason: 'already has a pending invitation' }],
        );
      }
      assertSeatForInvite(seats);
      const now = new Date();
      return m.save(
        m.create(InviteEntity, {
          organizationId: p.organizationId,
          email,
          role,
          tokenHash: sha256Hex(token),
          invitedByUserId: p.userId,
          expiresAt: new Date(now.getTime() + INVITE_TTL_MS),
          lastSentAt: now,
        }),
      );
    });
    await this.sendMail(saved, token, p.userId);
    await this.record(p, 'invite.created', saved, meta);
    return this.get(p.organizationId, saved.id);
  }

  /** A fresh link (the old one stops working) and another seven days. */
  async resend(p: SessionPrincipal, id: string, meta: RequestMeta): Promise<InviteEntity> {
    const invite = await this.get(p.organizationId, id);
    this.assertOpen(invite);
    if (invite.role === 'owner' && p.role !== 'owner') {
      throw new DomainError('forbidden', 'Only an owner can re-send an owner invitation.');
    }
    const token = newLinkToken();
    await this.ds.transaction(async (m) => {
      // A pending invitation already holds its seat; an expired one takes a seat again.
      const seats = await seatUsage(m, p.organizationId, { lock: true, exceptInviteId: invite.id });
      const current = await m.findOneByOrFail(InviteEntity, { id: invite.id });
      this.assertOpen(current);
      if (current.expiresAt <= new Date()) assertSeatForInvite(seats);
      const now = new Date();
      await m.update(
        InviteEntity,
        { id: invite.id },
        {
          tokenHash: sha256Hex(token),
          lastSentAt: now,
          expiresAt: new Date(now.getTime() + INVITE_TTL_MS),
        },
      );
    });
    const fresh = await this.get(p.organizationId, id);
    await this.sendMail(fresh, token, p.userId);
    await this.record(p, 'invite.resent', fresh, meta);
    return fresh;
  }

  async cancel(p: SessionPrincipal, id: string, meta: RequestMeta): Promise<InviteEntity> {
    const invite = await this.get(p.organizationId, id);
    this.assertOpen(invite);
    await this.invites.update({ id: invite.id }, { canceledAt: new Date() });
    await this.record(p, 'invite.canceled', invite, meta);
    return this.get(p.organizationId, id);
  }

  async preview(token: string) {
    const invite = await this.valid(token);
    const org = await this.orgs.findOneByOrFail({ id: invite.organizationId });
    return {
      organizationName: org.name,
      email: invite.email,
      role: invite.role,
      expiresAt: invite.expiresAt.toISOString(),
      existingAccount: await this.users.existsBy({ email: invite.email }),
    };
  }

  /**
   * Accepts as: the signed-in user whose address was invited; an existing account (its password);
   * or a new account (name + password). Signs the caller in to the organisation.
   */
  async accept(
    req: FastifyRequest,
    input: { token: string; name?: string; password?: string },
    meta: RequestMeta,
  ) {
    const invite = await this.valid(input.token);
    let user = await this.users.findOneBy({ email: invite.email });
    const signedInAs = req.session?.userId;
    if (user && signedInAs !== user.id) {
      const rules = signInRules(invite.email, meta.ip);
      const wait = await this.throttle.retryAfter(rules);
      if (wait > 0) {
        throw new DomainError(
          'rate_limited',
          'Too many failed attempts. Wait before trying again.',
          [],
          { 'Retry-After': String(wait) },
        );
      }
      if (!input.password || !(await verifyPassword(user.passwordHash, input.password))) {
        await this.throttle.count(rules);
        throw new DomainError('invalid_input', 'Enter the password of the invited account.', [
          {
            field: 'password',
            reason: input.password ? 'is wrong' : 'is required for an existing account',
          },
        ]);
      }
    }
    let account: { name: string; passwordHash: string } | null = null;
    if (!user) {
      const problems = [
        ...(!input.name ? [{ field: 'name', reason: 'is required for a new account' }] : []),
        ...(!input.password
          ? [{ field: 'password', reason: 'is required for a new account' }]
          : []),
      ];
      if (problems.length)
        throw new DomainError('invalid_input', 'Choose a name and a password.', problems);
      assertPassword(input.password!, { email: invite.email, name: input.name! });
      account = { name: input.name!, passwordHash: await hashPassword(input.password!) };
    }
    // One transaction: the new account, the used invitation and the membership, or none of them.
    const joined = await this.join(invite, user?.id ?? null, account);
    user = await this.users.findOneByOrFail({ id: joined.userId });
    if (signedInAs === user.id) await this.sessions.switchOrganization(req, invite.organizationId);
    else await this.sessions.start(req, user.id, invite.organizationId);
    const org = await this.orgs.findOneByOrFail({ id: invite.organizationId });
    const p = { organizationId: invite.organizationId, userId: user.id };
    await this.audit.record({
      ...p,
      action: 'invite.accepted',
      actorUserId: user.id,
      targetType: 'invite',
      targetId: invite.id,
      meta,
    });
    await this.audit.record({
      ...p,
      action: 'member.joined',
      actorUserId: user.id,
      targetType: 'user',
      targetId: user.id,
      meta,
      metadata: { role: joined.role },
    });
    return { user, organization: org, role: joined.role };
  }

  private async join(
    invite: InviteEntity,
    existingUserId: string | null,
    account: { name: string; passwordHash: string } | null,
  ): Promise<{ userId: string; role: Role }> {
    return this.ds.transaction(async (m) => {
      // The organisation's row first: two acceptances racing for the last seat take turns.
      const seats = await seatUsage(m, invite.organizationId, { lock: true });
      // Single use: only one acceptance can flip accepted_at.
      const r: unknown[] = await m.query(
        `UPDATE invites SET accepted_at = now()
          WHERE id = $1 AND accepted_at IS NULL AND canceled_at IS NULL AND expires_at > now()
          RETURNING id`,
        [invite.id],
      );
      const rows = Array.isArray(r[0]) ? (r[0] as unknown[]) : r;
      if (!rows.length) throw invalid();
      const current = existingUserId
        ? await m.findOneBy(MembershipEntity, {
            organizationId: invite.organizationId,
            userId: existingUserId,
          })
        : null;
      // Already a member: keep the existing role; no new seat is taken.
      if (current) return { userId: current.userId, role: current.role };
      const org = await m.findOneByOrFail(OrganizationEntity, { id: invite.organizationId });
      assertSeatForAccept(seats, org.name, invite.expiresAt);
      let userId = existingUserId;
      if (!userId) {
        const created: { id: string }[] = await m.query(
          `INSERT INTO users (email, name, password_hash) VALUES ($1, $2, $3)
           ON CONFLICT DO NOTHING RETURNING id`,
          [invite.email, account!.name, account!.passwordHash],
        );
        if (!created[0]) {
          throw new DomainError(
            'conflict',
            'An account with this address was created meanwhile; sign in with it and accept again.',
            [{ field: 'token', reason: 'belongs to an address that now has an account' }],
          );
        }
        userId = created[0].id;
      }
      await m.insert(MembershipEntity, {
        organizationId: invite.organizationId,
        userId,
        role: invite.role,
      });
      return { userId, role: invite.role };
    });
  }

  private async valid(token: string): Promise<InviteEntity> {
    const invite = await this.invites.findOneBy({ tokenHash: sha256Hex(token) });
    if (!invite || invite.acceptedAt || invite.canceledAt || invite.expiresAt <= new Date())
      throw invalid();
    return invite;
  }

  private async get(organizationId: string, id: string): Promise<InviteEntity> {
    const invite = UUID.test(id)
      ? await this.invites.findOne({
          where: { id, organizationId },
          relations: { invitedBy: true },
        })
      : null;
    if (!invite) throw new DomainError('not_found', 'No such invitation in this organisation.');
    return invite;
  }

  private assertOpen(invite: InviteEntity) {
    if (invite.acceptedAt || invite.canceledAt) {
      throw new DomainError('conflict', 'This invitation was already accepted or canceled.');
    }
  }

  private async sendMail(invite: InviteEntity, token: string, inviterId: string) {
    const [org, inviter] = await Promise.all([
      this.orgs.findOneByOrFail({ id: invite.organizationId }),
      this.users.findOneBy({ id: inviterId }),
    ]);
    await this.mail.send({
      template: 'invite',
      to: invite.email,
      data: {
        organizationName: org.name,
        inviterName: inviter?.name ?? 'A team member',
        role: invite.role,
        link: `${this.config.publicUrl}/accept-invite?token=${encodeURIComponent(token)}`,
        expiresAt: invite.expiresAt.toUTCString(),
      },
    });
  }

  private async record(
    p: SessionPrincipal,
    action: 'invite.created' | 'invite.resent' | 'invite.canceled',
    i: InviteEntity,
    meta: RequestMeta,
  ) {
    await this.audit.record({
      organizationId: p.organizationId,
      action,
      actorUserId: p.userId,
      targetType: 'invite',
      targetId: i.id,
      meta,
      metadata: { email: i.email, role: i.role },
    });
  }
}

const invalid = () =>
  new DomainError('not_found', 'This invitation is invalid, already used, canceled or expired.', [
    { field: 'token', reason: 'is invalid, already used, canceled or expired' },
  ]);
