// The HTTP limits against slow clients: defaults, the request timeout derived from the largest
// upload, and refusals of bad settings naming the variable.
import { ConfigError, loadConfig, requestTimeoutFor } from './config.js';

const base = { DATABASE_URL: 'postgres://u@127.0.0.1:1/db', NODE_ENV: 'test' };

describe('HTTP timeouts in the configuration', () => {
  it('defaults to 10 s for the head, 240 s for a whole request and 65 s keep-alive', () => {
    const c = loadConfig(base);
    expect(c.httpHeadersTimeoutMs).toBe(10_000);
    // 25 MiB at 1 Mbit/s: 26,214,400 B × 8 / 1,000,000 b/s = 209.7152 s; + 30 s margin = 239.7 s,
    // rounded up to the second (hand arithmetic).
    expect(c.framesMaxBytes).toBe(26_214_400);
    expect(c.httpRequestTimeoutMs).toBe(240_000);
    expect(c.httpKeepAliveTimeoutMs).toBe(65_000);
  });

  it('sizes the default request timeout from FRAMES_MAX_BYTES', () => {
    // 100 MiB: 104,857,600 × 8 / 1,000,000 = 838.8608 s; + 30 s = 868.86 s → 869 s.
    const c = loadConfig({ ...base, FRAMES_MAX_BYTES: String(100 * 1024 * 1024) });
    expect(c.httpRequestTimeoutMs).toBe(869_000);
    // 1 MB: 8 s + 30 s = 38 s.
    expect(requestTimeoutFor(1_000_000)).toBe(38_000);
  });

  it('takes explicit values', () => {
    const c = loadConfig({
      ...base,
      HTTP_HEADERS_TIMEOUT_MS: '5000',
      HTTP_REQUEST_TIMEOUT_MS: '60000',
      HTTP_KEEP_ALIVE_TIMEOUT_MS: '5000',
    });
    expect([c.httpHeadersTimeoutMs, c.httpRequestTimeoutMs, c.httpKeepAliveTimeoutMs]).toEqual([
      5000, 60000, 5000,
    ]);
  });

  it.each([
    ['HTTP_HEADERS_TIMEOUT_MS', '0', /HTTP_HEADERS_TIMEOUT_MS must be an integer between 1000/],
    ['HTTP_HEADERS_TIMEOUT_MS', '10s', /HTTP_HEADERS_TIMEOUT_MS must be an integer/],
    ['HTTP_REQUEST_TIMEOUT_MS', '-1', /HTTP_REQUEST_TIMEOUT_MS must be an integer between 1000/],
    ['HTTP_KEEP_ALIVE_TIMEOUT_MS', '1.5', /HTTP_KEEP_ALIVE_TIMEOUT_MS must be an integer/],
    ['HTTP_KEEP_ALIVE_TIMEOUT_MS', '600001', /between 1000 and 600000/],
  ])('refuses %s=%s, naming it', (name, value, message) => {
    expect(() => loadConfig({ ...base, [name]: value })).toThrow(ConfigError);
    expect(() => loadConfig({ ...base, [name]: value })).toThrow(message);
  });

  it('refuses a request timeout shorter than the head timeout', () => {
    expect(() =>
      loadConfig({ ...base, HTTP_HEADERS_TIMEOUT_MS: '20000', HTTP_REQUEST_TIMEOUT_MS: '15000' }),
    ).toThrow(
      /HTTP_REQUEST_TIMEOUT_MS \(15000\) must be at least HTTP_HEADERS_TIMEOUT_MS \(20000\)/,
    );
  });
});
