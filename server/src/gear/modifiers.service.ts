import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import { MODIFIERS } from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import type { CreateModifierRequestDto, UpdateModifierRequestDto } from './dto/modifier.dto.js';
import { ModifierEntity } from './entities/modifier.entity.js';
import { duplicateName, isUniqueViolation, isUuid, notFound } from './ids.js';

@Injectable()
export class ModifiersService {
  constructor(
    @InjectRepository(ModifierEntity) private readonly repo: Repository<ModifierEntity>,
  ) {}

  list(organizationId: string): Promise<ModifierEntity[]> {
    return this.repo.find({ where: { organizationId }, order: { name: 'ASC', id: 'ASC' } });
  }

  async get(organizationId: string, id: string, field = 'id'): Promise<ModifierEntity> {
    const m = isUuid(id) ? await this.repo.findOneBy({ id, organizationId }) : null;
    if (!m) throw notFound('modifier', field);
    return m;
  }

  async create(organizationId: string, body: CreateModifierRequestDto): Promise<ModifierEntity> {
    const kind = body.kind ?? null;
    // Without a measured loss, the kind's typical loss is the best default we have.
    const lossStops = body.lossStops ?? (kind ? MODIFIERS[kind].lossStops : undefined);
    if (lossStops === undefined) {
      throw new DomainError('invalid_input', 'Send lossStops (or a kind to default it from).', [
        { field: 'lossStops', reason: 'is required unless kind is sent' },
      ]);
    }
    const size = body.size ?? null;
    return this.save(
      this.repo.create({
        organizationId,
        name: body.name,
        kind,
        lossStops,
        beamAngleDeg: body.beamAngleDeg ?? null,
        size,
        sizeUnit: size === null ? null : (body.sizeUnit ?? 'm'),
        notes: body.notes ?? null,
      }),
    );
  }

  async update(
    organizationId: string,
    id: string,
    body: UpdateModifierRequestDto,
  ): Promise<ModifierEntity> {
    const m = await this.get(organizationId, id);
    if (body.name !== undefined) m.name = body.name;
    if (body.kind !== undefined) m.kind = body.kind;
    if (body.lossStops !== undefined) m.lossStops = body.lossStops;
    if (body.beamAngleDeg !== undefined) m.beamAngleDeg = body.beamAngleDeg;
    if (body.size !== undefined) m.size = body.size;
    if (body.sizeUnit !== undefined) m.sizeUnit = body.sizeUnit;
    if (m.size === null) m.sizeUnit = null;
    else m.sizeUnit ??= 'm';
    if (body.notes !== undefined) m.notes = body.notes;
    return this.save(m);
  }

  async remove(organizationId: string, id: string): Promise<void> {
    const m = await this.get(organizationId, id);
    await this.repo.delete({ id: m.id, organizationId });
  }

  private async save(m: ModifierEntity): Promise<ModifierEntity> {
    try {
      return await this.repo.save(m);
    } catch (e) {
      if (isUniqueViolation(e)) throw duplicateName('modifier');
      throw e;
    }
  }
}
