// The refusals the OpenAPI document states for each operation: built the way the spec writer
// builds it (no port, no database), then checked operation by operation against the rules in
// openapi-problems.ts, and the pass itself on a small document.
import type { INestApplication } from '@nestjs/common';
import type { OpenAPIObject } from '@nestjs/swagger';
import { createPreviewApp } from './app.factory.js';
import type { AccessRule } from './common/decorators/access.decorator.js';
import { buildOpenApiDocument } from './openapi.js';
import { accessRulesByHandler, documentStandardProblems } from './openapi-problems.js';

interface Res {
  description?: string;
  content?: Record<string, { schema?: { $ref?: string } }>;
  headers?: Record<string, unknown>;
}
interface Op {
  operationId: string;
  security?: unknown[];
  parameters?: { in: string }[];
  requestBody?: { content?: Record<string, unknown> };
  responses: Record<string, Res>;
}

const ops = (doc: OpenAPIObject) =>
  Object.entries(doc.paths).flatMap(([path, item]) =>
    Object.entries(item as Record<string, Op>).map(([method, op]) => ({ path, method, op })),
  );

describe('documented refusals (problem+json) of every operation', () => {
  let app: INestApplication;
  let doc: OpenAPIObject;
  let rules: Map<string, AccessRule>;
  beforeAll(async () => {
    app = await createPreviewApp();
    doc = buildOpenApiDocument(app);
    rules = accessRulesByHandler(app);
  }, 60000);
  afterAll(async () => {
    await app?.close();
  });

  it('knows the access rule of every documented operation', () => {
    const all = ops(doc);
    expect(all.length).toBeGreaterThan(60);
    expect(all.filter(({ op }) => !rules.has(op.operationId)).map((o) => o.op.operationId)).toEqual(
      [],
    );
  });

  it('gives every refusal the Problem schema, and every 429 and 503 a Retry-After', () => {
    const wrong: string[] = [];
    for (const { path, method, op } of ops(doc)) {
      expect(op.responses['503']).toBeDefined();
      for (const [status, res] of Object.entries(op.responses)) {
        if (Number(status) < 400) continue;
        const id = `${method.toUpperCase()} ${path} ${status}`;
        const ref = res.content?.['application/problem+json']?.schema?.$ref;
        if (ref !== '#/components/schemas/Problem') wrong.push(`${id}: no problem+json`);
        if (!res.description) wrong.push(`${id}: no description`);
        if ((status === '429' || status === '503') && !res.headers?.['Retry-After']) {
          wrong.push(`${id}: no Retry-After`);
        }
      }
    }
    expect(wrong).toEqual([]);
  });

  it('states the refusals that follow from the body, the parameters, the access rule and the method', () => {
    const missing: string[] = [];
    for (const { path, method, op } of ops(doc)) {
      const want: string[] = ['503'];
      const rule = rules.get(op.operationId)!;
      if (op.requestBody?.content?.['application/json']) want.push('400', '413', '415', '422');
      if ((op.parameters ?? []).some((p) => p.in === 'query')) want.push('422');
      if ((op.parameters ?? []).some((p) => p.in === 'path')) want.push('404');
      if (rule.kind !== 'public') want.push('401');
      if (['post', 'put', 'patch', 'delete'].includes(method)) {
        want.push('403');
        if (!op.responses['403']?.description?.includes('CSRF')) {
          missing.push(`${method} ${path} 403 without the CSRF refusal`);
        }
      }
      if (rule.kind !== 'public' && rule.roles.length < 4) {
        want.push('403');
        if (!op.responses['403']?.description?.includes('Your role does not allow this.')) {
          missing.push(`${method} ${path} 403 without the role refusal`);
        }
      }
      for (const s of want) {
        if (!op.responses[s]) missing.push(`${method.toUpperCase()} ${path} ${s}`);
      }
      // Documented security matches the rule: public routes need no credentials.
      expect({ id: op.operationId, secured: (op.security ?? []).length > 0 }).toEqual({
        id: op.operationId,
        secured: rule.kind !== 'public',
      });
    }
    expect(missing).toEqual([]);
  });

  it('documents the metered routes’ 429 with the rate-limit fields, and the throttled sign-ins', () => {
    const metered = ops(doc).filter(({ op }) =>
      [
        'computeTwilight',
        'solveExposure',
        'computeFlash',
        'computeFalloff',
        'computeBacklight',
        'solveBalance',
        'planSetup',
        'uploadFrame',
      ].includes(op.operationId),
    );
    expect(metered).toHaveLength(8);
    for (const { op } of metered) {
      expect(Object.keys(op.responses['429']?.headers ?? {}).sort()).toEqual([
        'RateLimit',
        'RateLimit-Policy',
        'Retry-After',
      ]);
    }
    const byId = new Map(ops(doc).map(({ op }) => [op.operationId, op]));
    for (const id of ['signIn', 'signUp', 'acceptInvite']) {
      expect({ id, has429: !!byId.get(id)!.responses['429'] }).toEqual({ id, has429: true });
    }
    // Gear named by id in a computation: 404 naming the field.
    expect(byId.get('solveBalance')!.responses['404']).toBeDefined();
    expect(byId.get('planSetup')!.responses['404']).toBeDefined();
    expect(byId.get('computeFlash')!.responses['404']).toBeDefined();
    // Computations that take no gear ids document no 404.
    expect(byId.get('computeFalloff')!.responses['404']).toBeUndefined();
  });

  it('keeps a route’s own wording and adds nothing a route cannot answer', () => {
    const small = {
      openapi: '3.1.0',
      info: { title: 't', version: '1' },
      paths: {
        '/v1/things': {
          get: { operationId: 'listThings', responses: { '200': { description: 'ok' } } },
          post: {
            operationId: 'createThing',
            requestBody: { content: { 'application/json': {} } },
            responses: {
              '201': { description: 'made' },
              '409': { description: 'The name is taken.' },
              '403': { description: 'Owners only.' },
            },
          },
        },
      },
    } as unknown as OpenAPIObject;
    const rules = new Map<string, AccessRule>([
      ['listThings', { kind: 'public' }],
      ['createThing', { kind: 'session', roles: ['owner'] }],
    ]);
    documentStandardProblems(small, rules);
    const paths = small.paths as unknown as Record<string, Record<string, Op>>;
    const get = paths['/v1/things']!.get!.responses;
    const post = paths['/v1/things']!.post!.responses;
    expect(Object.keys(get).sort()).toEqual(['200', '503']);
    expect(Object.keys(post).sort()).toEqual([
      '201',
      '400',
      '401',
      '403',
      '409',
      '413',
      '415',
      '422',
      '503',
    ]);
    expect(post['409']!.description).toBe('The name is taken.');
    expect(post['403']!.description).toMatch(
      /^Owners only\. Your role does not allow this\. .*CSRF/,
    );
    expect(post['201']!.content).toBeUndefined();
  });
});
