// The fixed header set must be exactly what helmet itself sets on a real node:http response with
// the same options (helmet, npm, is the reference: https://helmetjs.github.io/).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Fastify from 'fastify';
import helmet from 'helmet';
import {
  helmetHeaders,
  registerSecurityHeaders,
  securityHeaderOptions,
} from './security-headers.js';

async function headersFromRealHelmet(https: boolean): Promise<Record<string, string>> {
  const mw = helmet(securityHeaderOptions(https));
  const server = http.createServer((req, res) => mw(req, res, () => res.end('ok')));
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  try {
    const { port } = server.address() as AddressInfo;
    const res = await fetch(`http://127.0.0.1:${port}/`);
    await res.text();
    const out: Record<string, string> = {};
    res.headers.forEach((v, k) => {
      if (!['date', 'connection', 'keep-alive', 'content-length', 'transfer-encoding'].includes(k))
        out[k] = v;
    });
    return out;
  } finally {
    await new Promise((r) => server.close(r));
  }
}

const lower = (h: Record<string, string>) =>
  Object.fromEntries(Object.entries(h).map(([k, v]) => [k.toLowerCase(), v]));

describe('security headers computed once', () => {
  it.each([false, true])('equal what helmet sets per request (https=%s)', async (https) => {
    const fixed = lower(helmetHeaders(securityHeaderOptions(https)));
    const real = await headersFromRealHelmet(https);
    expect(fixed).toEqual(real);
    expect(Object.keys(fixed).length).toBeGreaterThan(8);
    expect(fixed['content-security-policy']).toContain("frame-ancestors 'none'");
    expect('strict-transport-security' in fixed).toBe(https);
  });
});

describe('API answers and pages get their own sets', () => {
  it('/v1 answers carry the OWASP REST set; pages, and /v1 routes marked as pages, helmet’s', async () => {
    const app = Fastify();
    registerSecurityHeaders(app, true);
    app.get('/v1/thing', async () => ({ ok: true }));
    app.get('/v1/sheet', { config: { page: true } }, async (_req, reply) =>
      reply.type('text/html').send('<p>sheet</p>'),
    );
    app.get('/docs', async (_req, reply) => reply.type('text/html').send('<p>docs</p>'));
    await app.ready();
    try {
      const api = (await app.inject({ url: '/v1/thing?x=1' })).headers;
      // OWASP REST Security Cheat Sheet, "Security Headers": Cache-Control: no-store,
      // Content-Security-Policy: frame-ancestors 'none', Strict-Transport-Security,
      // X-Content-Type-Options: nosniff, X-Frame-Options: DENY.
      expect(api['cache-control']).toBe('no-store');
      expect(api['content-security-policy']).toBe("default-src 'none'; frame-ancestors 'none'");
      expect(api['strict-transport-security']).toBe('max-age=31536000; includeSubDomains');
      expect(api['x-content-type-options']).toBe('nosniff');
      expect(api['x-frame-options']).toBe('DENY');
      expect(api['cross-origin-resource-policy']).toBe('same-origin');
      expect(api['x-dns-prefetch-control']).toBeUndefined();
      const helmetSet = lower(helmetHeaders(securityHeaderOptions(true)));
      for (const url of ['/docs', '/v1/sheet']) {
        const page = (await app.inject({ url })).headers;
        for (const [k, v] of Object.entries(helmetSet))
          expect([url, k, page[k]]).toEqual([url, k, v]);
        expect(page['cache-control']).toBeUndefined();
      }
    } finally {
      await app.close();
    }
  });
});
