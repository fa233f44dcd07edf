// The refusals the OpenAPI document states for JSON bodies are what the server answers, on every
// operation that takes one: a body that is not JSON (400), another media type (415) and a body
// over the limit (413), each as problem+json. They come before authentication (the body is
// parsed first), so no credentials are needed to see them.
import request from 'supertest';
import { bootApp, type TestApp } from '../setup/app.js';

const NIL = '00000000-0000-4000-8000-000000000000';

interface Op {
  operationId: string;
  requestBody?: { content?: Record<string, unknown> };
  responses: Record<string, unknown>;
}

describe('documented body refusals happen', () => {
  let t: TestApp;
  let jsonOps: { method: string; path: string; op: Op }[] = [];
  beforeAll(async () => {
    t = await bootApp();
    const spec = (await request(t.url).get('/openapi.json').expect(200)).body as {
      paths: Record<string, Record<string, Op>>;
    };
    jsonOps = Object.entries(spec.paths).flatMap(([path, item]) =>
      Object.entries(item)
        .filter(([, op]) => op.requestBody?.content?.['application/json'])
        .map(([method, op]) => ({ method, path: path.replace(/\{[^}]+\}/g, NIL), op })),
    );
  }, 90000);
  afterAll(async () => {
    await t?.close();
  });

  const send = (method: string, path: string) =>
    (request(t.url) as unknown as Record<string, (p: string) => request.Test>)[method]!(path);

  it('finds the operations that take JSON', () => {
    expect(jsonOps.length).toBeGreaterThan(30);
  });

  it('answers 400, 415 and 413 as documented on every JSON operation', async () => {
    let checked = 0;
    const big = JSON.stringify({ pad: 'x'.repeat(t.config.bodyLimitBytes) });
    for (const { method, path, op } of jsonOps) {
      const id = `${method.toUpperCase()} ${path}`;
      const broken = await send(method, path)
        .set('Content-Type', 'application/json')
        .send('{"a": ');
      const text = await send(method, path).set('Content-Type', 'text/plain').send('a=1');
      const large = await send(method, path).set('Content-Type', 'application/json').send(big);
      for (const [res, status] of [
        [broken, 400],
        [text, 415],
        [large, 413],
      ] as const) {
        checked += 1;
        expect(`${id} ${res.status}`).toBe(`${id} ${status}`);
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
        expect(`${id} documents ${status}: ${String(status) in op.responses}`).toBe(
          `${id} documents ${status}: true`,
        );
      }
    }
    expect(checked).toBe(jsonOps.length * 3);
  });
});
