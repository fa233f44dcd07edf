// The refusals every operation of a kind can answer, added to the OpenAPI document so app
// developers see them without each route repeating them. Derived from what decides them:
// - a JSON request body: 400 (not JSON), 413 (over the body limit), 415 (another content type,
//   or compressed), 422 (a field wrong; `errors` names each) — registerJsonBodies and the
//   validation pipes in app.factory.ts;
// - query parameters: 422 naming the parameter;
// - path parameters: 404 when the id is not in the caller's organisation;
// - the access rule (src/common/guards/access.guard.ts): 401 without a valid session or key,
//   403 when the rule names only some roles;
// - unsafe methods: 403 for a cookie-carrying write from a foreign Origin (CSRF protection in
//   src/auth/session.plugin.ts);
// - every operation: 503 when PostgreSQL (or another dependency) is not available right now
//   (src/common/errors/transient.ts), with Retry-After.
// Responses a route documents itself keep their wording; each gets the problem+json content, and
// each 429 and 503 the Retry-After header.
import type { INestApplication } from '@nestjs/common';
import { ModulesContainer } from '@nestjs/core';
import type { OpenAPIObject } from '@nestjs/swagger';
import { ACCESS_KEY, ROLES, type AccessRule } from './common/decorators/access.decorator.js';
import {
  PROBLEM_CONTENT,
  RETRY_AFTER,
  type HeaderDocs,
} from './common/decorators/problem-responses.js';

/** The access rule of every route handler, by handler name (= operationId). */
export function accessRulesByHandler(app: INestApplication): Map<string, AccessRule> {
  const out = new Map<string, AccessRule>();
  for (const mod of app.get(ModulesContainer).values()) {
    for (const wrapper of mod.controllers.values()) {
      const cls = wrapper.metatype as (new (...a: never[]) => unknown) | null;
      if (!cls) continue;
      for (const name of Object.getOwnPropertyNames(cls.prototype)) {
        const fn = (cls.prototype as Record<string, unknown>)[name];
        if (name === 'constructor' || typeof fn !== 'function') continue;
        const rule = (Reflect.getMetadata(ACCESS_KEY, fn) ??
          Reflect.getMetadata(ACCESS_KEY, cls)) as AccessRule | undefined;
        if (!rule) continue;
        const seen = out.get(name);
        if (seen && JSON.stringify(seen) !== JSON.stringify(rule)) {
          throw new Error(`Two handlers named ${name} with different access rules`);
        }
        out.set(name, rule);
      }
    }
  }
  return out;
}

interface DocResponse {
  description?: string;
  content?: Record<string, unknown>;
  headers?: HeaderDocs;
}

interface DocOperation {
  operationId?: string;
  parameters?: { in?: string }[];
  requestBody?: { content?: Record<string, unknown> };
  responses: Record<string, DocResponse>;
}

const UNSAFE = new Set(['post', 'put', 'patch', 'delete']);
const CSRF =
  'A write carrying the session cookie from a foreign Origin is refused (CSRF protection).';
const ROLE = 'Your role does not allow this.';

const UNAUTHENTICATED: Record<Exclude<AccessRule['kind'], 'public'>, string> = {
  session: 'Not signed in: this route takes a console session (API keys cannot use it).',
  'api-key-or-session':
    'No API key or session, or the key is unknown, revoked or expired (WWW-Authenticate: Bearer).',
};

/** Why the access rule or the CSRF check may refuse the operation (403). */
function forbiddenReasons(method: string, rule: AccessRule | undefined): string[] {
  const out: string[] = [];
  if (rule && rule.kind !== 'public' && ROLES.some((r) => !rule.roles.includes(r))) {
    out.push(ROLE);
  }
  if (UNSAFE.has(method)) out.push(CSRF);
  return out;
}

/** The standard refusals of one operation, in status order. */
function standardProblems(
  method: string,
  op: DocOperation,
  rule: AccessRule | undefined,
): [number, string][] {
  const out: [number, string][] = [];
  const json = op.requestBody?.content?.['application/json'] !== undefined;
  const where = (kind: string) => (op.parameters ?? []).some((p) => p.in === kind);
  if (json) out.push([400, 'The body is not valid JSON.']);
  if (rule && rule.kind !== 'public') out.push([401, UNAUTHENTICATED[rule.kind]]);
  const forbidden = forbiddenReasons(method, rule);
  if (forbidden.length) out.push([403, forbidden.join(' ')]);
  if (where('path')) out.push([404, 'No such item in your organisation.']);
  if (json) {
    out.push([413, 'The body is larger than the server accepts (100 kB unless configured).']);
    out.push([415, 'The body is not JSON: send Content-Type: application/json, uncompressed.']);
  }
  if (json || where('query')) {
    out.push([422, 'A field is missing, of the wrong type or out of range; `errors` names each.']);
  }
  out.push([503, 'A dependency (the database) is unavailable right now; retry after Retry-After.']);
  return out;
}

/** Adds the standard refusals to every operation and gives every refusal its problem+json body. */
export function documentStandardProblems(doc: OpenAPIObject, rules: Map<string, AccessRule>): void {
  for (const item of Object.values(doc.paths)) {
    for (const [method, value] of Object.entries(item)) {
      if (!value || typeof value !== 'object' || !('responses' in value)) continue;
      const op = value as DocOperation;
      const rule = op.operationId ? rules.get(op.operationId) : undefined;
      for (const [status, description] of standardProblems(method, op, rule)) {
        op.responses[String(status)] ??= { description };
      }
      // A route's own 403 (a plan limit, an owner-only change) adds to the role and CSRF ones.
      const forbidden = op.responses['403'];
      if (forbidden) {
        for (const reason of forbiddenReasons(method, rule)) {
          if (forbidden.description?.includes(reason)) continue;
          forbidden.description = `${forbidden.description ?? ''} ${reason}`.trim();
        }
      }
      for (const [status, res] of Object.entries(op.responses)) {
        if (Number(status) < 400) continue;
        res.content = { ...PROBLEM_CONTENT, ...(res.content ?? {}) };
        if (status === '429' || status === '503') res.headers = { ...RETRY_AFTER, ...res.headers };
      }
    }
  }
}
