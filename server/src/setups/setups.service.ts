import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import type { Principal } from '../common/guards/access.guard.js';
import { isUuid, notFound } from '../gear/ids.js';
import {
  NAME_MAX,
  type CreateSavedSetupRequestDto,
  type DuplicateSavedSetupRequestDto,
  type UpdateSavedSetupRequestDto,
} from './dto/setup.dto.js';
import { listSetups, listUpcomingSetups } from './setup-page.js';
import { assertRoomForSetup } from './setup-limit.js';
import { SetupPlanner } from './setup-planner.service.js';
import { SetupEntity } from './setup.entity.js';

@Injectable()
export class SetupsService {
  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    private readonly planner: SetupPlanner,
    private readonly audit: AuditService,
  ) {}

  list(p: Principal, opts: { limit: number; cursor?: string; q?: string }) {
    return listSetups(this.ds, p.organizationId, opts);
  }

  upcoming(p: Principal, limit: number) {
    return listUpcomingSetups(this.ds, p.organizationId, limit);
  }

  async get(organizationId: string, id: string): Promise<SetupEntity> {
    const setup = isUuid(id)
      ? await this.ds.getRepository(SetupEntity).findOne({
          where: { id, organizationId },
          relations: { createdBy: true },
        })
      : null;
    if (!setup) throw notFound('saved setup', 'id');
    return setup;
  }

  async create(p: SessionPrincipal, body: CreateSavedSetupRequestDto): Promise<SetupEntity> {
    const c = await this.planner.compute(p.organizationId, body.inputs);
    const id = await this.ds.transaction(async (em) => {
      await assertRoomForSetup(em, p.organizationId);
      const saved = await em.save(
        em.create(SetupEntity, {
          organizationId: p.organizationId,
          name: body.name,
          venue: body.venue ?? null,
          notes: body.notes ?? null,
          shootDate: c.date,
          timeZone: c.timeZone,
          inputs: c.inputs,
          resolvedInputs: c.resolvedInputs,
          plan: c.plan,
          createdByUserId: p.userId,
        }),
      );
      return saved.id;
    });
    return this.get(p.organizationId, id);
  }

  async update(p: Principal, id: string, body: UpdateSavedSetupRequestDto): Promise<SetupEntity> {
    const setup = await this.get(p.organizationId, id);
    const patch: Partial<SetupEntity> = {};
    if (body.name !== undefined) patch.name = body.name;
    if (body.venue !== undefined) patch.venue = body.venue;
    if (body.notes !== undefined) patch.notes = body.notes;
    if (body.inputs !== undefined) {
      const c = await this.planner.compute(p.organizationId, body.inputs);
      Object.assign(patch, {
        inputs: c.inputs,
        resolvedInputs: c.resolvedInputs,
        plan: c.plan,
        shootDate: c.date,
        timeZone: c.timeZone,
      });
    }
    if (Object.keys(patch).length) {
      await this.ds.getRepository(SetupEntity).update({ id: setup.id }, patch as never);
    }
    return this.get(p.organizationId, setup.id);
  }

  /** A copy of the saved inputs and plan as they are (not recomputed), counted against the plan. */
  async duplicate(p: SessionPrincipal, id: string, body: DuplicateSavedSetupRequestDto) {
    const src = await this.get(p.organizationId, id);
    const name = body.name ?? `${src.name.slice(0, NAME_MAX - 7)} (copy)`;
    const copyId = await this.ds.transaction(async (em) => {
      await assertRoomForSetup(em, p.organizationId);
      const saved = await em.save(
        em.create(SetupEntity, {
          organizationId: p.organizationId,
          name,
          venue: src.venue,
          notes: src.notes,
          shootDate: src.shootDate,
          timeZone: src.timeZone,
          inputs: src.inputs,
          resolvedInputs: src.resolvedInputs,
          plan: src.plan,
          createdByUserId: p.userId,
        }),
      );
      return saved.id;
    });
    return this.get(p.organizationId, copyId);
  }

  /**
   * Deletes a saved setup and records who did (`setup.deleted`, with its name, venue and shoot
   * date) in the same transaction: a studio can see who removed a client's plan.
   */
  async remove(p: Principal, id: string, meta?: RequestMeta): Promise<void> {
    const setup = await this.get(p.organizationId, id);
    await this.ds.transaction(async (m) => {
      const { affected } = await m.delete(SetupEntity, {
        id: setup.id,
        organizationId: p.organizationId,
      });
      if (!affected) throw notFound('setup', 'id');
      await this.audit.record(
        {
          organizationId: p.organizationId,
          action: 'setup.deleted',
          actorUserId: p.userId,
          actorKeyId: p.keyId,
          targetType: 'setup',
          targetId: setup.id,
          meta,
          metadata: { name: setup.name, venue: setup.venue, shootDate: setup.shootDate },
        },
        m,
      );
    });
  }
}
