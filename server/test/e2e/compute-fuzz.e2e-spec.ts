// Property test: whatever JSON arrives, every compute endpoint answers 200 or a 4xx problem
// naming a field — never a 5xx. 500+ generated bodies per endpoint, mixing valid demo bodies
// with mutated fields, wrong types, huge and tiny numbers and unknown keys.
import fc from 'fast-check';
import { DataSource } from 'typeorm';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { DEMO_BODIES, ENDPOINTS, keyedOrg, KeyedOrg } from '../factories/compute.js';

const RUNS = 520;

const anyValue = fc.oneof(
  fc.double({ noNaN: false }),
  fc.integer(),
  fc.constantFrom(0, -0, 1e308, -1e308, 5e-324, 1e9, -1),
  fc.string({ maxLength: 20 }),
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.integer(), { maxLength: 3 }),
  fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 }),
);

function mutated(ep: string) {
  const base = DEMO_BODIES[ep]!;
  const keys = [...Object.keys(base), 'unknownField', 'gels', 'camera', 'key'];
  return fc.oneof(
    fc.constant(base),
    fc
      .record({
        k: fc.constantFrom(...keys),
        v: anyValue,
        drop: fc.constantFrom(...Object.keys(base)),
        mode: fc.nat(2),
      })
      .map(({ k, v, drop, mode }) => {
        const b: Record<string, unknown> = { ...base };
        if (mode === 0) b[k] = v;
        else if (mode === 1) delete b[drop];
        else {
          b[k] = v;
          delete b[drop];
        }
        return b;
      }),
    anyValue,
    fc.dictionary(fc.constantFrom(...keys), anyValue, { maxKeys: 6 }),
  );
}

describe('compute API under fuzzed bodies', () => {
  let t: TestApp;
  let org: KeyedOrg;
  let ds: DataSource;
  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
    org = await keyedOrg(t.url);
    await ds.query(`UPDATE organizations SET plan_code = 'platform' WHERE id = $1`, [
      org.owner.organizationId,
    ]);
  });
  afterAll(async () => {
    await ds.destroy();
    await t.close();
  });

  it.each(ENDPOINTS)(
    '/v1/%s never answers 5xx and names a field on 4xx',
    async (ep) => {
      const seen = new Set<number>();
      await fc.assert(
        fc.asyncProperty(mutated(ep), async (body) => {
          // JSON.stringify turns NaN/Infinity into null, as any JSON client would send them.
          const res = await fetch(`${t.url}/v1/${ep}`, {
            method: 'POST',
            headers: {
              authorization: `Bearer ${org.live.secret}`,
              'content-type': 'application/json',
            },
            body: JSON.stringify(body),
          });
          const json = (await res.json()) as { errors?: { field: string }[] };
          seen.add(res.status);
          if (res.status >= 500)
            throw new Error(`${res.status} for ${JSON.stringify(body)}: ${JSON.stringify(json)}`);
          if (res.status !== 200) {
            expect([400, 422]).toContain(res.status);
            expect(res.headers.get('content-type')).toMatch(/problem\+json/);
            expect(json.errors?.[0]?.field).toEqual(expect.any(String));
          }
        }),
        { numRuns: RUNS },
      );
      // The generator reaches both outcomes.
      expect(seen.has(200)).toBe(true);
      expect(seen.has(422)).toBe(true);
    },
    120_000,
  );
});
