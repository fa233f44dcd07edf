// Every route states who may call it; the global AccessGuard refuses routes that don't.
import { SetMetadata, applyDecorators } from '@nestjs/common';
import { ApiBearerAuth, ApiCookieAuth } from '@nestjs/swagger';

export type Role = 'owner' | 'admin' | 'developer' | 'photographer';
export const ROLES: readonly Role[] = ['owner', 'admin', 'developer', 'photographer'];

export type AccessRule =
  | { kind: 'public' }
  | { kind: 'session'; roles: readonly Role[] }
  | { kind: 'api-key-or-session'; roles: readonly Role[] };

export const ACCESS_KEY = 'lumenwright:access';

/** Anyone, signed in or not. */
export const Public = () => SetMetadata(ACCESS_KEY, { kind: 'public' } satisfies AccessRule);

/** A console session whose membership has one of these roles (all roles when none given). */
export const SessionAuth = (...roles: Role[]) =>
  applyDecorators(
    SetMetadata(ACCESS_KEY, {
      kind: 'session',
      roles: roles.length ? roles : ROLES,
    } satisfies AccessRule),
    ApiCookieAuth('session'),
  );

/** A bearer API key, or a console session with one of these roles (the playground). */
export const ApiKeyAuth = (...roles: Role[]) =>
  applyDecorators(
    SetMetadata(ACCESS_KEY, {
      kind: 'api-key-or-session',
      roles: roles.length ? roles : ROLES,
    } satisfies AccessRule),
    ApiBearerAuth('apiKey'),
    ApiCookieAuth('session'),
  );
