// The documented response schemas are what the OpenAPI document, and so the SDK's types, tell app
// developers they will receive. Every field the math actually returns must be described there,
// with its type, down to the last nested object: a field missing from the schema is invisible
// to SDK users, and an object described only as "object" gives them no types at all.
//
// The check runs the compute service (the shared math, as the routes call it) over a spread of
// inputs per endpoint — ordinary evenings, polar day and night, every optional block — and walks
// each answer against its schema.
import { ComputeService } from '../compute.service.js';
import type { JsonSchema } from '../validation/json-schema.js';
import { compileSchema } from '../validation/json-schema.js';
import { REQUEST_SCHEMAS, RESPONSE_SCHEMAS } from './index.js';
import { DEMO_BODIES } from '../../../test/factories/compute.js';

/** Paths in `value` that `schema` does not describe (or describes with another type). */
export function undocumented(value: unknown, schema: JsonSchema | undefined, path = '$'): string[] {
  if (!schema) return [`${path}: no schema`];
  const types = Array.isArray(schema.type) ? schema.type : schema.type ? [schema.type] : [];
  if (value === null) return types.includes('null') ? [] : [`${path}: null, schema says ${types}`];
  if (Array.isArray(value)) {
    if (!types.includes('array')) return [`${path}: array, schema says ${types}`];
    if (!schema.items) return [`${path}: array items undescribed`];
    return value.flatMap((v, i) => undocumented(v, schema.items, `${path}[${i}]`));
  }
  if (typeof value === 'object') {
    if (!types.includes('object')) return [`${path}: object, schema says ${types}`];
    const props = schema.properties ?? {};
    const map =
      typeof schema.additionalProperties === 'object' ? schema.additionalProperties : null;
    if (!Object.keys(props).length && !map) return [`${path}: object without described fields`];
    const out: string[] = [];
    for (const r of schema.required ?? []) {
      if (!(r in (value as object))) out.push(`${path}.${r}: required but missing`);
    }
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      if (v === undefined) continue; // JSON drops it
      if (k in props) out.push(...undocumented(v, props[k], `${path}.${k}`));
      else if (map) out.push(...undocumented(v, map, `${path}.${k}`));
      else out.push(`${path}.${k}: not in the schema`);
    }
    return out;
  }
  const t = typeof value;
  if (t === 'number') {
    if (types.includes('number')) return [];
    if (types.includes('integer') && Number.isInteger(value)) return [];
  } else if (t === 'string' || t === 'boolean') {
    if (types.includes(t)) {
      if (schema.enum && !schema.enum.includes(value as string)) {
        return [`${path}: "${String(value)}" not in its enum`];
      }
      return [];
    }
  }
  return [`${path}: ${t}, schema says ${types}`];
}

const PLACE = { latitude: 51.507, longitude: -0.1, timeZone: 'Europe/London' };
const NORTH = { latitude: 78.22, longitude: 15.65, timeZone: 'Arctic/Longyearbyen' };
/** Every site condition at once, wind above the strike speed: every caution there is. */
const EVERY_CONDITION = {
  windKmh: 35,
  nearWater: true,
  nearRoad: true,
  coldFogOrHaze: true,
  modellingLamps: true,
};

