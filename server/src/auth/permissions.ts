// What each role may do, as data: the guards read it (through `can`) and the README prints it.
import { ROLES, Role } from '../common/decorators/access.decorator.js';

export interface PermissionInfo {
  roles: readonly Role[];
  description: string;
}

/**
 * The permission table. API keys carry no role: a key acts for its organisation on the compute
 * routes, reads its gear, and uploads, reads and deletes its test frames (`@ApiKeyAuth`); it can
 * never call a management route or write anything else (those are `@SessionAuth`).
 */
export const PERMISSIONS = {
  'organization:read': { roles: ROLES, description: 'See the organisation and its plan' },
  'organization:manage': { roles: ['owner'], description: 'Rename the organisation' },
  'organization:delete': { roles: ['owner'], description: 'Delete the organisation' },
  'organization:transfer': { roles: ['owner'], description: 'Transfer ownership' },
  'billing:manage': { roles: ['owner'], description: 'Plan, payment method, invoices' },
  'team:manage': {
    roles: ['owner', 'admin'],
    description: 'Invite, re-send, cancel; change roles; remove members (only owners grant owner)',
  },
  'keys:manage-all': {
    roles: ['owner', 'admin'],
    description: 'List, revoke and rotate every key of the organisation',
  },
  'keys:manage-own': {
    roles: ['owner', 'admin', 'developer'],
    description: 'Create keys; list, revoke and rotate the keys one created',
  },
  'usage:read': { roles: ['owner', 'admin', 'developer'], description: 'Read usage and quotas' },
  'audit:read': { roles: ['owner', 'admin'], description: 'Read the audit log' },
  'gear:manage': { roles: ['owner', 'admin'], description: 'Add and edit the studio gear list' },
  'gear:read': {
    roles: ROLES,
    description: 'Read the studio gear list (API keys too, to find the ids compute calls take)',
  },
  'playground:use': { roles: ROLES, description: 'Run calculations in the console playground' },
  'setups:read': {
    roles: ROLES,
    description: 'List and open saved lighting setups and shot sheets',
  },
  'setups:manage': {
    roles: ['owner', 'admin', 'photographer'],
    description: 'Save, edit, duplicate and delete lighting setups',
  },
  'profile:manage': {
    roles: ROLES,
    description: 'Own name, e-mail, password; sign out everywhere',
  },
} as const satisfies Record<string, PermissionInfo>;

export type Permission = keyof typeof PERMISSIONS;

/** The roles holding a permission, for `@SessionAuth(...can('team:manage'))`. */
export function can(permission: Permission): Role[] {
  return [...PERMISSIONS[permission].roles];
}

export function hasPermission(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && (PERMISSIONS[permission].roles as readonly Role[]).includes(role);
}

/** The table as Markdown (for the README): one row per permission, one column per role. */
export function permissionTableMarkdown(): string {
  const head = `| permission | ${ROLES.join(' | ')} | what it covers |`;
  const rule = `|---|${ROLES.map(() => ':-:').join('|')}|---|`;
  const rows = Object.entries(PERMISSIONS).map(
    ([name, p]) =>
      `| \`${name}\` | ${ROLES.map((r) => ((p.roles as readonly Role[]).includes(r) ? 'yes' : '—')).join(' | ')} | ${p.description} |`,
  );
  return [head, rule, ...rows].join('\n');
}
