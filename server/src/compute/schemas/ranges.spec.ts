// The numeric ranges the OpenAPI document publishes for the compute requests must be the ranges
// the math enforces. The reference is the shared math library (shared/src/**: the bounds of its
// requireNumber / optionalNumber / maybeNumber calls); the request schemas copy them. This walks
// every numeric property of every published compute request schema (the gear-aware balance and
// setup ones included) and, for each bound, calls the library function the route calls:
//   - with the value just outside the bound (the adjacent double, or ±1 for integers): the
//     library refuses it with a LightingInputError naming that field, and so does the schema
//     validator, with the same field path (`gels[0].lossStops`, `key.distance`);
//   - with the value exactly at the bound: neither the schema nor the library refuses that
//     field for its range.
// So a bound changed in the library without the schema (or the other way round) fails here.
import {
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeTwilight,
  LightingInputError,
  planDuskSetup,
  planEveningTimeline,
  solveBackgroundExposure,
  solveBalance,
  solveExposure,
} from '@lumenwright/shared';
import { DEMO_BODIES } from '../../../test/factories/compute.js';
import { compileSchema, type JsonSchema } from '../validation/json-schema.js';
import { ABSURD } from './common.js';
import { BACKGROUND_FIELDS } from './exposure.schema.js';
import { gearBalanceRequestSchema, gearSetupRequestSchema } from './gear-aware.dto.js';
import { REQUEST_SCHEMAS } from './index.js';

type Body = Record<string, unknown>;

/** The library function each route runs (as ComputeService picks it). */
const LIBRARY: Record<string, (input: Body) => unknown> = {
  twilight: (i) => computeTwilight(i as never),
  exposure: (i) =>
    BACKGROUND_FIELDS.some((f) => i[f] !== undefined)
      ? solveBackgroundExposure(i as never)
      : solveExposure(i as never),
  flash: (i) => computeFlash(i as never),
  falloff: (i) => computeFalloff(i as never),
  backlight: (i) => computeBacklight(i as never),
  balance: (i) => solveBalance(i as never),
  setup: (i) => planDuskSetup(i as never),
  timeline: (i) => planEveningTimeline(i as never),
};

/** The schemas the routes validate with and the document publishes. */
const PUBLISHED: Record<string, JsonSchema> = {
  ...REQUEST_SCHEMAS,
  balance: gearBalanceRequestSchema,
  setup: gearSetupRequestSchema,
};

const GEL = { name: 'Half warming', miredShift: 81, lossStops: 0.33 };

interface Base {
  name: string;
  input: Body;
  /** Fields (paths) this base is used for; default every field whose parent it has. */
  only?: RegExp;
  skip?: RegExp;
}

// Valid inputs to vary one field of: the demo bodies (the invented riverside-terrace shoot), with
// the optional objects present so their fields can be reached.
const BASES: Record<string, Base[]> = {
  twilight: [
    {
      name: 'demo',
      input: {
        ...DEMO_BODIES.twilight,
        goldenHour: { upperDeg: 6, lowerDeg: -4 },
        blueHour: { upperDeg: -4, lowerDeg: -8 },
      },
    },
  ],
  exposure: [
    {
      name: 'plain',
      input: DEMO_BODIES.exposure!,
      only: /^(ev100|aperture|shutterSeconds|iso)$/,
    },
    {
      name: 'background',
      input: { ev100: 9, aperture: 4, biasStops: -1, flashSyncSeconds: 0.005 },
      skip: /^shutterSeconds$/,
    },
    {
      name: 'place',
      input: {
        place: { latitude: 51.507, longitude: -0.1, time: '2026-06-20T21:45:00+01:00' },
        aperture: 4,
      },
      only: /^place\./,
    },
  ],
  flash: [{ name: 'demo', input: DEMO_BODIES.flash! }],
  falloff: [{ name: 'demo', input: DEMO_BODIES.falloff! }],
  backlight: [{ name: 'demo', input: DEMO_BODIES.backlight! }],
  balance: [{ name: 'demo', input: { ...DEMO_BODIES.balance, gels: [GEL] } }],
  setup: [
    {
      name: 'demo',
      input: {
        ...DEMO_BODIES.setup,
        camera: {},
        rim: { guideNumber: 45, distanceBehind: 3, lightHeight: 2 },
        conditions: {},
        gels: [GEL],
      },
    },
  ],
  timeline: [
    { name: 'demo', input: { ...DEMO_BODIES.timeline, setupMinutes: 10, conditions: {} } },
  ],
};

