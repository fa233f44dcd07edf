import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import { guideNumberFromMeter, type LengthUnit } from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import type {
  CreateLightRequestDto,
  MeterReadingDto,
  UpdateLightRequestDto,
} from './dto/light.dto.js';
import { LightEntity } from './entities/light.entity.js';
import { duplicateName, isUniqueViolation, isUuid, notFound } from './ids.js';

type Rating = Pick<
  LightEntity,
  | 'guideNumber'
  | 'guideNumberUnit'
  | 'meterAperture'
  | 'meterDistance'
  | 'meterDistanceUnit'
  | 'meterIso'
  | 'meterPowerFraction'
>;

/** A rated guide number, kept as entered. */
function rated(guideNumber: number, unit: LengthUnit = 'm'): Rating {
  return {
    guideNumber,
    guideNumberUnit: unit,
    meterAperture: null,
    meterDistance: null,
    meterDistanceUnit: null,
    meterIso: null,
    meterPowerFraction: null,
  };
}

/** A guide number derived from a meter reading, in the reading's distance unit. */
function metered(m: MeterReadingDto): Rating {
  const unit = m.distanceUnit ?? 'm';
  const gn = guideNumberFromMeter({ ...m, distanceUnit: unit });
  return {
    guideNumber: unit === 'ft' ? gn.guideNumberFt : gn.guideNumberM,
    guideNumberUnit: unit,
    meterAperture: m.aperture,
    meterDistance: m.distance,
    meterDistanceUnit: unit,
    meterIso: m.iso ?? 100,
    meterPowerFraction: m.powerFraction ?? 1,
  };
}

function ratingFrom(body: UpdateLightRequestDto, creating: boolean): Rating | null {
  const hasGn = body.guideNumber !== undefined;
  const hasMeter = body.meterReading !== undefined;
  if (hasGn && hasMeter) {
    throw new DomainError('invalid_input', 'Send either guideNumber or meterReading, not both.', [
      { field: 'meterReading', reason: 'cannot be sent together with guideNumber' },
    ]);
  }
  if (body.guideNumberUnit !== undefined && !hasGn) {
    throw new DomainError('invalid_input', 'guideNumberUnit needs a guideNumber.', [
      { field: 'guideNumber', reason: 'is required when guideNumberUnit is sent' },
    ]);
  }
  if (hasGn) return rated(body.guideNumber!, body.guideNumberUnit);
  if (hasMeter) return metered(body.meterReading!);
  if (creating) {
    throw new DomainError('invalid_input', 'Send the guide number or a meter reading.', [
      { field: 'guideNumber', reason: 'is required unless meterReading is sent' },
    ]);
  }
  return null;
}

@Injectable()
export class LightsService {
  constructor(@InjectRepository(LightEntity) private readonly repo: Repository<LightEntity>) {}

  list(organizationId: string): Promise<LightEntity[]> {
    return this.repo.find({ where: { organizationId }, order: { name: 'ASC', id: 'ASC' } });
  }

  async get(organizationId: string, id: string, field = 'id'): Promise<LightEntity> {
    const light = isUuid(id) ? await this.repo.findOneBy({ id, organizationId }) : null;
    if (!light) throw notFound('light', field);
    return light;
  }

  async create(organizationId: string, body: CreateLightRequestDto): Promise<LightEntity> {
    const rating = ratingFrom(body, true)!;
    return this.save(
      this.repo.create({ organizationId, name: body.name, notes: body.notes ?? null, ...rating }),
    );
  }

  async update(
    organizationId: string,
    id: string,
    body: UpdateLightRequestDto,
  ): Promise<LightEntity> {
    const light = await this.get(organizationId, id);
    const rating = ratingFrom(body, false);
    if (rating) Object.assign(light, rating);
    if (body.name !== undefined) light.name = body.name;
    if (body.notes !== undefined) light.notes = body.notes;
    return this.save(light);
  }

  async remove(organizationId: string, id: string): Promise<void> {
    const light = await this.get(organizationId, id);
    await this.repo.delete({ id: light.id, organizationId });
  }

  private async save(light: LightEntity): Promise<LightEntity> {
    try {
      return await this.repo.save(light);
    } catch (e) {
      if (isUniqueViolation(e)) throw duplicateName('light');
      throw e;
    }
  }
}
