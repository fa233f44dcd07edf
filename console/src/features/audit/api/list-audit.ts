import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

export type AuditEvent = components['schemas']['AuditEventResponseDto'];
export type AuditPage = components['schemas']['AuditPageResponseDto'];

export interface AuditFilter {
  cursor?: string;
  action?: string;
}

export const auditKeys = {
  all: ['audit'] as const,
  list: (filter: AuditFilter) => [...auditKeys.all, 'list', filter] as const,
};

/** GET /v1/audit: newest first, one page at a time. */
export function listAudit(filter: AuditFilter, signal?: AbortSignal): Promise<AuditPage> {
  return unwrap(
    client.GET('/v1/audit', {
      params: { query: { limit: 25, cursor: filter.cursor, action: filter.action || undefined } },
      signal,
    }),
  );
}

export function auditQueryOptions(filter: AuditFilter) {
  return queryOptions({
    queryKey: auditKeys.list(filter),
    queryFn: ({ signal }) => listAudit(filter, signal),
    placeholderData: keepPreviousData,
  });
}

export function useAudit(filter: AuditFilter) {
  return useQuery(auditQueryOptions(filter));
}
