import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { bootApp, TestApp } from '../setup/app.js';

describe('foundation', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('reports the database up at /v1/health', async () => {
    const res = await request(t.url).get('/v1/health').expect(200);
    expect(res.body.status).toBe('ok');
    expect(res.body.info.database.status).toBe('up');
  });

  it('echoes a well-formed X-Request-Id and replaces a malformed one', async () => {
    const ok = await request(t.url).get('/v1/health').set('X-Request-Id', 'abc-123');
    expect(ok.headers['x-request-id']).toBe('abc-123');
    const bad = await request(t.url).get('/v1/health').set('X-Request-Id', 'no spaces <>');
    expect(bad.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('answers unknown API routes with a problem+json 404 carrying the request id', async () => {
    const res = await request(t.url).get('/v1/does-not-exist').expect(404);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body).toMatchObject({
      status: 404,
      title: 'Not found',
      instance: '/v1/does-not-exist',
    });
    expect(res.body.requestId).toBe(res.headers['x-request-id']);
  });

  it('answers a known path with the wrong method with 405 and Allow (RFC 9110 §15.5.6)', async () => {
    const cases: [string, string, string][] = [
      ['get', '/v1/balance', 'POST'], // GETs meet the console's catch-all route first
      ['delete', '/v1/balance', 'POST'],
      ['put', '/v1/keys/4f0c1b7e-0000-4000-8000-000000000000', 'GET, HEAD, DELETE'],
      ['patch', '/v1/health', 'GET, HEAD'],
      ['get', '/v1/keys/4f0c1b7e-0000-4000-8000-000000000000/rotate', 'POST'],
    ];
    for (const [method, path, allow] of cases) {
      const res = await request(t.url)[method as 'get'](path);
      expect({ method, path, status: res.status, allow: res.headers.allow }).toEqual({
        method,
        path,
        status: 405,
        allow,
      });
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.body).toMatchObject({
        type: 'https://lumenwright.test/problems/method-not-allowed',
        title: 'Method not allowed',
        status: 405,
        instance: path,
      });
      expect(res.body.detail).toContain(allow);
      expect(res.body.requestId).toBe(res.headers['x-request-id']);
    }
    // An unknown path, and a known path's sibling, stay 404.
    for (const path of ['/v1/balances', '/v1/keys/a/b/c']) {
      const res = await request(t.url).delete(path);
      expect({ path, status: res.status, allow: res.headers.allow }).toEqual({
        path,
        status: 404,
        allow: undefined,
      });
    }
  });

  it('refuses bodies over the 100 kB limit with a 413 problem', async () => {
    const big = JSON.stringify({ pad: 'x'.repeat(101 * 1024) });
    const res = await request(t.url)
      .post('/v1/health')
      .set('Content-Type', 'application/json')
      .send(big);
    expect(res.status).toBe(413);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
  });

  it('serves the OpenAPI document and the interactive docs', async () => {
    const spec = await request(t.url).get('/openapi.json').expect(200);
    expect(spec.body.openapi).toBe('3.1.0');
    expect(spec.body.paths['/v1/health'].get.operationId).toBe('getHealth');
    const docs = await request(t.url).get('/docs').expect(200);
    expect(docs.text).toContain('swagger');
  });

  it('sends security headers and no CORS grant to a foreign origin by default', async () => {
    const res = await request(t.url).get('/v1/health').set('Origin', 'https://elsewhere.test');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
  });
});

describe('console files', () => {
  let t: TestApp;
  let dir: string;
  beforeAll(async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lw-console-dist-'));
    fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>first build</title>');
    fs.mkdirSync(path.join(dir, 'assets'));
    fs.writeFileSync(path.join(dir, 'assets', 'app-first.js'), 'console.log("first")');
    t = await bootApp({ CONSOLE_DIST: dir });
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('serves index.html for console routes and the newest build without a restart', async () => {
    const first = await request(t.url).get('/setups/abc').expect(200);
    expect(first.text).toContain('first build');
    expect(first.headers['cache-control']).toBe('no-cache');
    // A rebuild replaces the file (a later mtime).
    const later = new Date(Date.now() + 5000);
    fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>second build</title>');
    fs.utimesSync(path.join(dir, 'index.html'), later, later);
    const second = await request(t.url).get('/').expect(200);
    expect(second.text).toContain('second build');
    await request(t.url).get('/v1/nothing-here').expect(404);
  });

  it('serves assets added by a rebuild, and answers a missing asset with 404, not the page', async () => {
    const first = await request(t.url).get('/assets/app-first.js').expect(200);
    expect(first.headers['content-type']).toMatch(/javascript/);
    expect(first.headers['cache-control']).toContain('immutable');
    fs.writeFileSync(path.join(dir, 'assets', 'app-second.js'), 'console.log("second")');
    const added = await request(t.url).get('/assets/app-second.js').expect(200);
    expect(added.headers['content-type']).toMatch(/javascript/);
    expect(added.text).toContain('second');
    const missing = await request(t.url).get('/assets/app-gone.js').expect(404);
    expect(missing.headers['content-type']).toMatch(/^application\/problem\+json/);
    await request(t.url).get('/favicon-missing.svg').expect(404);
    // Outside the build folder is never served.
    await request(t.url).get('/assets/..%2f..%2fetc%2fpasswd').expect(404);
  });
});
