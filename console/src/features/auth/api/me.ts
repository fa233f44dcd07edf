import { useQuery } from '@tanstack/react-query';
import { meQueryKey, meQueryOptions } from '@/lib/me';

export type { Me } from '@/lib/me';

export const authKeys = {
  all: ['auth'] as const,
  me: () => meQueryKey,
  invite: (token: string) => [...authKeys.all, 'invite', token] as const,
};

export function useMe() {
  return useQuery(meQueryOptions());
}
