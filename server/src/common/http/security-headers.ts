// Security response headers, two fixed sets computed once at boot:
// - pages (the console, /docs, the shot sheet): helmet's set (CSP, frame, referrer, MIME-sniffing,
//   cross-origin policies…);
// - API answers under /v1 (JSON, problem+json, CSV, thumbnails): the set the OWASP REST Security
//   Cheat Sheet ("Security Headers") recommends for APIs — no caching of per-tenant data, a CSP
//   that allows nothing, no framing, no MIME sniffing — plus a same-origin resource policy and no
//   referrer. The document-only headers (DNS prefetch, download options, XSS filter…) are left off.
//
// A route under /v1 that answers an HTML page says so with `@RouteConfig({ page: true })`.
//
// Our helmet options are constant (no per-request CSP nonces), so the headers never change between
// requests; running helmet's middleware per request (re-parsing the CSP directives each time)
// cost ~4% of the CPU of a metered call under load.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { FastifyInstance, onRequestHookHandler, RouteOptions } from 'fastify';
import helmet, { type HelmetOptions } from 'helmet';
import { appendRouteHook } from './scoped-hooks.js';

export function helmetHeaders(options: HelmetOptions): Record<string, string> {
  const headers: Record<string, string> = {};
  const res = {
    setHeader(name: string, value: string | number | readonly string[]) {
      headers[name] = Array.isArray(value) ? value.join(', ') : String(value);
      return res;
    },
    removeHeader(name: string) {
      delete headers[name];
    },
    getHeader(name: string) {
      return headers[name];
    },
  };
  let failure: unknown;
  helmet(options)({} as IncomingMessage, res as unknown as ServerResponse, (err?: unknown) => {
    failure = err;
  });
  if (failure) throw failure instanceof Error ? failure : new Error(String(failure));
  return headers;
}

/** The headers of an API answer (OWASP REST Security Cheat Sheet, "Security Headers"). */
export function apiHeaders(https: boolean): Record<string, string> {
  return {
    'Cache-Control': 'no-store',
    'Content-Security-Policy': "default-src 'none'; frame-ancestors 'none'",
    'X-Content-Type-Options': 'nosniff',
    'X-Frame-Options': 'DENY',
    'Cross-Origin-Resource-Policy': 'same-origin',
    'Referrer-Policy': 'no-referrer',
    ...(https ? { 'Strict-Transport-Security': 'max-age=31536000; includeSubDomains' } : {}),
  };
}

export interface PageRouteConfig {
  /** The route answers an HTML page: it gets the page set of security headers. */
  page?: boolean;
}

const API_PATH = /^\/v1(?:[/?]|$)/;

export function registerSecurityHeaders(fastify: FastifyInstance, https: boolean): void {
  const page = helmetHeaders(securityHeaderOptions(https));
  const api = apiHeaders(https);
  const apiOnly = Object.keys(api).filter(
    (k) => !Object.keys(page).some((p) => p.toLowerCase() === k.toLowerCase()),
  );
  fastify.addHook('onRequest', (req, reply, done) => {
    void reply.headers(API_PATH.test(req.url) ? api : page);
    done();
  });
  // Pages under /v1: their own route-level hook swaps in the page set.
  const asPage: onRequestHookHandler = (_req, reply, done) => {
    for (const k of apiOnly) void reply.removeHeader(k);
    void reply.headers(page);
    done();
  };
  fastify.addHook('onRoute', (route: RouteOptions) => {
    if (!(route.config as PageRouteConfig | undefined)?.page) return;
    appendRouteHook(route, 'onRequest', asPage);
  });
}

/** Our options for the API and the console (HSTS and upgrade-insecure-requests only over HTTPS). */
export function securityHeaderOptions(https: boolean): HelmetOptions {
  return {
    hsts: https ? { maxAge: 31536000, includeSubDomains: true } : false,
    contentSecurityPolicy: {
      directives: {
        upgradeInsecureRequests: https ? [] : null,
        defaultSrc: ["'self'"],
        // Swagger UI at /docs runs an inline initialiser.
        scriptSrc: ["'self'", "'unsafe-inline'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        connectSrc: ["'self'"],
        fontSrc: ["'self'", 'data:'],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
      },
    },
    crossOriginEmbedderPolicy: false,
  };
}
