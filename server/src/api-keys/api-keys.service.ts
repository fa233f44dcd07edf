import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, EntityManager, Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import { decodeCursor, encodeCursor } from '../audit/audit.service.js';
import { hasPermission } from '../auth/permissions.js';
import type { RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { sha256Hex } from '../auth/tokens.js';
import { DomainError } from '../common/errors/domain-error.js';
import { MailService } from '../mail/mail.service.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { ApiKeyEntity, KeyEnvironment } from './api-key.entity.js';
import { formatKey, keyPrefix, newPublicId, newSecret } from './key-format.js';
import { KEY_CHANNEL, KeyVerifier } from './key-verifier.service.js';

const MAX_AHEAD_MS = 3 * 366 * 24 * 3600 * 1000;

export interface IssuedKey {
  key: ApiKeyEntity;
  secret: string;
}

@Injectable()
export class ApiKeysService {
  private readonly logger = new Logger('ApiKeysService');

  constructor(
    @InjectRepository(ApiKeyEntity) private readonly keys: Repository<ApiKeyEntity>,
    @InjectRepository(UserEntity) private readonly users: Repository<UserEntity>,
    @InjectRepository(OrganizationEntity) private readonly orgs: Repository<OrganizationEntity>,
    @InjectDataSource() private readonly ds: DataSource,
    private readonly verifier: KeyVerifier,
    private readonly audit: AuditService,
    private readonly mail: MailService,
  ) {}

  async create(
    p: SessionPrincipal,
    input: { name: string; environment: KeyEnvironment; expiresAt?: string },
    meta: RequestMeta,
  ): Promise<IssuedKey> {
    let expiresAt: Date | null = null;
    if (input.expiresAt) {
      expiresAt = new Date(input.expiresAt);
      const ahead = expiresAt.getTime() - Date.now();
      if (ahead <= 0 || ahead > MAX_AHEAD_MS) {
        throw new DomainError('invalid_input', 'expiresAt must be in the future.', [
          { field: 'expiresAt', reason: 'must be in the future and at most 3 years ahead' },
        ]);
      }
    }
    const publicId = newPublicId();
    const secret = newSecret();
    const saved = await this.keys.save(
      this.keys.create({
        organizationId: p.organizationId,
        createdByUserId: p.userId,
        name: input.name,
        environment: input.environment,
        publicId,
        secretHash: sha256Hex(secret),
        expiresAt,
      }),
    );
    const key = await this.load(p.organizationId, saved.id);
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'key.created',
      actorUserId: p.userId,
      targetType: 'api_key',
      targetId: key.id,
      meta,
      metadata: {
        name: key.name,
        environment: key.environment,
        prefix: keyPrefix(key.environment, publicId),
      },
    });
    await this.notifyByMail('key-created', key, p.userId);
    return { key, secret: formatKey(input.environment, publicId, secret) };
  }

  /** Owners and admins see every key; developers only the keys they created. */
  async list(p: SessionPrincipal, limit: number, cursor?: string) {
    const qb = this.keys
      .createQueryBuilder('k')
      .leftJoinAndSelect('k.createdBy', 'u')
      .where('k.organization_id = :org', { org: p.organizationId })
      .orderBy('k.created_at', 'DESC')
      .addOrderBy('k.id', 'DESC')
      .take(limit + 1);
    if (!hasPermission(p.role, 'keys:manage-all')) {
      qb.andWhere('k.created_by_user_id = :me', { me: p.userId });
    }
    if (cursor) {
      qb.andWhere(
        '(k.created_at, k.id) < (SELECT c.created_at, c.id FROM api_keys c WHERE c.id = :cid)',
        { cid: decodeCursor(cursor) },
      );
    }
    const rows = await qb.getMany();
    const more = rows.length > limit;
    const data = more ? rows.slice(0, limit) : rows;
    const last = data[data.length - 1];
    return { data, nextCursor: more && last ? encodeCursor(last.id) : null };
  }

  /** A key of the caller's organisation that the caller may manage; 404 otherwise. */
  async get(p: SessionPrincipal, id: string): Promise<ApiKeyEntity> {
    const key = await this.load(p.organizationId, id);
    if (!hasPermission(p.role, 'keys:manage-all') && key.createdByUserId !== p.userId) {
      throw notFound();
    }
    return key;
  }

  async revoke(p: SessionPrincipal, id: string, meta: RequestMeta): Promise<ApiKeyEntity> {
    const key = await this.get(p, id);
    if (key.revokedAt) return key;
    await this.ds.transaction(async (m) => {
      await m.update(
        ApiKeyEntity,
        { id: key.id },
        { revokedAt: () => 'now()', revokedByUserId: p.userId },
      );
      await this.notifyInstances(m, key.publicId);
    });
    this.verifier.invalidateLocal(key.publicId);
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'key.revoked',
      actorUserId: p.userId,
      targetType: 'api_key',
      targetId: key.id,
      meta,
      metadata: { name: key.name, prefix: keyPrefix(key.environment, key.publicId) },
    });
    const revoked = await this.load(p.organizationId, key.id);
    await this.notifyByMail('key-revoked', revoked, p.userId);
    return revoked;
  }

  /** A new secret; the old one keeps working for `graceSeconds` (0 = not at all). */
  async rotate(
    p: SessionPrincipal,
    id: string,
    graceSeconds: number,
    meta: RequestMeta,
  ): Promise<IssuedKey> {
    const key = await this.get(p, id);
    if (key.revokedAt || (key.expiresAt && key.expiresAt <= new Date())) {
      throw new DomainError(
        'conflict',
        'A revoked or expired key cannot be rotated; create a new key.',
      );
    }
    const secret = newSecret();
    await this.ds.transaction(async (m) => {
      await m.query(
        `UPDATE api_keys
            SET previous_secret_hash = CASE WHEN $2::int > 0 THEN secret_hash END,
                previous_secret_expires_at = CASE WHEN $2::int > 0 THEN now() + make_interval(secs => $2::int) END,
                secret_hash = $3, rotated_at = now()
          WHERE id = $1`,
        [key.id, graceSeconds, sha256Hex(secret)],
      );
      await this.notifyInstances(m, key.publicId);
    });
    this.verifier.invalidateLocal(key.publicId);
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'key.rotated',
      actorUserId: p.userId,
      targetType: 'api_key',
      targetId: key.id,
      meta,
      metadata: { name: key.name, gracePeriodSeconds: graceSeconds },
    });
    const rotated = await this.load(p.organizationId, key.id);
    return { key: rotated, secret: formatKey(key.environment, key.publicId, secret) };
  }

  private async load(organizationId: string, id: string): Promise<ApiKeyEntity> {
    if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(id))
      throw notFound();
    const key = await this.keys.findOne({
      where: { id, organizationId },
      relations: { createdBy: true },
    });
    if (!key) throw notFound();
    return key;
  }

  /** Delivered to every instance's listener when the transaction commits. */
  private async notifyInstances(m: EntityManager, publicId: string) {
    await m.query(`SELECT pg_notify($1, $2)`, [KEY_CHANNEL, publicId]);
  }

  private async notifyByMail(
    template: 'key-created' | 'key-revoked',
    key: ApiKeyEntity,
    actorId: string,
  ) {
    try {
      const creator = key.createdBy;
      if (!creator) return;
      const org = await this.orgs.findOneByOrFail({ id: key.organizationId });
      const prefix = keyPrefix(key.environment, key.publicId);
      if (template === 'key-created') {
        await this.mail.send({
          template,
          to: creator.email,
          data: {
            name: creator.name,
            keyName: key.name,
            prefix,
            environment: key.environment,
            organizationName: org.name,
          },
        });
      } else {
        const actor = await this.users.findOneBy({ id: actorId });
        await this.mail.send({
          template,
          to: creator.email,
          data: {
            name: creator.name,
            keyName: key.name,
            prefix,
            organizationName: org.name,
            revokedBy: actor?.name ?? 'a team member',
          },
        });
      }
    } catch (e) {
      // The key change stands; a notification that could not be queued is logged, not fatal.
      this.logger.warn(`could not queue ${template} mail: ${(e as Error).message}`);
    }
  }
}

const notFound = () => new DomainError('not_found', 'No such API key in this organisation.');
