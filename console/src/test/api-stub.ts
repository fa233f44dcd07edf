import { vi } from 'vitest';
import { primaryNav } from '@/config/paths';
import { jsonResponse } from './responses';

/** A signed-in owner who may see every section (invented demo data). */
export const demoSession = {
  user: {
    id: 'u-demo',
    email: 'owner@studio.test',
    name: 'Demo Owner',
    createdAt: '2026-01-01T00:00:00Z',
  },
  organization: {
    id: 'o-demo',
    name: 'Demo Studio',
    planCode: 'free',
    createdAt: '2026-01-01T00:00:00Z',
  },
  role: 'owner' as const,
  permissions: primaryNav.flatMap((entry) => (entry.permission ? [entry.permission] : [])),
};

type Handler = (path: string, init?: RequestInit) => Response | Promise<Response>;

/**
 * Stub fetch: GET /v1/me answers with `demoSession`, GET /v1/health with an up report, anything
 * else goes to `handler` (404 problem by default). Returns the mock to inspect calls.
 */
export function stubApi(handler?: Handler, health?: () => Response | Promise<Response>) {
  const mock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = input instanceof Request ? input.url : String(input);
    const path = new URL(url).pathname;
    if (path === '/v1/me') return jsonResponse(demoSession);
    if (path === '/v1/health') {
      return health
        ? health()
        : jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
    }
    if (handler) return handler(path, init);
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
  vi.stubGlobal('fetch', mock);
  return mock;
}
