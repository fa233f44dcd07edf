import { describe, expect, it, vi } from 'vitest';
import { ApiProblem, api } from './api';

describe('api client', () => {
  it('turns an RFC 9457 problem+json answer into an ApiProblem with its fields', async () => {
    const problem = {
      type: 'https://lumenwright.invalid/problems/validation',
      title: 'Invalid request',
      status: 400,
      detail: 'aperture must be at least 0.5',
      errors: [{ field: 'aperture', message: 'must be at least 0.5' }],
    };
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(JSON.stringify(problem), {
            status: 400,
            headers: { 'content-type': 'application/problem+json' },
          }),
      ),
    );
    const failure = await api.post('/v1/flash', { aperture: 0 }).catch((error: unknown) => error);
    expect(failure).toBeInstanceOf(ApiProblem);
    const apiProblem = failure as ApiProblem;
    expect(apiProblem.status).toBe(400);
    expect(apiProblem.message).toBe('aperture must be at least 0.5');
    expect(apiProblem.problem.errors).toEqual(problem.errors);
  });

  it('sends JSON bodies with the session cookie and returns the parsed answer', async () => {
    const fetchMock = vi.fn(
      async (_input: RequestInfo | URL, _init?: RequestInit) =>
        new Response(JSON.stringify({ fNumber: 8 }), {
          status: 200,
          headers: { 'content-type': 'application/json' },
        }),
    );
    vi.stubGlobal('fetch', fetchMock);
    const answer = await api.post<{ fNumber: number }>('/v1/flash', { guideNumber: 32 });
    expect(answer.fNumber).toBe(8);
    const [url, init] = fetchMock.mock.calls[0]!;
    expect(new URL(String(url)).pathname).toBe('/v1/flash');
    expect(init?.method).toBe('POST');
    expect(init?.credentials).toBe('include');
    expect(init?.body).toBe('{"guideNumber":32}');
    expect(new Headers(init?.headers).get('content-type')).toBe('application/json');
  });

  it('reports a non-problem error body with the HTTP status as title', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response('upstream gone', { status: 502, statusText: 'Bad Gateway' })),
    );
    const failure = (await api.get('/v1/health').catch((error: unknown) => error)) as ApiProblem;
    expect(failure.status).toBe(502);
    expect(failure.problem.title).toBe('Bad Gateway');
    expect(failure.body).toBe('upstream gone');
    expect(failure.unreachable).toBe(false);
  });

  it('marks a request that never got an answer as unreachable (status 0)', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    const failure = (await api.get('/v1/health').catch((error: unknown) => error)) as ApiProblem;
    expect(failure).toBeInstanceOf(ApiProblem);
    expect(failure.unreachable).toBe(true);
  });
});