/**
 * Extra fields a bound needs to be reachable at all: a lower bound that follows another field
 * (isoMax >= isoMin, apertureMax >= apertureMin, to >= from in the library), and the unit whose
 * range is the widest (feet) for the unit-dependent distances (see CONTEXT_AT_MIN for lower
 * bounds that are widest in metres).
 */
const CONTEXT: Record<string, Body> = {
  'exposure isoMax': { isoMin: 3 },
  'exposure apertureMax': { apertureMin: 0.7 },
  'falloff to': { from: 0.05 },
  'backlight lightHeight': { distanceUnit: 'ft' },
  'backlight distanceBehind': { distanceUnit: 'ft' },
  'backlight headHeight': { distanceUnit: 'ft' },
  'setup camera.isoMax': { camera: { isoMin: 3 } },
  // The floor may not be brighter than the bias (default -1): its top is reached at bias 6.
  'setup camera.biasFloorStops': { camera: { biasStops: 6 } },
  'setup rim.lightHeight': { rim: { distanceUnit: 'ft' } },
  'setup rim.distanceBehind': { rim: { distanceUnit: 'ft' } },
  'setup key.distance': { key: { distanceUnit: 'ft' } },
  'setup key.modifierSize': { key: { distanceUnit: 'ft' } },
  'twilight elevation': { elevationUnit: 'ft' },
  'setup elevation': { elevationUnit: 'ft' },
};

/**
 * Where the metres' bound is the wider one (the nearest light distance: 0.1 m, but 0.33 ft), the
 * lower bound is reached in metres.
 */
const CONTEXT_AT_MIN: Record<string, Body> = {
  'backlight distanceBehind': { distanceUnit: 'm' },
  'setup rim.distanceBehind': { rim: { distanceUnit: 'm' } },
  'setup key.distance': { key: { distanceUnit: 'm' } },
  'backlight headHeight': { distanceUnit: 'm' },
  'setup key.modifierSize': { key: { distanceUnit: 'm' } },
};

const contextOf = (c: BoundCase): Body =>
  (c.side === 'min' ? CONTEXT_AT_MIN[fieldKey(c)] : undefined) ?? CONTEXT[fieldKey(c)] ?? {};

/**
 * Unit-dependent ranges in the library (backlight.ts: lightHeight at most 10 m or 33 ft, headHeight
 * 0.1..10 m or 0.33..33 ft, distanceBehind 0.1..50 m or 0.33..164 ft): the schema publishes the widest, the
 * description states the rule, and the library refuses the rest by name.
 */
const UNIT_RANGES: Record<
  string,
  { unitField: string; m: [number, number]; ft: [number, number] }
> = {
  'backlight lightHeight': { unitField: 'distanceUnit', m: [0, 10], ft: [0, 33] },
  'backlight headHeight': { unitField: 'distanceUnit', m: [0.1, 10], ft: [0.33, 33] },
  'backlight distanceBehind': { unitField: 'distanceUnit', m: [0.1, 50], ft: [0.33, 164] },
  'setup rim.lightHeight': { unitField: 'rim.distanceUnit', m: [0, 10], ft: [0, 33] },
  'setup rim.distanceBehind': { unitField: 'rim.distanceUnit', m: [0.1, 50], ft: [0.33, 164] },
  // key-light.ts: the key 0.1..50 m or 0.33..164 ft away, its modifier 0.01..10 m or 0.033..33 ft.
  'setup key.distance': { unitField: 'key.distanceUnit', m: [0.1, 50], ft: [0.33, 164] },
  'setup key.modifierSize': { unitField: 'key.distanceUnit', m: [0.01, 10], ft: [0.033, 33] },
  // compute-twilight.ts: the observer 0..9000 m or 0..29,527 ft up.
  'twilight elevation': { unitField: 'elevationUnit', m: [0, 9000], ft: [0, 29527] },
  'setup elevation': { unitField: 'elevationUnit', m: [0, 9000], ft: [0, 29527] },
};

