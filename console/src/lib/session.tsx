import { createContext, useContext } from 'react';

export type Role = 'owner' | 'admin' | 'developer' | 'photographer';

/** Who is signed in, as `GET /v1/me` says; the app provides it, features read it. */
export interface Session {
  user: { id: string; email: string; name: string; createdAt: string };
  organization: { id: string; name: string; planCode: string; createdAt: string };
  role: Role;
  /** Server permission names, e.g. `keys:manage-all`, `billing:manage`. */
  permissions: readonly string[];
  /** The user's own settings, saved on the server (they follow the user to any browser). */
  preferences: { lengthUnit: 'm' | 'ft' };
}

export const SessionContext = createContext<Session | null>(null);

/** The current session, or null outside the signed-in shell (sign-in pages, tests). */
export function useSession(): Session | null {
  return useContext(SessionContext);
}

/** True when the signed-in member holds `permission` (the server still enforces it). */
export function useCan(permission: string): boolean {
  const session = useSession();
  return !!session && session.permissions.includes(permission);
}
