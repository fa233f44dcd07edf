import type { LengthUnit } from '@lumenwright/shared';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, IsNull, Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { Role } from '../common/decorators/access.decorator.js';
import { DomainError } from '../common/errors/domain-error.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { MailService } from '../mail/mail.service.js';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { hashPassword, passwordProblems, verifyAgainstDummy, verifyPassword } from './passwords.js';
import type { RequestMeta } from './request-context.js';
import { SessionManager } from './session-manager.js';
import { AttemptThrottle, signInRules, WINDOW_SECONDS } from './attempt-throttle.service.js';
import { newLinkToken, sha256Hex } from './tokens.js';
import { UserTokenEntity } from './user-token.entity.js';

const RESET_TTL_MS = 60 * 60 * 1000;
const EMAIL_CHANGE_TTL_MS = 24 * 60 * 60 * 1000;

export interface SignedIn {
  user: UserEntity;
  organization: OrganizationEntity;
  role: Role;
}

@Injectable()
export class AuthService {
  private readonly logger = new Logger('AuthService');

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @InjectRepository(UserEntity) private readonly users: Repository<UserEntity>,
    @InjectRepository(MembershipEntity) private readonly memberships: Repository<MembershipEntity>,
    @InjectRepository(UserTokenEntity) private readonly tokens: Repository<UserTokenEntity>,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly throttle: AttemptThrottle,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    private readonly sessions: SessionManager,
  ) {}

  async signUp(
    input: { email: string; password: string; name: string; organizationName: string },
    meta: RequestMeta,
  ): Promise<SignedIn> {
    assertPassword(input.password, input);
    // Mass account creation from one address is slowed down (OWASP API6).
    const rule = {
      key: 'signup:ip:' + sha256Hex(meta.ip ?? 'unknown'),
      limit: this.config.signUpsPerIpPerHour,
      windowSeconds: 3600,
    };
    const wait = await this.throttle.retryAfter([rule]);
    if (wait > 0)
      throw throttled(wait, 'Too many new accounts from this address. Wait before trying again.');
    const passwordHash = await hashPassword(input.password);
    const result = await this.ds.transaction(async (m) => {
      if (await m.existsBy(UserEntity, { email: input.email })) throw emailTaken('email');
      const user = await m.save(
        m.create(UserEntity, { email: input.email, name: input.name, passwordHash }),
      );
      const organization = await m.save(
        m.create(OrganizationEntity, { name: input.organizationName }),
      );
      await m.insert(MembershipEntity, {
        organizationId: organization.id,
        userId: user.id,
        role: 'owner',
      });
      return { user, organization, role: 'owner' as const };
    });
    await this.throttle.count([rule]);
    await this.audit.record({
      organizationId: result.organization.id,
      action: 'auth.sign_up',
      actorUserId: result.user.id,
      targetType: 'user',
      targetId: result.user.id,
      meta,
    });
    return result;
  }

  /** Same answer and about the same time whether or not the e-mail exists. */
  async signIn(email: string, password: string, meta: RequestMeta): Promise<SignedIn> {
    const rules = signInRules(email, meta.ip);
    const wait = await this.throttle.retryAfter(rules);
    if (wait > 0) throw throttled(wait);
    const user = await this.users.findOneBy({ email });
    const ok = user
      ? await verifyPassword(user.passwordHash, password)
      : (await verifyAgainstDummy(password), false);
    if (!user || !ok) {
      await this.throttle.count(rules);
      await this.recordFailure(user, meta);
      throw new DomainError('unauthenticated', 'The e-mail address or the password is wrong.');
    }
    await this.throttle.clear(rules[0]!.key);
    const membership = await this.memberships.findOne({
      where: { userId: user.id },
      relations: { organization: true },
      order: { createdAt: 'ASC' },
    });
    if (!membership?.organization) {
      throw new DomainError(
        'forbidden',
        'This account does not belong to any organisation any more.',
      );
    }
    await this.audit.record({
      organizationId: membership.organizationId,
      action: 'auth.sign_in',
      actorUserId: user.id,
      targetType: 'user',
      targetId: user.id,
      meta,
    });
    return { user, organization: membership.organization, role: membership.role };
  }

  private async recordFailure(user: UserEntity | null, meta: RequestMeta) {
    const orgs = user ? await this.memberships.findBy({ userId: user.id }) : [];
    // Unknown addresses are logged without the address (no organisation to show them to).
    const targets = orgs.length ? orgs.map((m) => m.organizationId) : [null];
    for (const organizationId of targets) {
      await this.audit.record({
        organizationId,
        action: 'auth.sign_in_failed',
        actorUserId: user?.id ?? null,
        ...(user ? { targetType: 'user', targetId: user.id } : {}),
        meta,
      });
    }
  }

  async me(userId: string, organizationId: string): Promise<SignedIn> {
    const m = await this.memberships.findOne({
      where: { userId, organizationId },
      relations: { organization: true, user: true },
    });
    if (!m?.user || !m.organization) throw new DomainError('unauthenticated', 'Sign in first.');
    return { user: m.user, organization: m.organization, role: m.role };
  }

  async updateProfile(
    userId: string,
    change: { name?: string; lengthUnit?: LengthUnit },
    meta: RequestMeta,
  ): Promise<void> {
    const { name, lengthUnit } = change;
    if (name === undefined && lengthUnit === undefined) {
      const reason = 'send a name, preferences, or both';
      throw new DomainError('invalid_input', 'Nothing to change.', [
        { field: 'name', reason },
        { field: 'preferences', reason },
      ]);
    }
    const before = name === undefined ? null : await this.users.findOneBy({ id: userId });
    await this.users.update(
      { id: userId },
      { ...(name !== undefined && { name }), ...(lengthUnit !== undefined && { lengthUnit }) },
    );
    // A new name is what teammates see on keys, invites and the audit log: record it. (A display
    // unit is a personal preference and is not audited.)
    if (before && name !== undefined && before.name !== name) {
      await this.auditAllOrgs(userId, 'auth.name_changed', meta, { from: before.name, to: name });
    }
  }

  async listMemberships(userId: string) {
    return this.memberships.find({
      where: { userId },
      relations: { organization: true },
      order: { createdAt: 'ASC' },
    });
  }

  /** Always "accepted"; a message goes out only when the address has an account. */
  async requestPasswordReset(email: string, meta: RequestMeta): Promise<void> {
    const rule = { key: 'reset:' + sha256Hex(email), limit: 3, windowSeconds: WINDOW_SECONDS };
    if ((await this.throttle.retryAfter([rule])) > 0) return; // silently: no mail-bombing
    await this.throttle.count([rule]);
    const user = await this.users.findOneBy({ email });
    if (!user) return;
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + RESET_TTL_MS);
    await this.tokens.insert({
      userId: user.id,
      purpose: 'password_reset',
      tokenHash: sha256Hex(token),
      expiresAt,
    });
    await this.mail.send({
      template: 'password-reset',
      to: user.email,
      data: {
        name: user.name,
        link: this.link('/reset-password', token),
        expiresAt: expiresAt.toUTCString(),
      },
    });
    await this.auditAllOrgs(user.id, 'auth.password_reset_requested', meta);
  }

  async confirmPasswordReset(token: string, password: string, meta: RequestMeta): Promise<void> {
    // Check the new password before consuming the link, so a weak choice doesn't burn it.
    const pending = await this.tokens.findOneBy({
      tokenHash: sha256Hex(token),
      purpose: 'password_reset',
    });
    const owner = pending ? await this.users.findOneBy({ id: pending.userId }) : null;
    if (owner) assertPassword(password, owner);
    const row = await this.takeToken(token, 'password_reset');
    const user = await this.users.findOneByOrFail({ id: row.userId });
    assertPassword(password, user);
    await this.users.update(
      { id: user.id },
      { passwordHash: await hashPassword(password), passwordChangedAt: new Date() },
    );
    // Other outstanding reset links die with this one.
    await this.tokens.update(
      { userId: user.id, purpose: 'password_reset', usedAt: IsNull() },
      { usedAt: new Date() },
    );
    await this.sessions.endAllFor(user.id);
    await this.auditAllOrgs(user.id, 'auth.password_reset', meta);
  }

  async changePassword(
    userId: string,
    current: string,
    next: string,
    keepSessionId: string,
    meta: RequestMeta,
  ) {
    const user = await this.users.findOneByOrFail({ id: userId });
    if (!(await verifyPassword(user.passwordHash, current))) {
      throw new DomainError('invalid_input', 'The current password is wrong.', [
        { field: 'currentPassword', reason: 'is wrong' },
      ]);
    }
    assertPassword(next, user, 'newPassword');
    await this.users.update(
      { id: userId },
      { passwordHash: await hashPassword(next), passwordChangedAt: new Date() },
    );
    await this.sessions.endAllFor(userId, keepSessionId);
    await this.auditAllOrgs(userId, 'auth.password_changed', meta);
  }

  async requestEmailChange(userId: string, newEmail: string, password: string, meta: RequestMeta) {
    const user = await this.users.findOneByOrFail({ id: userId });
    if (!(await verifyPassword(user.passwordHash, password))) {
      throw new DomainError('invalid_input', 'The password is wrong.', [
        { field: 'password', reason: 'is wrong' },
      ]);
    }
    if (newEmail === user.email.toLowerCase()) {
      throw new DomainError('invalid_input', 'That is already your address.', [
        { field: 'newEmail', reason: 'is your current address' },
      ]);
    }
    if (await this.users.existsBy({ email: newEmail })) throw emailTaken('newEmail');
    const token = newLinkToken();
    const expiresAt = new Date(Date.now() + EMAIL_CHANGE_TTL_MS);
    await this.tokens.insert({
      userId,
      purpose: 'email_change',
      tokenHash: sha256Hex(token),
      newEmail,
      expiresAt,
    });
    await this.mail.send({
      template: 'email-change',
      to: newEmail,
      data: {
        name: user.name,
        newEmail,
        link: this.link('/confirm-email', token),
        expiresAt: expiresAt.toUTCString(),
      },
    });
    await this.auditAllOrgs(userId, 'auth.email_change_requested', meta, { newEmail });
  }

  /** The sign-in address and the latest change still waiting for its confirmation link. */
  async emailState(userId: string) {
    const user = await this.users.findOneByOrFail({ id: userId });
    const pending = await this.tokens
      .createQueryBuilder('t')
      .where('t.user_id = :userId AND t.purpose = :purpose', { userId, purpose: 'email_change' })
      .andWhere('t.used_at IS NULL AND t.expires_at > now()')
      .orderBy('t.created_at', 'DESC')
      .getOne();
    return {
      email: user.email,
      pendingEmail: pending?.newEmail ?? null,
      pendingUntil: pending ? pending.expiresAt.toISOString() : null,
    };
  }

  async confirmEmailChange(token: string, meta: RequestMeta): Promise<void> {
    const row = await this.takeToken(token, 'email_change');
    if (!row.newEmail) throw invalidToken();
    if (await this.users.existsBy({ email: row.newEmail })) throw emailTaken('token');
    const before = await this.users.findOneByOrFail({ id: row.userId });
    await this.users.update({ id: row.userId }, { email: row.newEmail });
    await this.auditAllOrgs(row.userId, 'auth.email_changed', meta, {
      from: before.email,
      to: row.newEmail,
    });
  }

  /** Marks a valid token used (atomically: a token works once) and returns it. */
  private async takeToken(
    token: string,
    purpose: UserTokenEntity['purpose'],
  ): Promise<UserTokenEntity> {
    const rows: UserTokenEntity[] = await this.ds
      .query(
        `UPDATE user_tokens SET used_at = now()
        WHERE token_hash = $1 AND purpose = $2 AND used_at IS NULL AND expires_at > now()
        RETURNING id, user_id AS "userId", new_email AS "newEmail"`,
        [sha256Hex(token), purpose],
      )
      .then((r: unknown[]) =>
        Array.isArray(r[0]) ? (r[0] as UserTokenEntity[]) : (r as UserTokenEntity[]),
      );
    const row = rows[0];
    if (!row) throw invalidToken();
    return row;
  }

  private async auditAllOrgs(
    userId: string,
    action:
      | 'auth.password_reset_requested'
      | 'auth.password_reset'
      | 'auth.password_changed'
      | 'auth.email_change_requested'
      | 'auth.email_changed'
      | 'auth.name_changed',
    meta: RequestMeta,
    metadata?: Record<string, unknown>,
  ) {
    for (const m of await this.memberships.findBy({ userId })) {
      await this.audit.record({
        organizationId: m.organizationId,
        action,
        actorUserId: userId,
        targetType: 'user',
        targetId: userId,
        meta,
        ...(metadata ? { metadata } : {}),
      });
    }
  }

  private link(path: string, token: string): string {
    return `${this.config.publicUrl}${path}?token=${encodeURIComponent(token)}`;
  }
}

export function assertPassword(
  password: string,
  ctx: { email?: string; name?: string },
  field = 'password',
) {
  const problems = passwordProblems(password, ctx, field);
  if (problems.length)
    throw new DomainError('invalid_input', 'The password is too weak.', problems);
}

const emailTaken = (field: string) =>
  new DomainError('conflict', 'An account with this e-mail address already exists.', [
    { field, reason: 'is already registered' },
  ]);

const invalidToken = () =>
  new DomainError('invalid_input', 'The link is invalid, already used or expired.', [
    { field: 'token', reason: 'is invalid, already used or expired' },
  ]);

const throttled = (
  seconds: number,
  message = 'Too many failed sign-ins. Wait before trying again.',
) =>
  new DomainError(
    'rate_limited',
    message,
    [],
    {
      'Retry-After': String(seconds),
    },
    { retryAfterSeconds: seconds },
  );