// Inputs: each endpoint's demo body (the invented riverside-terrace scenario, shared with the e2e
// tests) plus edge cases.
const EDGE_CASES: Record<string, Record<string, unknown>[]> = {
  twilight: [
    { ...PLACE, date: '2026-12-21', elevation: 40, sky: 'overcast', stepMinutes: 5 },
    { ...NORTH, date: '2026-06-21' }, // midnight sun: no sunset
    { ...NORTH, date: '2026-12-21' }, // polar night: no sunrise
    // A zone far from the place's solar time: the twilight's warnings list is not empty.
    { latitude: 47, longitude: 8, date: '2026-06-21', timeZone: 'America/Los_Angeles' },
  ],
  exposure: [
    { ev100: 12, shutterSeconds: 0.004, iso: 100 },
    { ev100: 3, aperture: 2.8, shutterSeconds: 1 / 60 },
    {
      place: { latitude: 51.507, longitude: -0.1, time: '2026-06-20T21:45:00+01:00', sky: 'clear' },
      aperture: 4,
      biasStops: -1,
      support: 'handheld',
      flashSyncSeconds: 0.005,
    },
    { ev100: 14, aperture: 2, biasStops: -1, flashSyncSeconds: 1 / 250 },
  ],
  flash: [
    { guideNumber: 20, distance: 12, aperture: 16, iso: 100 }, // not enough power
  ],
  falloff: [{ subjectDistance: 8, backgroundDistance: 20, distanceUnit: 'ft', groundDistance: 3 }],
  backlight: [
    { lightHeight: 4, distanceBehind: 3, distanceUnit: 'ft', beamAngleDeg: 20, headHeight: 5.5 },
  ],
  balance: [
    { cameraKelvin: 3200, flashKelvin: 5500, maxGels: 3, miredTolerance: 10, cameraTint: 6 },
    {
      cameraKelvin: 4300,
      gels: [
        { name: 'Half warming', miredShift: 81, lossStops: 0.33 },
        { name: 'Quarter minus-green', miredShift: 0, greenShift: -2, lossStops: 0.2 },
      ],
      maxGels: 2,
      targetMiredOffset: 10,
    },
    // No gels allowed: 16 fine-tune steps, past the usual range (a warning).
    { cameraKelvin: 3800, maxGels: 0 },
  ],
  setup: [
    {
      ...PLACE,
      date: '2026-09-18',
      key: { guideNumber: 45, distance: 3, distanceUnit: 'm', modifierLossStops: 1.5 },
      rim: {
        guideNumber: 30,
        distanceBehind: 2.5,
        lightHeight: 2,
        beamAngleDeg: 30,
        gelled: false,
      },
      camera: { aperture: 4, isoMax: 3200 },
      backgroundDistance: 12,
      conditions: EVERY_CONDITION,
      suggestions: 5,
    },
    { ...NORTH, date: '2026-06-21', key: { guideNumber: 60, distance: 2.5 } },
    // Polar night: most minutes darker than the background solver takes (a too-dark warning).
    { ...NORTH, date: '2026-12-15', key: { guideNumber: 60, distance: 2.5 } },
  ],
  timeline: [
    { ...PLACE, date: '2026-12-21', portraitMinutes: 240, setupMinutes: 0 }, // no events
    // Every condition, no stands, the session centred: every caution but the stands'.
    {
      ...PLACE,
      date: '2026-09-18',
      portraitMinutes: 15,
      placement: 'mid-blue-hour',
      lightStands: 0,
      conditions: EVERY_CONDITION,
    },
    { ...NORTH, date: '2026-06-21', portraitMinutes: 20 }, // polar day: no window, no slot
    { ...NORTH, date: '2026-12-21', portraitMinutes: 20 }, // polar night: all null
    // A reception over the whole evening: no free stretch; an event after midnight.
    {
      ...PLACE,
      date: '2026-06-20',
      portraitMinutes: 20,
      events: [
        { label: 'Reception', start: '18:00', end: '23:45' },
        { label: 'Late buffet', start: '23:45', end: '2026-06-21T00:30:00+01:00' },
      ],
    },
  ],
};

const INPUTS = Object.fromEntries(
  Object.entries(EDGE_CASES).map(([ep, edge]) => [ep, [DEMO_BODIES[ep]!, ...edge]]),
);

describe('documented response schemas', () => {
  const compute = new ComputeService();
  const run: Record<string, (i: never) => unknown> = {
    twilight: compute.twilight,
    exposure: compute.exposure,
    flash: compute.flash,
    falloff: compute.falloff,
    backlight: compute.backlight,
    balance: compute.balance,
    setup: compute.setup,
    timeline: compute.timeline,
  };

  it('has inputs for every endpoint with a schema', () => {
    expect(Object.keys(INPUTS).sort()).toEqual(Object.keys(RESPONSE_SCHEMAS).sort());
  });

  for (const [endpoint, inputs] of Object.entries(INPUTS)) {
    it.each(inputs.map((input, i) => [i, input] as const))(
      `${endpoint}: answer %i is described field by field`,
      (_i, input) => {
        // A valid request first (the walk is only as good as its inputs).
        expect(compileSchema(REQUEST_SCHEMAS[endpoint]!)(input)).toEqual([]);
        // Round-trip through JSON: what the caller receives.
        const body = JSON.parse(JSON.stringify(run[endpoint]!(input as never))) as unknown;
        expect(undocumented(body, RESPONSE_SCHEMAS[endpoint])).toEqual([]);
      },
    );
  }

  it('flags what it should (the walker itself)', () => {
    const schema: JsonSchema = {
      type: 'object',
      required: ['a'],
      properties: { a: { type: 'number' }, b: { type: 'object' }, c: { type: ['string', 'null'] } },
    };
    expect(undocumented({ a: 1, c: null }, schema)).toEqual([]);
    expect(undocumented({ a: 'x', b: { z: 1 }, d: true }, schema)).toEqual([
      '$.a: string, schema says number',
      '$.b: object without described fields',
      '$.d: not in the schema',
    ]);
    expect(undocumented({}, schema)).toEqual(['$.a: required but missing']);
    const reasons: JsonSchema = {
      type: 'object',
      additionalProperties: { type: 'string', enum: ['x'] },
    };
    expect(undocumented({ p: 'x' }, reasons)).toEqual([]);
    expect(undocumented({ p: 'y' }, reasons)).toEqual(['$.p: "y" not in its enum']);
  });
});
