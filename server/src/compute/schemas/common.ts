// Building blocks for the compute schemas. Examples come from the demo scenario: an evening
// engagement shoot by the invented Harrowgate Lane Studio on a riverside terrace (51.5 N, 0.1 W).
import type { JsonSchema } from '../validation/json-schema.js';

/** Largest magnitude a numeric field without a range of its own may have. */
export const ABSURD = 1e9;

const numberSchema = (
  description: string,
  minimum: number,
  maximum: number,
  example?: number,
  extra: JsonSchema = {},
): JsonSchema => ({
  type: 'number',
  description,
  minimum,
  maximum,
  ...(example === undefined ? {} : { example }),
  ...extra,
});

/** A number with only the absurd bounds (fields outside the compute requests). */
export const num = (description: string, example?: number, extra: JsonSchema = {}): JsonSchema =>
  numberSchema(description, -ABSURD, ABSURD, example, extra);

/** 0.005 reads "0.005", 1/64000 reads "1/64000" (shutter and power fractions). */
export function formatBound(v: number): string {
  if (v > 0 && v < 0.01) {
    const r = Math.round(1 / v);
    if (1 / r === v) return `1/${r}`;
  }
  return String(v);
}

/**
 * A numeric request field with the range the shared math library enforces for it (the bounds of
 * its requireNumber/optionalNumber call in shared/src; the library is the reference). The
 * JSON-schema validator refuses values outside it before the math runs, so the spec and the
 * answers agree; ranges.spec.ts checks every bound against the library. The description ends with
 * the range in words, made from the same numbers: the SDK's generated types show descriptions,
 * not minimum/maximum.
 */
export const ranged = (
  description: string,
  minimum: number,
  maximum: number,
  example?: number,
  extra: JsonSchema = {},
): JsonSchema => {
  const whole = extra.type === 'integer' ? 'Whole number, ' : 'Range: ';
  const words = `${whole}${formatBound(minimum)} to ${formatBound(maximum)}.`;
  return numberSchema(`${description} ${words}`, minimum, maximum, example, extra);
};

/** Like {@link ranged}, for fields the library wants whole (`integer: true`). */
export const rangedInt = (
  description: string,
  minimum: number,
  maximum: number,
  example?: number,
): JsonSchema => ranged(description, minimum, maximum, example, { type: 'integer' });

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

const WARNINGS_DESCRIPTION = 'Things to look at: a stable code and a sentence for people.';

/**
 * A list of warnings whose `code` is one of `codes` (the shared library's list for the answer,
 * published as the enum), with what some of them mean in the description.
 */
export const warningsWith = (
  codes: readonly string[],
  meanings: Record<string, string> = {},
  description = WARNINGS_DESCRIPTION,
): JsonSchema => {
  const explained = Object.entries(meanings);
  return {
    type: 'array',
    description: explained.length
      ? `${description} Codes: ${explained.map(([code, meaning]) => `"${code}" (${meaning})`).join('; ')}.`
      : description,
    items: {
      type: 'object',
      required: ['code', 'message'],
      properties: {
        code: str('Stable warning code.', codes[0], { enum: [...codes] }),
        message: str('Explanation.'),
      },
    },
  };
};

export const object = (
  description: string,
  properties: Record<string, JsonSchema>,
  required: string[] = Object.keys(properties),
): JsonSchema => ({ type: 'object', description, properties, required });
