// A small, strict JSON-Schema validator compiled once per route into closures. Why not
// class-validator: it costs most of the hot path (see the stack notes). Why not Fastify's route
// schema: its Ajv coerces types ("12" -> 12, true -> 1) and runs before authentication, so a
// caller without a key would see validation errors and metering could not attribute them.
// Supported: type (incl. arrays of types), enum, minimum/maximum (+exclusive), minLength,
// maxLength, pattern, format "date", properties/required/additionalProperties:false,
// items/minItems/maxItems. Field paths use the shared library's style: `gels[2].miredShift`.
// Refusals are words, never a regular expression, and a field gets one problem: the first check
// it fails (a value that is not a date is not also told it does not match the date pattern).
import type { FieldProblem } from '../../common/errors/domain-error.js';

export type JsonType = 'number' | 'integer' | 'string' | 'boolean' | 'object' | 'array' | 'null';

export interface JsonSchema {
  type?: JsonType | JsonType[];
  description?: string;
  example?: unknown;
  enum?: readonly (string | number)[];
  minimum?: number;
  maximum?: number;
  exclusiveMinimum?: number;
  exclusiveMaximum?: number;
  minLength?: number;
  maxLength?: number;
  pattern?: string;
  /**
   * What `pattern` accepts, in words, for the refusal: "a whole number from 1 to 100" gives
   * "must be a whole number from 1 to 100". Not published (the description says it to readers).
   * Without it, a known `format` or the UUID pattern supplies the words.
   */
  patternWords?: string;
  format?: string;
  properties?: Record<string, JsonSchema>;
  required?: readonly string[];
  /** `false` closes an object (the validator enforces it); a schema documents a map's values. */
  additionalProperties?: boolean | JsonSchema;
  items?: JsonSchema;
  minItems?: number;
  maxItems?: number;
  default?: unknown;
  nullable?: boolean;
}

type Check = (value: unknown, path: string, out: FieldProblem[]) => void;

/** Stop collecting after this many problems: a hostile body must not make a huge error list. */
const MAX_PROBLEMS = 20;
const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** The canonical UUID pattern (any version, either case). */
export const UUID_PATTERN =
  '^[0-9a-fA-F]{8}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{4}-[0-9a-fA-F]{12}$';

/** Words for the formats the validator knows, used when a value misses its pattern. */
const FORMAT_WORDS: Record<string, string> = {
  uuid: 'a UUID',
  date: 'a calendar date, YYYY-MM-DD',
};

/** "must be a UUID": what a pattern expects, in words; never the expression itself. */
export function patternReason(s: JsonSchema): string {
  const words =
    s.patternWords ??
    (s.format ? FORMAT_WORDS[s.format] : undefined) ??
    (s.pattern === UUID_PATTERN ? FORMAT_WORDS.uuid : undefined);
  return words ? `must be ${words}` : 'is not in the form the description gives';
}

function typeOf(v: unknown): JsonType {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  const t = typeof v;
  if (t === 'number') return Number.isInteger(v) ? 'integer' : 'number';
  return t as JsonType;
}

function matchesType(actual: JsonType, wanted: JsonType): boolean {
  return actual === wanted || (wanted === 'number' && actual === 'integer');
}

const join = (path: string, key: string) => (path ? `${path}.${key}` : key);
const label = (path: string) => path || 'body';

const A_TYPE: Record<JsonType, string> = {
  number: 'a number',
  integer: 'a whole number',
  string: 'a string',
  boolean: 'true or false',
  object: 'an object',
  array: 'an array',
  null: 'null',
};

