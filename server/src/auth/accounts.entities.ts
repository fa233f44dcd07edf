// The accounts area's entities, registered in src/database/entities.ts with one spread.
import { ApiKeyEntity } from '../api-keys/api-key.entity.js';
import { AuditEventEntity } from '../audit/audit-event.entity.js';
import { MembershipEntity } from '../organizations/membership.entity.js';
import { OrganizationEntity } from '../organizations/organization.entity.js';
import { InviteEntity } from '../team/invite.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { AuthThrottleEntity } from './auth-throttle.entity.js';
import { SessionEntity } from './session.entity.js';
import { UserTokenEntity } from './user-token.entity.js';

export const ACCOUNTS_ENTITIES = [
  UserEntity,
  OrganizationEntity,
  MembershipEntity,
  SessionEntity,
  UserTokenEntity,
  InviteEntity,
  ApiKeyEntity,
  AuditEventEntity,
  AuthThrottleEntity,
];