/**
 * Bounds no input can sit on because of a rule between two fields (compute-twilight.ts: a band's
 * lowerDeg must be below its upperDeg, both within -18..20; falloff.ts: the series' `to` must lie
 * beyond `from`, at least 0.05): the library refuses them with that rule, never with the range,
 * which the checks below still confirm.
 */
const CROSS_FIELD = new Set([
  'falloff to min',
  'twilight goldenHour.upperDeg min',
  'twilight goldenHour.lowerDeg max',
  'twilight blueHour.upperDeg min',
  'twilight blueHour.lowerDeg max',
]);

/** Fields the library names differently from the request when it refuses them: none now. */
const LIBRARY_NAME: Record<string, string> = {};

interface NumericField {
  path: string;
  schema: JsonSchema;
}

/** Every number or integer property of `schema`, with array items written `gels[0]`. */
function numericFields(schema: JsonSchema, path = ''): NumericField[] {
  const types = Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : [];
  const out: NumericField[] = [];
  if (path && (types.includes('number') || types.includes('integer'))) out.push({ path, schema });
  for (const [k, sub] of Object.entries(schema.properties ?? {})) {
    out.push(...numericFields(sub, path ? `${path}.${k}` : k));
  }
  if (schema.items) out.push(...numericFields(schema.items, `${path}[0]`));
  return out;
}