/** "an object", "a number or null": the words a person reads in the problem. */
function describeTypes(types: JsonType[]): string {
  const words = types.map((t) => A_TYPE[t]);
  return words.length <= 2
    ? words.join(' or ')
    : `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}

function numberChecks(s: JsonSchema): Check[] {
  const c: Check[] = [];
  if (s.minimum !== undefined) {
    const m = s.minimum;
    c.push(
      (v, p, o) =>
        void ((v as number) < m && o.push({ field: label(p), reason: `must be at least ${m}` })),
    );
  }
  if (s.maximum !== undefined) {
    const m = s.maximum;
    c.push(
      (v, p, o) =>
        void ((v as number) > m && o.push({ field: label(p), reason: `must be at most ${m}` })),
    );
  }
  if (s.exclusiveMinimum !== undefined) {
    const m = s.exclusiveMinimum;
    c.push(
      (v, p, o) =>
        void (
          (v as number) <= m && o.push({ field: label(p), reason: `must be greater than ${m}` })
        ),
    );
  }
  if (s.exclusiveMaximum !== undefined) {
    const m = s.exclusiveMaximum;
    c.push(
      (v, p, o) =>
        void ((v as number) >= m && o.push({ field: label(p), reason: `must be less than ${m}` })),
    );
  }
  return c;
}

function stringChecks(s: JsonSchema): Check[] {
  const c: Check[] = [];
  if (s.minLength !== undefined) {
    const m = s.minLength;
    c.push(
      (v, p, o) =>
        void (
          (v as string).length < m &&
          o.push({ field: label(p), reason: `must have at least ${m} characters` })
        ),
    );
  }
  if (s.maxLength !== undefined) {
    const m = s.maxLength;
    c.push(
      (v, p, o) =>
        void (
          (v as string).length > m &&
          o.push({ field: label(p), reason: `must have at most ${m} characters` })
        ),
    );
  }
  if (s.pattern !== undefined) {
    const re = new RegExp(s.pattern, 'u');
    const reason = patternReason(s);
    c.push((v, p, o) => void (!re.test(v as string) && o.push({ field: label(p), reason })));
  }
  if (s.format === 'date') {
    c.push((v, p, o) => {
      const str = v as string;
      const d = new Date(`${str}T00:00:00Z`);
      if (!DATE.test(str) || Number.isNaN(d.getTime()) || d.toISOString().slice(0, 10) !== str) {
        o.push({ field: label(p), reason: `must be ${FORMAT_WORDS.date}` });
      }
    });
  }
  if (s.format === 'uuid' && s.pattern === undefined) {
    const re = new RegExp(UUID_PATTERN, 'u');
    c.push(
      (v, p, o) =>
        void (!re.test(v as string) && o.push({ field: label(p), reason: patternReason(s) })),
    );
  }
  return c;
}

function objectCheck(s: JsonSchema): Check {
  const props = Object.entries(s.properties ?? {}).map(([k, sub]) => [k, compile(sub)] as const);
  const known = new Set(Object.keys(s.properties ?? {}));
  const required = s.required ?? [];
  const closed = s.additionalProperties === false;
  return (v, p, o) => {
    const obj = v as Record<string, unknown>;
    for (const r of required) {
      if (obj[r] === undefined) o.push({ field: join(p, r), reason: 'is required' });
    }
    if (closed) {
      for (const k of Object.keys(obj)) {
        if (!known.has(k)) o.push({ field: join(p, k), reason: 'is not a known field' });
        if (o.length >= MAX_PROBLEMS) return;
      }
    }
    for (const [k, check] of props) {
      if (o.length >= MAX_PROBLEMS) return;
      const child = obj[k];
      if (child !== undefined) check(child, join(p, k), o);
    }
  };
}

function arrayCheck(s: JsonSchema): Check {
  const item = s.items ? compile(s.items) : null;
  return (v, p, o) => {
    const arr = v as unknown[];
    if (s.minItems !== undefined && arr.length < s.minItems) {
      o.push({ field: label(p), reason: `must have at least ${s.minItems} items` });
    }
    if (s.maxItems !== undefined && arr.length > s.maxItems) {
      o.push({ field: label(p), reason: `must have at most ${s.maxItems} items` });
      return;
    }
    if (!item) return;
    for (let i = 0; i < arr.length && o.length < MAX_PROBLEMS; i++) item(arr[i], `${p}[${i}]`, o);
  };
}

function compile(s: JsonSchema): Check {
  const types: JsonType[] = s.type === undefined ? [] : Array.isArray(s.type) ? s.type : [s.type];
  const byType: Partial<Record<JsonType, Check[]>> = {
    number: numberChecks(s),
    integer: numberChecks(s),
    string: stringChecks(s),
    object: s.properties || s.additionalProperties === false ? [objectCheck(s)] : [],
    array: [arrayCheck(s)],
  };
  const allowed = s.enum ? new Set<unknown>(s.enum) : null;
  return (v, p, o) => {
    const actual = typeOf(v);
    if ((actual === 'number' || actual === 'integer') && !Number.isFinite(v as number)) {
      o.push({ field: label(p), reason: 'must be a finite number' });
      return;
    }
    if (types.length && !types.some((t) => matchesType(actual, t))) {
      o.push({ field: label(p), reason: `must be ${describeTypes(types)}` });
      return;
    }
    if (allowed && !allowed.has(v)) {
      o.push({ field: label(p), reason: `must be one of ${[...allowed].join(', ')}` });
      return;
    }
    const checks = byType[actual === 'integer' ? 'number' : actual];
    if (!checks) return;
    // One problem per field: stop at the first check that refused this value.
    for (const c of checks) {
      const before = o.length;
      c(v, p, o);
      if (o.length > before) return;
    }
  };
}

export type Validator = (value: unknown) => FieldProblem[];

/** Compiles a schema once; the returned function lists problems (empty when valid). */
export function compileSchema(schema: JsonSchema): Validator {
  const check = compile(schema);
  return (value) => {
    const out: FieldProblem[] = [];
    check(value, '', out);
    return out.slice(0, MAX_PROBLEMS);
  };
}
