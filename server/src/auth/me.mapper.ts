import type { Role } from '../common/decorators/access.decorator.js';
import type { OrganizationEntity } from '../organizations/organization.entity.js';
import type { UserEntity } from '../users/user.entity.js';
import type { MeResponseDto, OrganizationResponseDto, UserResponseDto } from './dto/auth.dto.js';
import { PERMISSIONS, Permission, hasPermission } from './permissions.js';

export const toUserDto = (u: UserEntity): UserResponseDto => ({
  id: u.id,
  email: u.email,
  name: u.name,
  createdAt: u.createdAt.toISOString(),
});

export const toOrganizationDto = (o: OrganizationEntity): OrganizationResponseDto => ({
  id: o.id,
  name: o.name,
  planCode: o.planCode,
  createdAt: o.createdAt.toISOString(),
});

export function toMeDto(user: UserEntity, org: OrganizationEntity, role: Role): MeResponseDto {
  return {
    user: toUserDto(user),
    organization: toOrganizationDto(org),
    role,
    permissions: (Object.keys(PERMISSIONS) as Permission[]).filter((p) => hasPermission(role, p)),
    preferences: { lengthUnit: user.lengthUnit },
  };
}
