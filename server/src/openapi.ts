// The OpenAPI document: deterministic (sorted keys, operationId = handler name), with the
// refusals every operation can answer (src/openapi-problems.ts).
import type { INestApplication } from '@nestjs/common';
import { DocumentBuilder, OpenAPIObject, SwaggerModule } from '@nestjs/swagger';
import { APP_CONFIG, type AppConfig } from './config/config.js';
import type { JsonSchema } from './compute/validation/json-schema.js';
import { SCHEMA_DTOS, SCHEMA_REFS } from './compute/validation/schema-dto.js';
import { accessRulesByHandler, documentStandardProblems } from './openapi-problems.js';
import { COMPUTE_EXAMPLES } from './compute/schemas/examples.js';

const PROBLEM_SCHEMA = {
  type: 'object',
  description: 'An RFC 9457 problem detail.',
  required: ['type', 'title', 'status'],
  properties: {
    type: {
      type: 'string',
      format: 'uri',
      example: 'https://lumenwright.test/problems/invalid-input',
    },
    title: { type: 'string', example: 'Invalid input' },
    status: { type: 'integer', example: 422 },
    detail: { type: 'string' },
    instance: { type: 'string' },
    requestId: { type: 'string' },
    errors: {
      type: 'array',
      description: 'One entry per offending field.',
      items: {
        type: 'object',
        required: ['field', 'reason'],
        properties: {
          field: { type: 'string', example: 'latitude' },
          reason: { type: 'string', example: 'must be between -90 and 90' },
        },
      },
    },
  },
};

function sortDeep(value: unknown, key = ''): unknown {
  if (Array.isArray(value)) return value.map((v) => sortDeep(v));
  if (value && typeof value === 'object') {
    // Keep property order inside schemas' "properties" sorted too; arrays keep their order.
    const entries = Object.entries(value as Record<string, unknown>).sort(([a], [b]) =>
      a < b ? -1 : a > b ? 1 : 0,
    );
    return Object.fromEntries(entries.map(([k, v]) => [k, sortDeep(v, k)]));
  }
  void key;
  return value;
}

/**
 * A property's `required` in @ApiProperty is a boolean about the property itself, so an object
 * property's own list of required fields is lost on the way; put it back from the JSON schema.
 */
function restoreNestedRequired(doc: OpenAPIObject): void {
  for (const [name, schema] of SCHEMA_DTOS) {
    const target = doc.components?.schemas?.[name] as
      { properties?: Record<string, { required?: unknown }> } | undefined;
    if (!target?.properties) continue;
    for (const [key, prop] of Object.entries(schema.properties)) {
      const out = target.properties[key];
      if (out && Array.isArray(prop.required) && prop.required.length) {
        out.required = [...prop.required];
      }
    }
  }
}

/**
 * A DTO's own description and closedness (`additionalProperties: false`, which the validator
 * enforces: unknown fields are a 422) are not carried by the property decorators either.
 */
function restoreTopLevel(doc: OpenAPIObject): void {
  for (const [name, schema] of SCHEMA_DTOS) {
    const target = doc.components?.schemas?.[name] as Record<string, unknown> | undefined;
    if (!target) continue;
    if (schema.description && !target.description) target.description = schema.description;
    if (schema.additionalProperties === false) target.additionalProperties = false;
  }
}

type DocSchema = {
  properties?: Record<string, DocSchema>;
  items?: DocSchema;
  [k: string]: unknown;
};

/** Replaces inline copies of another DTO's schema (made with `refTo`) by a `$ref` to it. */
function referToDtos(src: JsonSchema, out: DocSchema | undefined): void {
  if (!out) return;
  for (const [key, sub] of Object.entries(src.properties ?? {})) {
    const ref = SCHEMA_REFS.get(sub);
    if (ref && out.properties?.[key]) {
      const $ref = `#/components/schemas/${ref.name}`;
      out.properties[key] = ref.nullable
        ? { description: sub.description, anyOf: [{ $ref }, { type: 'null' }] }
        : { description: sub.description, $ref };
      continue;
    }
    referToDtos(sub, out.properties?.[key]);
  }
  if (src.items) {
    const ref = SCHEMA_REFS.get(src.items);
    if (ref && out.items) {
      out.items = { $ref: `#/components/schemas/${ref.name}` };
    } else referToDtos(src.items, out.items);
  }
}

/**
 * Where the API answers: the configured PUBLIC_URL. The committed spec is written by
 * bin/write-openapi.ts from a fixed configuration, so it always reads the local default.
 */
function serverUrl(app: INestApplication): string {
  let config: AppConfig | undefined;
  try {
    config = app.get<AppConfig>(APP_CONFIG, { strict: false });
  } catch {
    config = undefined;
  }
  return config?.publicUrl ?? 'http://127.0.0.1:3000';
}

/** Each compute route's named request examples (the invented demo scenario). */
function attachComputeExamples(doc: OpenAPIObject): void {
  for (const [endpoint, examples] of Object.entries(COMPUTE_EXAMPLES)) {
    const media = doc.paths[`/v1/${endpoint}`]?.post?.requestBody as
      { content?: Record<string, { examples?: unknown }> } | undefined;
    const json = media?.content?.['application/json'];
    if (!json) throw new Error(`no JSON body documented for POST /v1/${endpoint}`);
    json.examples = examples;
  }
}

export function buildOpenApiDocument(app: INestApplication): OpenAPIObject {
  const config = new DocumentBuilder()
    .setOpenAPIVersion('3.1.0')
    .setTitle('Lumenwright API')
    .setDescription(
      'Lighting math for flash portraits at dusk: twilight and ambient light, background exposure, ' +
        'flash power and falloff, gel and white-balance balancing, the whole dusk setup. ' +
        'Errors are RFC 9457 problem+json.',
    )
    .setVersion('1')
    .addServer(serverUrl(app), 'This server')
    .addBearerAuth(
      {
        type: 'http',
        scheme: 'bearer',
        // Not a JWT: the key is an opaque secret the server looks up.
        bearerFormat: 'opaque',
        description:
          'An API key, opaque (not a JWT; nothing to decode): lw_live_… for live calls, ' +
          'lw_test_… for test calls.',
      },
      'apiKey',
    )
    .addCookieAuth('lw_session', { type: 'apiKey', in: 'cookie', name: 'lw_session' }, 'session')
    .build();
  const doc = SwaggerModule.createDocument(app, config, {
    operationIdFactory: (_controllerKey: string, methodKey: string) => methodKey,
  });
  doc.components = doc.components ?? {};
  doc.components.schemas = { ...(doc.components.schemas ?? {}), Problem: PROBLEM_SCHEMA };
  restoreNestedRequired(doc);
  restoreTopLevel(doc);
  documentStandardProblems(doc, accessRulesByHandler(app));
  attachComputeExamples(doc);
  for (const [name, schema] of SCHEMA_DTOS) {
    referToDtos(schema, doc.components.schemas[name] as DocSchema | undefined);
  }
  return sortDeep(doc) as OpenAPIObject;
}
