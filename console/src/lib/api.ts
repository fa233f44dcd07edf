/**
 * The console's only door to the Lumenwright API.
 *
 * Everything that talks to the server goes through `api` below. When `@lumenwright/sdk` ships
 * `createApiClient({ baseUrl, fetch, headers })`, this file is the one place to switch over: keep
 * `ApiProblem` as the error type features catch, and build the SDK client with
 * `fetch: (request) => globalThis.fetch(request)` so tests can stub fetch.
 */

import { createApiClient } from '@lumenwright/sdk';

/** RFC 9457 problem details, as the server renders every error. */
export interface ProblemDetails {
  type?: string;
  title?: string;
  status?: number;
  detail?: string;
  instance?: string;
  errors?: { field?: string; path?: string; message?: string; reason?: string }[];
  [extension: string]: unknown;
}

/** A non-2xx answer (or no answer at all) from the API. */
export class ApiProblem extends Error {
  readonly status: number;
  readonly problem: ProblemDetails;
  /** Parsed body when the server answered with something other than problem+json. */
  readonly body: unknown;

  constructor(status: number, problem: ProblemDetails, body?: unknown) {
    super(problem.detail ?? problem.title ?? `Request failed with status ${status}`);
    this.name = 'ApiProblem';
    this.status = status;
    this.problem = problem;
    this.body = body;
  }

  /** Status 0: the request never got an HTTP answer (offline, refused, aborted). */
  get unreachable(): boolean {
    return this.status === 0;
  }
}

export interface ApiRequest {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  headers?: Record<string, string>;
}

/** Same origin in production (the server serves the console) and in dev (Vite proxies /v1). */
function baseUrl(): string {
  return globalThis.location?.origin ?? 'http://127.0.0.1';
}

async function readBody(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  const type = response.headers.get('content-type') ?? '';
  if (type.includes('json')) {
    try {
      return JSON.parse(text) as unknown;
    } catch {
      return text;
    }
  }
  return text;
}

function toProblem(status: number, statusText: string, body: unknown): ProblemDetails {
  if (body && typeof body === 'object' && ('title' in body || 'detail' in body)) {
    return { status, ...(body as ProblemDetails) };
  }
  return { status, title: statusText || `HTTP ${status}` };
}

async function request<T>(path: string, init: ApiRequest = {}): Promise<T> {
  const headers: Record<string, string> = { accept: 'application/json', ...init.headers };
  let payload: string | undefined;
  if (init.body !== undefined) {
    headers['content-type'] = 'application/json';
    payload = JSON.stringify(init.body);
  }
  let response: Response;
  try {
    // Read fetch at call time, not import time, so tests can stub it.
    response = await globalThis.fetch(new URL(path, baseUrl()), {
      method: init.method ?? 'GET',
      headers,
      body: payload,
      signal: init.signal,
      credentials: 'include',
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    const detail = error instanceof Error ? error.message : 'Network request failed';
    throw new ApiProblem(0, { title: 'API unreachable', detail, status: 0 });
  }
  const body = await readBody(response);
  if (!response.ok) {
    throw new ApiProblem(
      response.status,
      toProblem(response.status, response.statusText, body),
      body,
    );
  }
  return body as T;
}

export const api = {
  get: <T>(path: string, init?: Omit<ApiRequest, 'method' | 'body'>) =>
    request<T>(path, { ...init, method: 'GET' }),
  post: <T>(path: string, body: unknown, init?: Omit<ApiRequest, 'method' | 'body'>) =>
    request<T>(path, { ...init, method: 'POST', body }),
  patch: <T>(path: string, body: unknown, init?: Omit<ApiRequest, 'method' | 'body'>) =>
    request<T>(path, { ...init, method: 'PATCH', body }),
  delete: <T>(path: string, init?: Omit<ApiRequest, 'method' | 'body'>) =>
    request<T>(path, { ...init, method: 'DELETE' }),
};

/**
 * The typed SDK client (cookie session, `credentials: 'include'`) for every console call.
 * CSRF: the server refuses cookie-carrying writes whose Origin is foreign; the browser sends our
 * own Origin on same-origin fetches, so no token is needed.
 */
export const client = createApiClient({
  baseUrl: baseUrl(),
  fetch: (request) => globalThis.fetch(request),
});

interface SdkResult<T> {
  data?: T;
  error?: unknown;
  response: Response;
}

/** Awaits an SDK call and returns its data, or throws an `ApiProblem` like `api` does. */
export async function unwrap<T>(call: Promise<SdkResult<T>>): Promise<T> {
  let result: SdkResult<T>;
  try {
    result = await call;
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    const detail = error instanceof Error ? error.message : 'Network request failed';
    throw new ApiProblem(0, { title: 'API unreachable', detail, status: 0 });
  }
  const { response } = result;
  if (!response.ok) {
    throw new ApiProblem(
      response.status,
      toProblem(response.status, response.statusText, result.error),
      result.error,
    );
  }
  return result.data as T;
}
