// Gear named by id resolves, within the caller's organisation only, to exactly the result of
// sending the same values inline: the saved-setup route end to end, and the resolver the
// balance and setup compute routes use, against POST /v1/balance and POST /v1/setup.
import type { DataSource } from 'typeorm';
import { DomainError } from '../../src/common/errors/domain-error.js';
import { ComputeService } from '../../src/compute/compute.service.js';
import { GearReferenceResolver, hasGearRefs } from '../../src/gear/gear-reference.resolver.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { createKey } from '../factories/compute.js';
import { createGelKit, createLight, createModifier, SMALL_KIT_PIECES } from '../factories/gear.js';
import { LAKESIDE_INPUTS } from '../factories/setups.js';

type Kit = {
  id: string;
  pieces: { name: string; miredShift: number; greenShift: number; lossStops: number }[];
};
const inlineGels = (kit: Kit) =>
  kit.pieces.map(({ name, miredShift, greenShift, lossStops }) => ({
    name,
    miredShift,
    greenShift,
    lossStops,
  }));

describe('gear by id', () => {
  let t: TestApp;
  let ds: DataSource;
  let owner: SignedInAgent;
  let other: SignedInAgent;
  let key: Record<string, unknown> & { id: string };
  let rim: Record<string, unknown> & { id: string };
  let octa: Record<string, unknown> & { id: string };
  let grid: Record<string, unknown> & { id: string };
  let kit: Kit;
  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
    owner = await signUp(t.url);
    other = await signUp(t.url);
    key = await createLight(owner, { name: 'Key strobe A', guideNumber: 60 });
    // A light entered from a meter reading, in feet: f/8 at 12 ft → GN 96 ft.
    rim = await createLight(owner, {
      name: 'Rim speedlight',
      guideNumber: undefined,
      meterReading: { aperture: 8, distance: 12, distanceUnit: 'ft' },
    });
    octa = await createModifier(owner, {
      name: '90 cm octa',
      kind: 'octabox',
      lossStops: 2,
      size: 90 / 30.48,
      sizeUnit: 'ft',
    });
    grid = await createModifier(owner, {
      name: 'Grid 20°',
      kind: 'grid',
      lossStops: 0.7,
      beamAngleDeg: 20,
    });
    kit = (await createGelKit(owner, {
      name: 'Studio gel kit',
      pieces: SMALL_KIT_PIECES,
    })) as unknown as Kit;
  }, 60000);
  afterAll(async () => {
    await ds?.destroy();
    await t?.close();
  });

  it('a setup saved with gear ids has the plan POST /v1/setup gives for the same values inline', async () => {
    const byId = {
      ...LAKESIDE_INPUTS,
      key: { lightId: key.id, modifierId: octa.id, distance: 2.2, angleFromCameraDeg: 50 },
      rim: { lightId: rim.id, modifierId: grid.id, distanceBehind: 3, lightHeight: 1.2 },
      gelKitId: kit.id,
    };
    const inline = {
      ...LAKESIDE_INPUTS,
      key: {
        guideNumber: 60,
        guideNumberUnit: 'm',
        modifier: 'octabox',
        modifierLossStops: 2,
        modifierSize: 0.9,
        distance: 2.2,
        angleFromCameraDeg: 50,
      },
      rim: {
        guideNumber: 96,
        guideNumberUnit: 'ft',
        modifierLossStops: 0.7,
        beamAngleDeg: 20,
        distanceBehind: 3,
        lightHeight: 1.2,
      },
      gels: inlineGels(kit),
    };
    const saved = await owner.agent
      .post('/v1/setups')
      .send({ name: 'By id', inputs: byId })
      .expect(201);
    const computed = await owner.agent.post('/v1/setup').send(inline).expect(200);
    expect(saved.body.plan).toEqual(computed.body);
    expect(saved.body.inputs).toEqual(byId);
    expect(saved.body.resolvedInputs.key).toMatchObject({
      guideNumber: 60,
      modifierLossStops: 2,
      modifier: 'octabox',
    });
    expect(saved.body.resolvedInputs.key.modifierSize).toBeCloseTo(0.9, 4);
    // The kit's gels were the ones searched: every chosen gel is a piece of the kit.
    const names = new Set(kit.pieces.map((p) => p.name));
    for (const g of saved.body.plan.gels.gels) expect(names.has(g.name)).toBe(true);
  });

  it('the resolver gives POST /v1/balance the same answer for gelKitId as for the gels inline', async () => {
    const resolver = t.app.get(GearReferenceResolver);
    const compute = t.app.get(ComputeService);
    for (const body of [
      { cameraKelvin: 3800, flashKelvin: 5600, targetMiredOffset: 10 },
      { cameraKelvin: 6500, flashKelvin: 5500, cameraTint: 8 },
    ]) {
      const viaId = compute.balance(
        await resolver.resolveBalance(owner.organizationId, { ...body, gelKitId: kit.id }),
      );
      const inline = await owner.agent
        .post('/v1/balance')
        .send({ ...body, gels: inlineGels(kit) })
        .expect(200);
      expect(JSON.parse(JSON.stringify(viaId))).toEqual(inline.body);
    }
    expect(hasGearRefs({ cameraKelvin: 3800 })).toBe(false);
    expect(hasGearRefs({ cameraKelvin: 3800, gelKitId: kit.id })).toBe(true);
    expect(hasGearRefs({ key: { lightId: key.id } })).toBe(true);
  });

  it('POST /v1/flash takes lightId and modifierId: the same answer as their values inline', async () => {
    const shot = { distance: 2.5, aperture: 5.6, iso: 200 };
    for (const [light, unit] of [
      [key, 'm'],
      [rim, 'ft'], // entered from a meter reading: f/8 at 12 ft → GN 96 ft (ISO 1230)
    ] as const) {
      const byId = await owner.agent
        .post('/v1/flash')
        .send({ ...shot, lightId: light.id, modifierId: octa.id })
        .expect(200);
      const inline = await owner.agent
        .post('/v1/flash')
        .send({
          ...shot,
          guideNumber: light.guideNumber,
          guideNumberUnit: unit,
          modifierLossStops: 2,
        })
        .expect(200);
      expect(byId.body).toEqual(inline.body);
      expect(byId.body.totalLossStops).toBe(2);
    }
    // GN 96 ft from f/8 at 12 ft: the meter reading stored as the light's guide number.
    expect(rim.guideNumber).toBeCloseTo(96, 6);
    expect(hasGearRefs({ lightId: key.id, distance: 2, aperture: 4 })).toBe(true);
    expect(hasGearRefs({ guideNumber: 60, distance: 2, aperture: 4 })).toBe(false);
  });

  it('POST /v1/flash refuses a borrowed id (404), an id with its values, or neither (422), naming the field', async () => {
    const shot = { distance: 2.5, aperture: 5.6 };
    const borrowed = await other.agent
      .post('/v1/flash')
      .send({ ...shot, lightId: key.id })
      .expect(404);
    expect(borrowed.body.errors.map((e: { field: string }) => e.field)).toEqual(['lightId']);
    const cases: [Record<string, unknown>, string][] = [
      [{ lightId: key.id, guideNumber: 60 }, 'lightId'],
      [{ guideNumber: 60, modifierId: octa.id, modifierLossStops: 1 }, 'modifierId'],
      [{ lightId: 'strobe-a' }, 'lightId'],
      [{}, 'guideNumber'],
    ];
    for (const [patch, field] of cases) {
      const res = await owner.agent.post('/v1/flash').send({ ...shot, ...patch });
      expect({ field, status: res.status }).toEqual({ field, status: 422 });
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toContain(field);
    }
  });

  it("an API key reads its organisation's gear (lists and single items) and uses the ids; never another's, never writes", async () => {
    const secret = (await createKey(owner, 'live')).secret;
    const otherSecret = (await createKey(other, 'live')).secret;
    const get = (path: string, token: string) =>
      fetch(`${t.url}${path}`, { headers: { authorization: `Bearer ${token}` } });
    for (const [path, ids] of [
      ['/v1/gear/lights', [key.id, rim.id]],
      ['/v1/gear/modifiers', [octa.id, grid.id]],
      ['/v1/gear/gel-kits', [kit.id]],
    ] as const) {
      const list = await get(path, secret);
      expect({ path, status: list.status }).toEqual({ path, status: 200 });
      const listed = ((await list.json()) as { data: { id: string }[] }).data.map((g) => g.id);
      expect(listed.sort()).toEqual([...ids].sort());
      const one = await get(`${path}/${ids[0]}`, secret);
      expect(((await one.json()) as { id: string }).id).toBe(ids[0]);
      const theirs = await get(path, otherSecret);
      expect(((await theirs.json()) as { data: unknown[] }).data).toEqual([]);
      const borrowed = await get(`${path}/${ids[0]}`, otherSecret);
      expect({ path, status: borrowed.status }).toEqual({ path, status: 404 });
    }
    // The kit id read with the key works in a compute call made with the same key.
    const body = { cameraKelvin: 3800, flashKelvin: 5600, targetMiredOffset: 10 };
    const call = (extra: Record<string, unknown>) =>
      fetch(`${t.url}/v1/balance`, {
        method: 'POST',
        headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
        body: JSON.stringify({ ...body, ...extra }),
      }).then(async (r) => ({ status: r.status, body: await r.json() }));
    const viaId = await call({ gelKitId: kit.id });
    expect(viaId.status).toBe(200);
    expect(viaId.body).toEqual((await call({ gels: inlineGels(kit) })).body);
    // Writing gear stays a console action.
    const write = await fetch(`${t.url}/v1/gear/lights`, {
      method: 'POST',
      headers: { authorization: `Bearer ${secret}`, 'content-type': 'application/json' },
      body: JSON.stringify({ name: 'Key-made light', guideNumber: 40 }),
    });
    expect(write.status).toBe(401);
    expect(((await write.json()) as { detail: string }).detail).toMatch(/API keys cannot use it/);
    const [{ n }] = await ds.query(
      `SELECT count(*)::int AS n FROM gear_lights WHERE organization_id = $1`,
      [owner.organizationId],
    );
    expect(n).toBe(2);
  });

  it("key reads share the key's rate limit and use no quota; the console's reads are not limited", async () => {
    const reader = await signUp(t.url); // Free plan: bursts of 10
    const secret = (await createKey(reader, 'live')).secret;
    const res = await Promise.all(
      Array.from({ length: 30 }, () =>
        fetch(`${t.url}/v1/gear/modifiers`, { headers: { authorization: `Bearer ${secret}` } }),
      ),
    );
    const ok = res.filter((r) => r.status === 200);
    const limited = res.filter((r) => r.status === 429);
    expect(ok.length).toBeGreaterThanOrEqual(10);
    expect(ok.length + limited.length).toBe(30);
    expect(limited.length).toBeGreaterThan(0);
    expect(ok[0]!.headers.get('ratelimit-policy')).toBe('"key";q=10;w=2');
    expect(limited[0]!.headers.get('content-type')).toMatch(/problem\+json/);
    expect(Number(limited[0]!.headers.get('retry-after'))).toBeGreaterThanOrEqual(1);
    const quota = await ds.query(`SELECT reserved FROM quota_counters WHERE organization_id = $1`, [
      reader.organizationId,
    ]);
    expect(
      quota.map((q: { reserved: number }) => Number(q.reserved)).filter((n: number) => n > 0),
    ).toEqual([]);
    const fromConsole = await Promise.all(
      Array.from({ length: 30 }, () => reader.agent.get('/v1/gear/modifiers')),
    );
    expect(fromConsole.map((r) => r.status)).toEqual(Array(30).fill(200));
    expect(fromConsole[0]!.headers['ratelimit-policy']).toBeUndefined();
  });

  it("another organisation's gear id is a 404 naming the field", async () => {
    const resolver = t.app.get(GearReferenceResolver);
    const err = await resolver
      .resolveBalance(other.organizationId, { cameraKelvin: 3800, gelKitId: kit.id })
      .catch((e: unknown) => e);
    expect(err).toBeInstanceOf(DomainError);
    expect(err).toMatchObject({ code: 'not_found', errors: [{ field: 'gelKitId' }] });
    const cases: [Record<string, unknown>, string][] = [
      [{ key: { lightId: key.id, distance: 2 } }, 'inputs.key.lightId'],
      [{ key: { guideNumber: 60, distance: 2, modifierId: octa.id } }, 'inputs.key.modifierId'],
      [{ rim: { lightId: rim.id, distanceBehind: 3, lightHeight: 1 } }, 'inputs.rim.lightId'],
      [{ gelKitId: kit.id }, 'inputs.gelKitId'],
    ];
    for (const [patch, field] of cases) {
      const res = await other.agent
        .post('/v1/setups')
        .send({ name: 'borrowed gear', inputs: { ...LAKESIDE_INPUTS, ...patch } });
      expect({ field, status: res.status }).toEqual({ field, status: 404 });
      expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual([field]);
    }
    const [{ n }] = await ds.query(
      `SELECT count(*)::int AS n FROM setups WHERE organization_id = $1`,
      [other.organizationId],
    );
    expect(n).toBe(0);
  });

  it('refuses an id together with the values it stands for, and a malformed id (422 naming the field)', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [{ key: { lightId: key.id, guideNumber: 60, distance: 2 } }, 'inputs.key.lightId'],
      [
        { key: { guideNumber: 60, distance: 2, modifierId: octa.id, modifierLossStops: 1 } },
        'inputs.key.modifierId',
      ],
      [{ gelKitId: kit.id, gels: inlineGels(kit) }, 'inputs.gelKitId'],
      [{ gelKitId: 'studio-kit' }, 'inputs.gelKitId'],
      [{ key: { lightId: 42, distance: 2 } }, 'inputs.key.lightId'],
      // A modifier id with another kind beside it: which one was meant cannot be guessed.
      [
        { key: { guideNumber: 60, distance: 2, modifierId: octa.id, modifier: 'umbrella' } },
        'inputs.key.modifier',
      ],
    ];
    for (const [patch, field] of cases) {
      const res = await owner.agent
        .post('/v1/setups')
        .send({ name: 'conflict', inputs: { ...LAKESIDE_INPUTS, ...patch } });
      expect({ field, status: res.status }).toEqual({ field, status: 422 });
      expect(res.body.errors.map((e: { field: string }) => e.field)).toContain(field);
    }
  });

  it('saved plans keep the values they were computed with when the gear changes later', async () => {
    const light = await createLight(owner, { guideNumber: 45 });
    const saved = await owner.agent
      .post('/v1/setups')
      .send({
        name: 'Before the repair',
        inputs: { ...LAKESIDE_INPUTS, key: { lightId: light.id, distance: 2.2 } },
      })
      .expect(201);
    await owner.agent.patch(`/v1/gear/lights/${light.id}`).send({ guideNumber: 30 }).expect(200);
    await owner.agent.delete(`/v1/gear/lights/${light.id}`).expect(204);
    const again = await owner.agent.get(`/v1/setups/${saved.body.id}`).expect(200);
    expect(again.body.resolvedInputs.key.guideNumber).toBe(45);
    expect(again.body.plan).toEqual(saved.body.plan);
  });
});
