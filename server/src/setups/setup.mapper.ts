import type { SavedSetupResponseDto } from './dto/setup.dto.js';
import type { SetupEntity } from './setup.entity.js';

export function toSavedSetupDto(s: SetupEntity): SavedSetupResponseDto {
  return {
    id: s.id,
    name: s.name,
    venue: s.venue,
    notes: s.notes,
    date: s.shootDate,
    timeZone: s.timeZone,
    windowStart: s.plan.window.start,
    windowEnd: s.plan.window.end,
    createdBy: s.createdBy ? { id: s.createdBy.id, name: s.createdBy.name } : null,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
    inputs: s.inputs,
    resolvedInputs: s.resolvedInputs,
    plan: s.plan as unknown as Record<string, unknown>,
  };
}
