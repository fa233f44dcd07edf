// Limits against slow clients, on the real server with short settings: a head sent byte by byte
// too slowly, or a body trickled past the request timeout, is answered 408 problem+json and the
// connection closed; a normal keep-alive client whose requests come further apart than those
// limits keeps its connection, and an idle one is closed after the keep-alive timeout.
import http from 'node:http';
import net from 'node:net';
import { signUp } from '../factories/accounts.js';
import { createKey, DEMO_BODIES } from '../factories/compute.js';
import { bootApp, type TestApp } from '../setup/app.js';

const HEADERS_MS = 1000;
const REQUEST_MS = 2000;
const KEEP_ALIVE_MS = 3000;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

interface SlowResult {
  /** What the server wrote before closing. */
  answer: string;
  /** Bytes of ours written before the server closed the connection. */
  sent: number;
  elapsedMs: number;
}

describe('HTTP limits against slow clients', () => {
  let t: TestApp;
  let port: number;
  let secret: string;

  beforeAll(async () => {
    t = await bootApp({
      HTTP_HEADERS_TIMEOUT_MS: String(HEADERS_MS),
      HTTP_REQUEST_TIMEOUT_MS: String(REQUEST_MS),
      HTTP_KEEP_ALIVE_TIMEOUT_MS: String(KEEP_ALIVE_MS),
    });
    port = Number(new URL(t.url).port);
    secret = (await createKey(await signUp(t.url), 'live')).secret;
  });
  afterAll(async () => {
    await t?.close();
  });

  /** Writes `fast` at once, then `slow` one byte every `everyMs`, until the server closes. */
  const trickle = (fast: string, slow: string, everyMs: number) =>
    new Promise<SlowResult>((resolve, reject) => {
      const started = Date.now();
      const socket = net.connect(port, '127.0.0.1');
      let answer = '';
      let sent = 0;
      let timer: NodeJS.Timeout | undefined;
      socket.on('data', (d) => (answer += d.toString('utf8')));
      socket.on('error', () => undefined); // a reset after the server's close is expected
      socket.on('close', () => {
        clearInterval(timer);
        resolve({ answer, sent, elapsedMs: Date.now() - started });
      });
      socket.on('connect', () => {
        socket.write(fast);
        sent = Buffer.byteLength(fast);
        let i = 0;
        timer = setInterval(() => {
          if (i >= slow.length) {
            clearInterval(timer);
            socket.destroy();
            reject(new Error('the server never cut the slow client off'));
            return;
          }
          if (!socket.destroyed) socket.write(slow[i++]!, () => (sent += 1));
        }, everyMs);
      });
    });

  const expect408 = (r: SlowResult) => {
    const [head, body] = r.answer.split('\r\n\r\n');
    expect(head).toMatch(/^HTTP\/1\.1 408 /);
    expect(head).toMatch(/\r\nContent-Type: application\/problem\+json\r\n/i);
    expect(head).toMatch(/\r\nConnection: close(\r\n|$)/i);
    expect(JSON.parse(body!)).toMatchObject({ status: 408, detail: expect.any(String) });
    expect(JSON.parse(body!).type).toMatch(/\/request-timeout$/);
  };

  it('cuts off a client that sends its request head byte by byte too slowly', async () => {
    const head =
      'GET /v1/health HTTP/1.1\r\nHost: 127.0.0.1\r\nUser-Agent: dusk-slow-test\r\n' +
      'X-Padding: abcdefghijklmnopqrstuvwxyz\r\n\r\n';
    // 100 ms a byte: the whole head (about 100 bytes) would take about 10 s.
    const r = await trickle('', head, 100);
    expect408(r);
    expect(r.sent).toBeLessThan(head.length);
    // Not before the limit (the check runs every 250 ms here, so a little after it).
    expect(r.elapsedMs).toBeGreaterThanOrEqual(HEADERS_MS - 50);
  });

  it('cuts off a client whose body trickles in past the request timeout', async () => {
    const body = JSON.stringify(DEMO_BODIES.balance, null, 2);
    const head =
      `POST /v1/balance HTTP/1.1\r\nHost: 127.0.0.1\r\nAuthorization: Bearer ${secret}\r\n` +
      `Content-Type: application/json\r\nContent-Length: ${Buffer.byteLength(body)}\r\n\r\n`;
    // The head at once; then a byte every 100 ms: the body would take well over 2 s.
    expect(Buffer.byteLength(body) * 100).toBeGreaterThan(REQUEST_MS * 2);
    const r = await trickle(head, body, 100);
    expect408(r);
    expect(r.sent).toBeLessThan(Buffer.byteLength(head) + Buffer.byteLength(body));
    expect(r.elapsedMs).toBeGreaterThanOrEqual(REQUEST_MS - 50);
  });

  it('keeps a keep-alive connection whose requests come further apart than the limits', async () => {
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const ports: number[] = [];
    const call = (path: string, body?: unknown) =>
      new Promise<{ status: number; json: unknown }>((resolve, reject) => {
        const payload = body === undefined ? undefined : JSON.stringify(body);
        const req = http.request(
          {
            host: '127.0.0.1',
            port,
            path,
            agent,
            method: payload ? 'POST' : 'GET',
            headers: payload
              ? { Authorization: `Bearer ${secret}`, 'Content-Type': 'application/json' }
              : {},
          },
          (res) => {
            let text = '';
            res.on('data', (d: Buffer) => (text += d.toString('utf8')));
            res.on('end', () => resolve({ status: res.statusCode!, json: JSON.parse(text) }));
          },
        );
        req.on('socket', (s) => s.once('connect', () => ports.push(s.localPort!)));
        req.on('error', reject);
        req.end(payload);
      });
    try {
      const first = await call('/v1/balance', DEMO_BODIES.balance);
      expect(first.status).toBe(200);
      // Idle longer than both the head and the request limits, within the keep-alive timeout.
      for (let i = 0; i < 2; i++) {
        await sleep(REQUEST_MS + 500);
        const again = await call('/v1/balance', DEMO_BODIES.balance);
        expect(again.status).toBe(200);
        expect(again.json).toEqual(first.json);
      }
      expect((await call('/v1/health')).status).toBe(200);
      // One connection for all four requests: it was opened once and never cut.
      expect(ports).toHaveLength(1);
      // Left idle, the server closes it after the keep-alive timeout.
      const socket = Object.values(agent.freeSockets).flat()[0]!;
      const closedAfter = await new Promise<number>((resolve) => {
        const idleFrom = Date.now();
        socket.once('close', () => resolve(Date.now() - idleFrom));
      });
      expect(closedAfter).toBeGreaterThanOrEqual(KEEP_ALIVE_MS - 500);
    } finally {
      agent.destroy();
    }
  }, 20000);

  it('uses the configured limits on the listening server', () => {
    const server = t.app.getHttpServer() as http.Server;
    expect(server.headersTimeout).toBe(HEADERS_MS);
    expect(server.requestTimeout).toBe(REQUEST_MS);
    expect(server.keepAliveTimeout).toBe(KEEP_ALIVE_MS);
  });
});
