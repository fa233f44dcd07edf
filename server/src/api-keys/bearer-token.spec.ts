import { bearerToken } from './bearer-token.js';

const KEY = 'lw_live_AbCdEf123456_0123456789abcdefghijABCDEFGHIJkl';
const req = (authorization?: string, body?: unknown, query?: unknown) => ({
  headers: authorization === undefined ? {} : { authorization },
  body,
  query,
});

describe('bearerToken', () => {
  it('reads the key from "Authorization: Bearer <key>"', () => {
    // RFC 6750 §2.1 (credentials = "Bearer" 1*SP b64token); RFC 7235 §2.1: the scheme is
    // case-insensitive.
    expect(bearerToken(req(`Bearer ${KEY}`))).toBe(KEY);
    expect(bearerToken(req(`bearer ${KEY}`))).toBe(KEY);
    expect(bearerToken(req(`BEARER ${KEY}`, { cameraKelvin: 3200 }, {}))).toBe(KEY);
  });

  it('finds no key in other schemes, malformed headers or an empty credential', () => {
    // The single-space split passport-http-bearer 1.0.1 used (lib/strategy.js): anything but
    // exactly "<scheme> <token>" is refused.
    for (const h of [
      `Basic ${KEY}`,
      `Bearer  ${KEY}`,
      `Bearer\t${KEY}`,
      `Bearer ${KEY} extra`,
      'Bearer ',
      'Bearer',
      KEY,
    ]) {
      expect(bearerToken(req(h))).toBeNull();
    }
    expect(bearerToken(req())).toBeNull();
  });

  it('refuses a request that also carries access_token in its body or query string', () => {
    // RFC 6750 §2: a client MUST NOT use more than one method to transmit the token.
    expect(bearerToken(req(`Bearer ${KEY}`, { access_token: KEY }))).toBeNull();
    expect(bearerToken(req(`Bearer ${KEY}`, undefined, { access_token: 'x' }))).toBeNull();
    // A falsy or absent access_token is no second credential.
    expect(bearerToken(req(`Bearer ${KEY}`, { access_token: '' }, { other: 1 }))).toBe(KEY);
    expect(bearerToken(req(`Bearer ${KEY}`, [KEY], 'access_token'))).toBe(KEY);
  });

  it('never takes a key from the body or the query string alone', () => {
    expect(bearerToken(req(undefined, { access_token: KEY }))).toBeNull();
    expect(bearerToken(req(undefined, undefined, { access_token: KEY }))).toBeNull();
  });
});
