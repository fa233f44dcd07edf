// The fixed header set must be exactly what helmet itself sets on a real node:http response with
// the same options (helmet, npm, is the reference: https://helmetjs.github.io/).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import helmet from 'helmet';
import { helmetHeaders, securityHeaderOptions } from './security-headers.js';

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
