// Entities to response DTOs: responses never expose entities directly.
import { METRES_PER_FOOT } from '@lumenwright/shared';
import type { GelKitResponseDto, GelPieceResponseDto } from './dto/gel-kit.dto.js';
import type { LightResponseDto } from './dto/light.dto.js';
import type { ModifierResponseDto } from './dto/modifier.dto.js';
import type { GelKitEntity } from './entities/gel-kit.entity.js';
import type { GelPieceEntity } from './entities/gel-piece.entity.js';
import type { LightEntity } from './entities/light.entity.js';
import type { ModifierEntity } from './entities/modifier.entity.js';

const r2 = (x: number) => Math.round(x * 100) / 100;

export function toLightDto(l: LightEntity): LightResponseDto {
  const gnM = l.guideNumberUnit === 'ft' ? l.guideNumber * METRES_PER_FOOT : l.guideNumber;
  return {
    id: l.id,
    name: l.name,
    guideNumber: l.guideNumber,
    guideNumberUnit: l.guideNumberUnit,
    guideNumberM: r2(gnM),
    guideNumberFt: r2(gnM / METRES_PER_FOOT),
    meterReading:
      l.meterAperture !== null && l.meterDistance !== null
        ? {
            aperture: l.meterAperture,
            distance: l.meterDistance,
            distanceUnit: l.meterDistanceUnit ?? 'm',
            iso: l.meterIso ?? 100,
            powerFraction: l.meterPowerFraction ?? 1,
          }
        : null,
    notes: l.notes,
    createdAt: l.createdAt.toISOString(),
    updatedAt: l.updatedAt.toISOString(),
  };
}

export function toModifierDto(m: ModifierEntity): ModifierResponseDto {
  return {
    id: m.id,
    name: m.name,
    kind: m.kind,
    lossStops: m.lossStops,
    beamAngleDeg: m.beamAngleDeg,
    size: m.size,
    sizeUnit: m.size === null ? null : (m.sizeUnit ?? 'm'),
    notes: m.notes,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
  };
}

export function toGelPieceDto(p: GelPieceEntity): GelPieceResponseDto {
  return {
    id: p.id,
    name: p.name,
    miredShift: p.miredShift,
    greenShift: p.greenShift,
    lossStops: p.lossStops,
    position: p.position,
  };
}

export function toGelKitDto(k: GelKitEntity): GelKitResponseDto {
  const pieces = [...(k.pieces ?? [])].sort((a, b) => a.position - b.position);
  return {
    id: k.id,
    name: k.name,
    notes: k.notes,
    pieces: pieces.map(toGelPieceDto),
    createdAt: k.createdAt.toISOString(),
    updatedAt: k.updatedAt.toISOString(),
  };
}