const segments = (path: string): (string | number)[] =>
  path.split(/\.|(?=\[)/).map((s) => (s.startsWith('[') ? Number(s.slice(1, -1)) : s));

function getIn(obj: unknown, path: string): unknown {
  return segments(path).reduce<unknown>(
    (o, k) => (o === null || typeof o !== 'object' ? undefined : (o as Body)[k]),
    obj,
  );
}

/** A deep copy of `base` with `patch` merged in and `path` set to `value`. */
function withValue(base: Body, patch: Body, path: string, value: unknown): Body {
  const out = merge(structuredClone(base), patch);
  const segs = segments(path);
  let o = out as Record<string | number, unknown>;
  for (const k of segs.slice(0, -1)) o = o[k] as Record<string | number, unknown>;
  o[segs[segs.length - 1]!] = value;
  return out;
}

function merge(target: Body, patch: Body): Body {
  for (const [k, v] of Object.entries(patch)) {
    const t = target[k];
    target[k] =
      v && typeof v === 'object' && !Array.isArray(v) && t && typeof t === 'object'
        ? merge(t as Body, v as Body)
        : v;
  }
  return target;
}

/** The neighbouring double of `x` toward `dir` (the smallest step outside a bound). */
function nextDouble(x: number, dir: 1 | -1): number {
  if (x === 0) return dir * Number.MIN_VALUE;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  const up = x > 0 === dir > 0;
  view.setBigUint64(0, view.getBigUint64(0) + (up ? 1n : -1n));
  return view.getFloat64(0);
}

function libraryError(endpoint: string, input: Body): LightingInputError | null {
  try {
    LIBRARY[endpoint]!(input);
    return null;
  } catch (e) {
    if (e instanceof LightingInputError) return e;
    throw e;
  }
}

interface BoundCase {
  id: string;
  endpoint: string;
  base: Base;
  field: NumericField;
  side: 'min' | 'max';
  bound: number;
  outside: number;
}

function boundCases(): BoundCase[] {
  const out: BoundCase[] = [];
  for (const [endpoint, schema] of Object.entries(PUBLISHED)) {
    for (const field of numericFields(schema)) {
      const parent = field.path.includes('.')
        ? field.path.slice(0, field.path.lastIndexOf('.'))
        : '';
      const integer = field.schema.type === 'integer';
      for (const base of BASES[endpoint] ?? []) {
        if (base.only && !base.only.test(field.path)) continue;
        if (base.skip?.test(field.path)) continue;
        if (parent && getIn(base.input, parent) === undefined) continue;
        const { minimum: min, maximum: max } = field.schema;
        if (min !== undefined) {
          const outside = integer ? min - 1 : nextDouble(min, -1);
          const id = `${endpoint} ${field.path} min`;
          out.push({ id, endpoint, base, field, side: 'min', bound: min, outside });
        }
        if (max !== undefined) {
          const outside = integer ? max + 1 : nextDouble(max, 1);
          const id = `${endpoint} ${field.path} max`;
          out.push({ id, endpoint, base, field, side: 'max', bound: max, outside });
        }
      }
    }
  }
  return out;
}

const CASES = boundCases();
const validators = Object.fromEntries(
  Object.entries(PUBLISHED).map(([k, s]) => [k, compileSchema(s)]),
);
const fieldKey = (c: { endpoint: string; field: NumericField }) => `${c.endpoint} ${c.field.path}`;

describe('compute request ranges match the shared math library', () => {
  it('every numeric request field has a real range (no placeholder bounds)', () => {
    const loose = Object.entries(PUBLISHED).flatMap(([endpoint, schema]) =>
      numericFields(schema)
        .filter(({ schema: s }) => {
          const lo = s.minimum ?? s.exclusiveMinimum;
          return (
            lo === undefined ||
            s.maximum === undefined ||
            Math.abs(lo) >= ABSURD ||
            Math.abs(s.maximum) >= ABSURD
          );
        })
        .map(({ path }) => `${endpoint} ${path}`),
    );
    expect(loose).toEqual([]);
  });

  it('the plain and gear-aware balance and setup schemas publish the same ranges', () => {
    for (const ep of ['balance', 'setup']) {
      const bounds = (s: JsonSchema) =>
        numericFields(s).map(({ path, schema: f }) => [path, f.type, f.minimum, f.maximum]);
      expect(bounds(PUBLISHED[ep]!)).toEqual(bounds(REQUEST_SCHEMAS[ep]!));
    }
  });

  it('reaches every numeric field of every endpoint from some valid base', () => {
    const reached = new Set(CASES.map(fieldKey));
    const all = Object.entries(PUBLISHED).flatMap(([ep, s]) =>
      numericFields(s).map((f) => `${ep} ${f.path}`),
    );
    expect(all.filter((k) => !reached.has(k))).toEqual([]);
    expect(all.length).toBeGreaterThan(60);
  });

  it.each(
    Object.entries(BASES).flatMap(([ep, bases]) => bases.map((b) => [ep, b.name, b] as const)),
  )('%s: the %s base is valid for both the schema and the library', (endpoint, _name, base) => {
    expect(validators[endpoint]!(base.input)).toEqual([]);
    expect(libraryError(endpoint, base.input)).toBeNull();
  });

  it.each(CASES.map((c) => [`${c.id} (${c.base.name})`, c]))('%s', (_id, c) => {
    const patch = contextOf(c);
    const named = LIBRARY_NAME[fieldKey(c)] ?? c.field.path;

    // Just outside: the library refuses it naming the field; the schema does too, same path.
    const outInput = withValue(c.base.input, patch, c.field.path, c.outside);
    const outErr = libraryError(c.endpoint, outInput);
    expect({ outside: c.outside, field: outErr?.field }).toEqual({
      outside: c.outside,
      field: named,
    });
    const outProblems = validators[c.endpoint]!(outInput).map((p) => p.field);
    expect(outProblems).toEqual([c.field.path]);

    // At the bound: the schema takes it, and the library does not refuse it for its range.
    const atInput = withValue(c.base.input, patch, c.field.path, c.bound);
    expect(validators[c.endpoint]!(atInput)).toEqual([]);
    const atErr = libraryError(c.endpoint, atInput);
    if (CROSS_FIELD.has(c.id)) {
      expect(atErr).not.toBeNull();
      expect(atErr!.reason).not.toBe(outErr!.reason);
    } else {
      expect({ at: c.bound, error: atErr?.message ?? null }).toEqual({ at: c.bound, error: null });
    }
  });

  it.each(
    Object.entries(PUBLISHED).flatMap(([ep, s]) =>
      numericFields(s)
        .filter((f) => f.schema.type === 'integer')
        .map((f) => [`${ep} ${f.path}`, ep, f] as const),
    ),
  )('%s: a fraction inside the range is refused by the library too', (_id, endpoint, field) => {
    const base = BASES[endpoint]![0]!;
    const value = field.schema.minimum! + 0.5;
    const err = libraryError(endpoint, withValue(base.input, {}, field.path, value));
    expect(err?.field).toBe(field.path);
    expect(validators[endpoint]!(withValue(base.input, {}, field.path, value))).toEqual([
      expect.objectContaining({ field: field.path }),
    ]);
  });

  it.each(
    CASES.filter((c) => c.side === 'min' && c.field.schema.type !== 'integer').map((c) => [
      `${fieldKey(c)} (${c.base.name})`,
      c,
    ]),
  )('%s: a fraction inside the range is taken (the library wants no integer)', (_id, c) => {
    // A quarter off the base's own value (it satisfies any rule between fields), else a point
    // a third of the way into the range.
    const { minimum: lo, maximum: hi } = c.field.schema;
    const given = getIn(c.base.input, c.field.path);
    let value =
      typeof given === 'number'
        ? given + (given + 0.25 <= hi! ? 0.25 : -0.25)
        : lo! + (hi! - lo!) * 0.37;
    if (Number.isInteger(value)) value += 0.5;
    // Not at the bound: the context that opens the widest range (feet where they reach further).
    const input = withValue(c.base.input, CONTEXT[fieldKey(c)] ?? {}, c.field.path, value);
    expect(validators[c.endpoint]!(input)).toEqual([]);
    expect({ value, error: libraryError(c.endpoint, input)?.message ?? null }).toEqual({
      value,
      error: null,
    });
  });

  it.each(Object.entries(UNIT_RANGES))(
    '%s: the narrower unit keeps its own range in the library',
    (key, rule) => {
      const [endpoint, path] = key.split(' ') as [string, string];
      const base = BASES[endpoint]![0]!;
      const field = numericFields(PUBLISHED[endpoint]!).find((f) => f.path === path)!;
      // The published range is the widest of the units' ranges.
      expect([field.schema.minimum, field.schema.maximum]).toEqual([
        Math.min(rule.m[0], rule.ft[0]),
        Math.max(rule.m[1], rule.ft[1]),
      ]);
      const unitPatch = (unit: string): Body => {
        const segs = rule.unitField.split('.');
        return segs.reduceRight<Body>((acc, k) => ({ [k]: acc }), unit as never) as Body;
      };
      for (const unit of ['m', 'ft'] as const) {
        const [lo, hi] = rule[unit];
        const at = (v: number) =>
          libraryError(endpoint, withValue(base.input, unitPatch(unit), path, v));
        expect({ unit, lo: at(lo)?.field, hi: at(hi)?.field }).toEqual({
          unit,
          lo: undefined,
          hi: undefined,
        });
        expect({ unit, below: at(nextDouble(lo, -1))?.field }).toEqual({ unit, below: path });
        expect({ unit, above: at(nextDouble(hi, 1))?.field }).toEqual({ unit, above: path });
      }
    },
  );
});
