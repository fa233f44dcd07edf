import { Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, EntityManager, Repository } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import {
  MAX_GEL_PIECES,
  type CreateGelKitRequestDto,
  type CreateGelPieceRequestDto,
  type UpdateGelKitRequestDto,
  type UpdateGelPieceRequestDto,
} from './dto/gel-kit.dto.js';
import { GelKitEntity } from './entities/gel-kit.entity.js';
import { GelPieceEntity } from './entities/gel-piece.entity.js';
import { duplicateName, isUniqueViolation, isUuid, notFound } from './ids.js';

function pieceValues(p: CreateGelPieceRequestDto, field: string) {
  if (p.miredShift === undefined && p.greenShift === undefined) {
    throw new DomainError('invalid_input', 'A gel needs a mired shift or a green shift.', [
      {
        field: `${field}.miredShift`.replace(/^\./, ''),
        reason: 'is required unless greenShift is sent',
      },
    ]);
  }
  return {
    name: p.name,
    miredShift: p.miredShift ?? 0,
    greenShift: p.greenShift ?? 0,
    lossStops: p.lossStops,
  };
}

@Injectable()
export class GelKitsService {
  constructor(
    @InjectRepository(GelKitEntity) private readonly kits: Repository<GelKitEntity>,
    @InjectDataSource() private readonly ds: DataSource,
  ) {}

  list(organizationId: string): Promise<GelKitEntity[]> {
    return this.kits.find({
      where: { organizationId },
      relations: { pieces: true },
      order: { name: 'ASC', id: 'ASC' },
    });
  }

  async get(organizationId: string, id: string, field = 'id'): Promise<GelKitEntity> {
    const kit = isUuid(id)
      ? await this.kits.findOne({ where: { id, organizationId }, relations: { pieces: true } })
      : null;
    if (!kit) throw notFound('gel kit', field);
    return kit;
  }

  async create(organizationId: string, body: CreateGelKitRequestDto): Promise<GelKitEntity> {
    const pieces = (body.pieces ?? []).map((p, i) => pieceValues(p, `pieces[${i}]`));
    const seen = new Set<string>();
    pieces.forEach((p, i) => {
      if (seen.has(p.name)) throw duplicateName('gel in this kit', `pieces[${i}].name`);
      seen.add(p.name);
    });
    const id = await this.write(async (em) => {
      const kit = await em.save(
        em.create(GelKitEntity, { organizationId, name: body.name, notes: body.notes ?? null }),
      );
      await em.insert(
        GelPieceEntity,
        pieces.map((p, position) => ({ ...p, kitId: kit.id, position })),
      );
      return kit.id;
    }, 'gel kit');
    return this.get(organizationId, id);
  }

  async update(
    organizationId: string,
    id: string,
    body: UpdateGelKitRequestDto,
  ): Promise<GelKitEntity> {
    const kit = await this.get(organizationId, id);
    await this.write(async (em) => {
      const patch: Partial<GelKitEntity> = {};
      if (body.name !== undefined) patch.name = body.name;
      if (body.notes !== undefined) patch.notes = body.notes;
      if (Object.keys(patch).length) await em.update(GelKitEntity, { id: kit.id }, patch);
    }, 'gel kit');
    return this.get(organizationId, id);
  }

  async remove(organizationId: string, id: string): Promise<void> {
    const kit = await this.get(organizationId, id);
    await this.kits.delete({ id: kit.id, organizationId });
  }

  async addPiece(organizationId: string, kitId: string, body: CreateGelPieceRequestDto) {
    const values = pieceValues(body, '');
    const pieceId = await this.write(async (em) => {
      const kit = await this.lockKit(em, organizationId, kitId);
      const rows: { n: number; next: number }[] = await em.query(
        `SELECT count(*)::int AS n, coalesce(max(position) + 1, 0)::int AS next
           FROM gear_gel_pieces WHERE kit_id = $1`,
        [kit.id],
      );
      const { n, next } = rows[0]!;
      if (n >= MAX_GEL_PIECES) {
        throw new DomainError('conflict', `A kit holds at most ${MAX_GEL_PIECES} gels.`, [
          { field: 'pieces', reason: `already has ${MAX_GEL_PIECES} gels` },
        ]);
      }
      const saved = await em.save(
        em.create(GelPieceEntity, { ...values, kitId: kit.id, position: next }),
      );
      await em.update(GelKitEntity, { id: kit.id }, { updatedAt: new Date() });
      return saved.id;
    }, 'gel in this kit');
    return this.piece(organizationId, kitId, pieceId);
  }

  async updatePiece(
    organizationId: string,
    kitId: string,
    pieceId: string,
    body: UpdateGelPieceRequestDto,
  ) {
    const piece = await this.piece(organizationId, kitId, pieceId);
    await this.write(async (em) => {
      const patch: Partial<GelPieceEntity> = {};
      for (const k of ['name', 'miredShift', 'greenShift', 'lossStops'] as const) {
        if (body[k] !== undefined) (patch as Record<string, unknown>)[k] = body[k];
      }
      if (Object.keys(patch).length) await em.update(GelPieceEntity, { id: piece.id }, patch);
    }, 'gel in this kit');
    return this.piece(organizationId, kitId, pieceId);
  }

  async removePiece(organizationId: string, kitId: string, pieceId: string): Promise<void> {
    const piece = await this.piece(organizationId, kitId, pieceId);
    await this.ds.getRepository(GelPieceEntity).delete({ id: piece.id });
  }

  private async piece(
    organizationId: string,
    kitId: string,
    pieceId: string,
  ): Promise<GelPieceEntity> {
    const kit = await this.get(organizationId, kitId, 'kitId');
    const piece = isUuid(pieceId) ? kit.pieces?.find((p) => p.id === pieceId) : undefined;
    if (!piece) throw notFound('gel in this kit', 'pieceId');
    return piece;
  }

  private async lockKit(em: EntityManager, organizationId: string, kitId: string) {
    const kit = isUuid(kitId)
      ? await em.findOne(GelKitEntity, {
          where: { id: kitId, organizationId },
          lock: { mode: 'pessimistic_write' },
        })
      : null;
    if (!kit) throw notFound('gel kit', 'kitId');
    return kit;
  }

  private async write<T>(fn: (em: EntityManager) => Promise<T>, what: string): Promise<T> {
    try {
      return await this.ds.transaction(fn);
    } catch (e) {
      if (isUniqueViolation(e)) throw duplicateName(what);
      throw e;
    }
  }
}
