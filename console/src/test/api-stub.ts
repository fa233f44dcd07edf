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
  role: 'owner' as 'owner' | 'admin' | 'developer' | 'photographer',
  permissions: primaryNav.flatMap((entry) => (entry.permission ? [entry.permission] : [])),
  preferences: { lengthUnit: 'm' as 'm' | 'ft' },
};

/** `request` is what was fetched (the SDK passes a Request; `init` is then undefined). */
type Handler = (
  path: string,
  init: RequestInit | undefined,
  request: Request,
) => Response | Promise<Response>;

/**
 * Stub fetch: GET /v1/me answers with `session` (`demoSession` by default), GET /v1/health with an
 * up report, anything else (PATCH /v1/me too) goes to `handler` (404 problem by default). Returns
 * the mock to inspect calls.
 */
export function stubApi(
  handler?: Handler,
  health?: () => Response | Promise<Response>,
  session: typeof demoSession = demoSession,
) {
  const mock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const request = input instanceof Request ? input : new Request(String(input), init);
    const path = new URL(request.url).pathname;
    if (path === '/v1/me' && request.method === 'GET') return jsonResponse(session);
    if (path === '/v1/health') {
      return health
        ? health()
        : jsonResponse({ status: 'ok', info: { database: { status: 'up' } } });
    }
    if (handler) return handler(path, init, request);
    return jsonResponse({ title: 'Not Found', status: 404 }, 404, 'application/problem+json');
  });
  vi.stubGlobal('fetch', mock);
  return mock;
}

/** A request as a recording stub saw it: method, path and JSON body (undefined when empty). */
export interface RecordedCall {
  method: string;
  path: string;
  body: unknown;
}

/**
 * Stub fetch with `answer`, keeping every request in the returned list (in order), e.g. to read
 * what a save sent.
 */
export function recordFetch(
  answer: (call: RecordedCall) => Response | Promise<Response>,
): RecordedCall[] {
  const calls: RecordedCall[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
      // The SDK client passes a Request; a plain fetch passes a URL and init.
      const request = input instanceof Request ? input : new Request(String(input), init);
      const text = await request.text();
      const call = {
        method: request.method,
        path: new URL(request.url).pathname,
        body: text ? (JSON.parse(text) as unknown) : undefined,
      };
      calls.push(call);
      return answer(call);
    }),
  );
  return calls;
}
