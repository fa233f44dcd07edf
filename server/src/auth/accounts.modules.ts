// The accounts area's modules, registered in src/features.ts with one spread.
import { ApiKeysModule } from '../api-keys/api-keys.module.js';
import { AuditModule } from '../audit/audit.module.js';
import { MailModule } from '../mail/mail.module.js';
import { OrganizationsModule } from '../organizations/organizations.module.js';
import { TeamModule } from '../team/team.module.js';
import { AuthModule } from './auth.module.js';

export const ACCOUNTS_MODULES = [
  MailModule,
  AuditModule,
  ApiKeysModule,
  AuthModule,
  TeamModule,
  OrganizationsModule,
];
