import type { ApiKeyEntity } from './api-key.entity.js';
import type { ApiKeyResponseDto } from './dto/api-key.dto.js';
import { keyPrefix } from './key-format.js';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function keyStatus(k: ApiKeyEntity, now = new Date()): ApiKeyResponseDto['status'] {
  if (k.revokedAt) return 'revoked';
  if (k.expiresAt && k.expiresAt <= now) return 'expired';
  return 'active';
}

export function toApiKeyDto(k: ApiKeyEntity): ApiKeyResponseDto {
  return {
    id: k.id,
    name: k.name,
    environment: k.environment,
    prefix: keyPrefix(k.environment, k.publicId),
    status: keyStatus(k),
    createdBy: k.createdBy ? { id: k.createdBy.id, name: k.createdBy.name } : null,
    createdAt: k.createdAt.toISOString(),
    expiresAt: iso(k.expiresAt),
    lastUsedAt: iso(k.lastUsedAt),
    revokedAt: iso(k.revokedAt),
    rotatedAt: iso(k.rotatedAt),
    previousSecretExpiresAt:
      k.previousSecretExpiresAt && k.previousSecretExpiresAt > new Date()
        ? k.previousSecretExpiresAt.toISOString()
        : null,
  };
}
