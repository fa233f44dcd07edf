// Building blocks for the compute schemas. Examples come from the demo scenario: an evening
// engagement shoot by the invented Harrowgate Lane Studio on a riverside terrace (51.5 N, 0.1 W).
import type { JsonSchema } from '../validation/json-schema.js';

/** Largest magnitude any numeric input may have; finer ranges are enforced by the math library. */
export const ABSURD = 1e9;

export const num = (description: string, example?: number, extra: JsonSchema = {}): JsonSchema => ({
  type: 'number',
  description,
  minimum: -ABSURD,
  maximum: ABSURD,
  ...(example === undefined ? {} : { example }),
  ...extra,
});

export const outNum = (description: string, example?: number): JsonSchema => ({
  type: 'number',
  description,
  ...(example === undefined ? {} : { example }),
});

export const nullableNum = (description: string, example?: number | null): JsonSchema => ({
  type: ['number', 'null'],
  description,
  ...(example === undefined ? {} : { example }),
});

export const str = (description: string, example?: string, extra: JsonSchema = {}): JsonSchema => ({
  type: 'string',
  description,
  ...(example === undefined ? {} : { example }),
  ...extra,
});

export const bool = (description: string, example?: boolean): JsonSchema => ({
  type: 'boolean',
  description,
  ...(example === undefined ? {} : { example }),
});

export const lengthUnit = (description: string): JsonSchema => ({
  type: 'string',
  enum: ['m', 'ft'],
  description: `${description} Metres ("m", default) or feet ("ft").`,
  example: 'm',
});

export const WARNINGS: JsonSchema = {
  type: 'array',
  description: 'Things to look at: a stable code and a sentence for people.',
  items: {
    type: 'object',
    required: ['code', 'message'],
    properties: { code: str('Stable warning code.'), message: str('Explanation.') },
  },
};

export const object = (
  description: string,
  properties: Record<string, JsonSchema>,
  required: string[] = Object.keys(properties),
): JsonSchema => ({ type: 'object', description, properties, required });
