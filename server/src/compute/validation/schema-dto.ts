// One JSON schema per DTO is the source of truth: it validates the body (compiled once) and is
// turned into a named class carrying @ApiProperty metadata, so the OpenAPI document (and the SDK
// generated from it) shows exactly what the validator enforces.
import { applyDecorators, PipeTransform } from '@nestjs/common';
import { ApiProperty, ApiQuery } from '@nestjs/swagger';
import { DomainError, invalidInput } from '../../common/errors/domain-error.js';
import { compileSchema, JsonSchema, Validator } from './json-schema.js';

export type ObjectSchema = JsonSchema & { type: 'object'; properties: Record<string, JsonSchema> };

/** Every schema DTO by name (the OpenAPI builder restores what the decorators cannot carry). */
export const SCHEMA_DTOS = new Map<string, ObjectSchema>();

/** Sub-schemas that are another DTO's whole schema: the document refers to that DTO by name. */
export const SCHEMA_REFS = new WeakMap<JsonSchema, { name: string; nullable: boolean }>();

/**
 * `schema` (the schema of DTO `name`) used inside another schema, with its own description: the
 * validator and tests see the schema itself, the OpenAPI document a `$ref` to the DTO.
 */
export function refTo(
  name: string,
  schema: ObjectSchema,
  description: string,
  nullable = false,
): JsonSchema {
  const out: JsonSchema = {
    ...schema,
    description,
    ...(nullable ? { type: ['object', 'null'] } : {}),
  };
  SCHEMA_REFS.set(out, { name, nullable });
  return out;
}

/** `schema` as published: without the validator's own wording hints (`patternWords`). */
export function forDocs<T>(schema: T): T {
  if (Array.isArray(schema)) return schema.map((v) => forDocs(v) as unknown) as T;
  if (!schema || typeof schema !== 'object') return schema;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(schema)) {
    if (k !== 'patternWords') out[k] = forDocs(v);
  }
  return out as T;
}

/** A class named `name` whose Swagger metadata mirrors `schema` (properties, required, examples). */
export function schemaDto(name: string, schema: ObjectSchema): new () => object {
  const Dto = { [name]: class {} }[name]!;
  SCHEMA_DTOS.set(name, schema);
  const required = new Set(schema.required ?? []);
  for (const [key, prop] of Object.entries(schema.properties)) {
    const { nullable: _nullable, ...rest } = forDocs(prop);
    void _nullable;
    // A JSON-Schema type list such as ['string', 'null'] would read as "array of string" to the
    // Swagger decorators: describe it as the non-null type, marked nullable.
    const types = Array.isArray(rest.type) ? (rest.type as string[]) : null;
    const typed = types
      ? {
          ...rest,
          type: types.find((x) => x !== 'null') ?? 'string',
          nullable: types.includes('null'),
        }
      : rest;
    ApiProperty({ ...(typed as Record<string, unknown>), required: required.has(key) })(
      Dto.prototype,
      key,
    );
  }
  return Dto;
}

/** Validates a request body against a compiled schema; 422 problem+json naming each field. */
export class SchemaPipe implements PipeTransform {
  private readonly validate: Validator;

  constructor(schema: JsonSchema) {
    this.validate = compileSchema(schema);
  }

  transform(value: unknown): unknown {
    if (value === undefined || value === null) {
      throw new DomainError('invalid_input', 'Send a JSON object as the request body.', [
        { field: 'body', reason: 'is required' },
      ]);
    }
    const problems = this.validate(value);
    if (problems.length) throw invalidInput(problems);
    return value;
  }
}

/** A decimal as a query string writes it: "20", "-3", "1.5" (no exponent, no blanks, no hex). */
const DECIMAL = /^-?\d+(?:\.\d+)?$/;

/**
 * Validates a query string against an object schema. Query values arrive as strings, so a
 * property the schema types as a number or a whole number is read as one when it is written as
 * a decimal; anything else ("abc", "", a repeated parameter) stays as sent and is refused in
 * words ("limit must be a whole number"), as are numbers outside the published range
 * ("must be at least 1") and fractions where a whole number is wanted. The handler gets numbers.
 */
export class QuerySchemaPipe implements PipeTransform {
  private readonly validate: Validator;
  /** Numeric parameters, each with the words its refusal reads when it has a range. */
  private readonly numeric = new Map<string, string | null>();

  constructor(schema: ObjectSchema) {
    this.validate = compileSchema(schema);
    for (const [k, p] of Object.entries(schema.properties)) {
      const types = Array.isArray(p.type) ? p.type : [p.type];
      const whole = types.includes('integer');
      if (!whole && !types.includes('number')) continue;
      const ranged = p.minimum !== undefined && p.maximum !== undefined;
      this.numeric.set(
        k,
        ranged
          ? `must be ${whole ? 'a whole number' : 'a number'} from ${p.minimum} to ${p.maximum}`
          : null,
      );
    }
  }

  transform(value: unknown): unknown {
    const query: Record<string, unknown> = { ...((value as Record<string, unknown>) ?? {}) };
    for (const k of this.numeric.keys()) {
      const v = query[k];
      if (typeof v === 'string' && DECIMAL.test(v)) query[k] = Number(v);
    }
    // A ranged number reads one way whatever was wrong ("abc", 0, 1000, 1.5): its whole range.
    const problems = this.validate(query).map((p) => {
      const words = this.numeric.get(p.field);
      return words ? { ...p, reason: words } : p;
    });
    if (problems.length) throw invalidInput(problems);
    return query;
  }
}

/** Documents each property of a query-string schema as an optional query parameter. */
export function ApiQueryFromSchema(schema: ObjectSchema): MethodDecorator {
  const required = new Set(schema.required ?? []);
  return applyDecorators(
    ...Object.entries(schema.properties).map(([name, prop]) =>
      ApiQuery({
        name,
        required: required.has(name),
        description: prop.description,
        schema: forDocs(prop) as Record<string, unknown>,
      }),
    ),
  );
}
