// Test frames: check the plan, read and analyse the upload, store the original and thumbnail,
// then record the row. Nothing is left half-written: the row is inserted only after both
// objects are stored, and a failure after any object was stored deletes what was stored.
import { randomUUID } from 'node:crypto';
import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { FastifyRequest } from 'fastify';
import { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal, RequestWithPrincipal } from '../common/guards/access.guard.js';
import type { IdempotentBodyCheck, IdempotentRequest } from '../idempotency/idempotency.guard.js';
import { JSON_CONTENT_TYPE } from '../idempotency/idempotency.hook.js';
import { IdempotencyService } from '../idempotency/idempotency.service.js';
import { toFrameDto } from './frame.mapper.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { AuditService } from '../audit/audit.service.js';
import type { RequestMeta } from '../auth/request-context.js';
import { PlansService } from '../plans/plans.service.js';
import { thumbnail } from './analysis/decode.js';
import { analyseFrame } from './frame-analysis.js';
import { FrameEntity } from './frame.entity.js';
import { ObjectStore } from './object-store.service.js';
import {
  ACCEPTED_TYPES,
  readFrameUpload,
  readUploadOf,
  type FrameUpload,
} from './upload-reader.js';

@Injectable()
export class FramesService implements IdempotentBodyCheck {
  private readonly logger = new Logger('FramesService');

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly plans: PlansService,
    private readonly store: ObjectStore,
    private readonly audit: AuditService,
    private readonly keys: IdempotencyService,
  ) {}

  private get repo() {
    return this.ds.getRepository(FrameEntity);
  }

  /** Refuses before a byte of the body is read when the plan has no uploads. */
  async assertUploadsAllowed(p: Principal): Promise<void> {
    const plan = await this.plans.forOrganization(p.organizationId);
    if (!plan.uploads) {
      throw new DomainError(
        'forbidden',
        `Test-frame uploads are not part of the ${plan.name} plan; an owner can upgrade under Billing.`,
        [],
        {},
        {
          type: 'https://lumenwright.test/problems/plan-feature-missing',
          feature: 'uploads',
          plan: plan.code,
        },
      );
    }
    if (!this.store.configured) {
      throw new DomainError('unavailable', 'Object storage is not configured on this server.');
    }
  }

  /** With an Idempotency-Key the body is read in the guard: refuse first (IdempotentBody). */
  beforeRead(req: RequestWithPrincipal): Promise<void> {
    return this.assertUploadsAllowed(req.principal!);
  }

  async upload(req: FastifyRequest, p: Principal): Promise<FrameEntity> {
    await this.assertUploadsAllowed(p);
    // Read already when the request carries an Idempotency-Key (its fingerprint needs the bytes).
    const up = readUploadOf(req) ?? (await readFrameUpload(req, this.config.framesMaxBytes));
    return this.storeUpload(up, p, (req as IdempotentRequest).idempotency);
  }

  /**
   * Analyses a read upload and stores it: the upload route's work after the form is read (the
   * demo seeder stores its synthetic frames through it too). Call assertUploadsAllowed first.
   */
  async storeUpload(
    up: FrameUpload,
    p: Principal,
    held?: IdempotentRequest['idempotency'],
  ): Promise<FrameEntity> {
    const maxPixels = this.config.framesMaxPixels;
    const result = await analyseFrame({
      buf: up.buf,
      patch: up.patch,
      cameraKelvin: up.cameraKelvin,
      maxPixels,
    });
    const thumb = await thumbnail(up.buf, maxPixels);
    const id = randomUUID();
    const base = `frames/${p.organizationId}/${id}`;
    const objectKey = `${base}/original.${ACCEPTED_TYPES[up.contentType]}`;
    const thumbnailKey = `${base}/thumbnail.jpg`;
    const written: string[] = [];
    try {
      await this.store.put(objectKey, up.buf, up.contentType);
      written.push(objectKey);
      await this.store.put(thumbnailKey, thumb, 'image/jpeg');
      written.push(thumbnailKey);
      const colour = result.analysis.colour;
      return await this.ds.transaction(async (m) => {
        const saved = await m.save(
          m.create(FrameEntity, {
            id,
            organizationId: p.organizationId,
            uploadedByUserId: p.userId,
            apiKeyId: p.keyId,
            fileName: up.fileName,
            contentType: up.contentType,
            byteSize: up.buf.length,
            sha256: up.sha256,
            width: result.width,
            height: result.height,
            objectKey,
            thumbnailKey,
            exif: result.exif,
            analysis: result.analysis,
            cctKelvin: colour.cctKelvin,
            miredOffset: colour.miredOffset,
          }),
        );
        // With an Idempotency-Key the answer is stored with the frame: a retry after a crash
        // between the two replays this frame rather than storing a second one.
        if (held) {
          await this.keys.complete(
            held,
            {
              status: 201,
              headers: { 'content-type': JSON_CONTENT_TYPE },
              body: Buffer.from(JSON.stringify(toFrameDto(saved))),
            },
            m,
          );
        }
        return saved;
      });
    } catch (e) {
      for (const key of written) await this.store.deleteQuietly(key);
      if (e instanceof DomainError) throw e;
      this.logger.error(`frame ${id} not stored: ${(e as Error).message}`);
      throw new DomainError(
        'unavailable',
        'The frame could not be stored; nothing was kept. Try again.',
      );
    }
  }

  async list(orgId: string, limit: number, cursor?: string) {
    const qb = this.repo
      .createQueryBuilder('f')
      .where('f.organization_id = :orgId', { orgId })
      .orderBy('f.created_at', 'DESC')
      .addOrderBy('f.id', 'DESC')
      .take(limit + 1);
    if (cursor) {
      // The cursor is the last frame's id: compare with its exact (microsecond) timestamp.
      qb.andWhere(
        '(f.created_at, f.id) < (SELECT c.created_at, c.id FROM frames c WHERE c.id = :cursorId AND c.organization_id = :orgId)',
        { cursorId: decodeCursor(cursor) },
      );
    }
    const rows = await qb.getMany();
    const page = rows.slice(0, limit);
    const last = page[page.length - 1];
    return {
      data: page,
      nextCursor: rows.length > limit && last ? Buffer.from(last.id).toString('base64url') : null,
    };
  }

  async get(orgId: string, id: string): Promise<FrameEntity> {
    const row = await this.repo.findOneBy({ id, organizationId: orgId });
    if (!row) throw new DomainError('not_found', 'No such frame in your organisation.');
    return row;
  }

  /**
   * Deletes a frame: the row and its audit event in one transaction (a frame shows people: who
   * deleted it, person or key, stays on record), then the stored original and thumbnail. An
   * object that cannot be deleted now has no row and is removed by the orphan sweeper.
   */
  async remove(p: Principal, id: string, meta?: RequestMeta): Promise<void> {
    const orgId = p.organizationId;
    const row = await this.get(orgId, id);
    await this.ds.transaction(async (m) => {
      const { affected } = await m.delete(FrameEntity, { id: row.id, organizationId: orgId });
      if (!affected) throw new DomainError('not_found', 'No such frame in your organisation.');
      await this.audit.record(
        {
          organizationId: orgId,
          action: 'frame.deleted',
          actorUserId: p.userId,
          actorKeyId: p.keyId,
          targetType: 'frame',
          targetId: row.id,
          meta,
          metadata: { fileName: row.fileName, sha256: row.sha256 },
        },
        m,
      );
    });
    await this.store.deleteQuietly(row.objectKey);
    await this.store.deleteQuietly(row.thumbnailKey);
  }

  async thumbnail(orgId: string, id: string) {
    const row = await this.get(orgId, id);
    return this.store.get(row.thumbnailKey);
  }
}

function decodeCursor(cursor: string): string {
  const id = Buffer.from(cursor, 'base64url').toString();
  if (!/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/.test(id)) {
    throw new DomainError('invalid_input', 'The cursor is not valid.', [
      { field: 'cursor', reason: 'is not a cursor from this API' },
    ]);
  }
  return id;
}
