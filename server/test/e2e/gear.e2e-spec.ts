// Gear CRUD on the real database: lights, modifiers, gel kits and pieces; roles, tenant
// isolation and field-naming validation problems.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { MODIFIERS } from '@lumenwright/shared';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import {
  createGelKit,
  createLight,
  createModifier,
  memberOf,
  SMALL_KIT_PIECES,
} from '../factories/gear.js';

const fields = (body: { errors?: { field: string }[] }) => (body.errors ?? []).map((e) => e.field);

describe('gear', () => {
  let t: TestApp;
  let ds: DataSource;
  let owner: SignedInAgent;
  let other: SignedInAgent;
  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
    owner = await signUp(t.url);
    other = await signUp(t.url);
  }, 60000);
  afterAll(async () => {
    await ds?.destroy();
    await t?.close();
  });

  describe('lights', () => {
    it('creates, reads, lists, updates and deletes a light (owner)', async () => {
      const made = await owner.agent
        .post('/v1/gear/lights')
        .send({
          name: '  Key strobe A  ',
          guideNumber: 60,
          guideNumberUnit: 'm',
          notes: 'Battery head',
        })
        .expect(201);
      expect(made.body).toMatchObject({
        name: 'Key strobe A',
        guideNumber: 60,
        guideNumberUnit: 'm',
        meterReading: null,
        notes: 'Battery head',
      });
      // 1 ft = 0.3048 m exactly (international yard and pound, 1959): 60 m / 0.3048 = 196.85 ft.
      expect(made.body.guideNumberFt).toBeCloseTo(196.85, 2);
      const id = made.body.id as string;
      await owner.agent.get(`/v1/gear/lights/${id}`).expect(200);
      const list = await owner.agent.get('/v1/gear/lights').expect(200);
      expect(list.body.data.map((l: { id: string }) => l.id)).toContain(id);
      const upd = await owner.agent
        .patch(`/v1/gear/lights/${id}`)
        .send({ guideNumber: 120, guideNumberUnit: 'ft', notes: null })
        .expect(200);
      // 120 ft × 0.3048 = 36.576 m.
      expect(upd.body).toMatchObject({ guideNumber: 120, guideNumberUnit: 'ft', notes: null });
      expect(upd.body.guideNumberM).toBeCloseTo(36.58, 2);
      await owner.agent.delete(`/v1/gear/lights/${id}`).expect(204);
      const gone = await owner.agent.get(`/v1/gear/lights/${id}`).expect(404);
      expect(gone.headers['content-type']).toMatch(/application\/problem\+json/);
    });

    it('derives the guide number from a meter reading (GN = distance × f-number at ISO 100, full power)', async () => {
      // Guide-number definition (ISO 1230; any flash handbook): f/8 read at 5 m, ISO 100, full power → GN 40 m.
      const a = await createLight(owner, {
        guideNumber: undefined,
        meterReading: { aperture: 8, distance: 5 },
      });
      expect(a).toMatchObject({
        guideNumber: 40,
        guideNumberUnit: 'm',
        meterReading: { aperture: 8, distance: 5, distanceUnit: 'm', iso: 100, powerFraction: 1 },
      });
      // GN scales with √(ISO/100) and √(power): f/11 at 10 ft on ISO 400 at 1/4 power → 110 / (2 × 0.5) = 110 ft.
      const b = await createLight(owner, {
        guideNumber: undefined,
        meterReading: {
          aperture: 11,
          distance: 10,
          distanceUnit: 'ft',
          iso: 400,
          powerFraction: 0.25,
        },
      });
      expect(b).toMatchObject({ guideNumber: 110, guideNumberUnit: 'ft' });
    });

    it('names the field in 422 problems', async () => {
      const cases: [Record<string, unknown>, string][] = [
        [{ name: 'x', guideNumber: '60' }, 'guideNumber'],
        [{ name: 'x', guideNumber: 0 }, 'guideNumber'],
        [{ name: 'x', guideNumber: 60, guideNumberUnit: 'yd' }, 'guideNumberUnit'],
        [{ name: '', guideNumber: 60 }, 'name'],
        [{ name: 'x' }, 'guideNumber'],
        [
          { name: 'x', guideNumber: 60, meterReading: { aperture: 8, distance: 5 } },
          'meterReading',
        ],
        [{ name: 'x', meterReading: { aperture: 0.1, distance: 5 } }, 'meterReading.aperture'],
        [{ name: 'x', meterReading: { aperture: 8 } }, 'meterReading.distance'],
        [{ name: 'x', guideNumber: 60, wattage: 400 }, 'wattage'],
      ];
      for (const [body, field] of cases) {
        const res = await owner.agent.post('/v1/gear/lights').send(body);
        expect({ body, status: res.status }).toEqual({ body, status: 422 });
        expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
        expect(fields(res.body)).toContain(field);
      }
      const light = await createLight(owner);
      const res = await owner.agent
        .patch(`/v1/gear/lights/${light.id}`)
        .send({ name: null })
        .expect(422);
      expect(fields(res.body)).toContain('name');
    });

    it('refuses a second light with the same name (409 naming the field)', async () => {
      const l = await createLight(owner);
      const res = await owner.agent
        .post('/v1/gear/lights')
        .send({ name: l.name, guideNumber: 30 })
        .expect(409);
      expect(fields(res.body)).toEqual(['name']);
    });
  });

  describe('modifiers', () => {
    it('CRUD, with the loss defaulting from the kind', async () => {
      const octa = await createModifier(owner, {
        lossStops: undefined,
        kind: 'octabox',
        size: 0.9,
      });
      expect(octa).toMatchObject({
        kind: 'octabox',
        lossStops: MODIFIERS.octabox.lossStops,
        size: 0.9,
        sizeUnit: 'm',
      });
      const grid = await createModifier(owner, {
        name: 'Grid 20°',
        lossStops: 0.7,
        beamAngleDeg: 20,
      });
      const upd = await owner.agent
        .patch(`/v1/gear/modifiers/${grid.id}`)
        .send({ lossStops: 0.5, size: 4, sizeUnit: 'ft' })
        .expect(200);
      expect(upd.body).toMatchObject({ lossStops: 0.5, beamAngleDeg: 20, size: 4, sizeUnit: 'ft' });
      const list = await owner.agent.get('/v1/gear/modifiers').expect(200);
      expect(list.body.data.map((m: { id: string }) => m.id)).toEqual(
        expect.arrayContaining([octa.id, grid.id]),
      );
      await owner.agent.delete(`/v1/gear/modifiers/${octa.id}`).expect(204);
      await owner.agent.get(`/v1/gear/modifiers/${octa.id}`).expect(404);
    });

    it('names the field in 422 problems', async () => {
      for (const [body, field] of [
        [{ name: 'm' }, 'lossStops'],
        [{ name: 'm', lossStops: 9 }, 'lossStops'],
        [{ name: 'm', lossStops: 1, kind: 'parabolic-umbrella-xl' }, 'kind'],
        [{ name: 'm', lossStops: 1, beamAngleDeg: 0 }, 'beamAngleDeg'],
      ] as const) {
        const res = await owner.agent.post('/v1/gear/modifiers').send(body).expect(422);
        expect(fields(res.body)).toContain(field);
      }
    });
  });

  describe('gel kits', () => {
    it('creates a kit with pieces, then adds, edits and removes pieces', async () => {
      const kit = await createGelKit(owner, { pieces: SMALL_KIT_PIECES });
      const pieces = kit.pieces as {
        id: string;
        name: string;
        greenShift: number;
        miredShift: number;
        position: number;
      }[];
      expect(pieces.map((p) => p.name)).toEqual(SMALL_KIT_PIECES.map((p) => p.name));
      expect(pieces[3]).toMatchObject({ miredShift: 0, greenShift: 7.5, position: 3 });
      const added = await owner.agent
        .post(`/v1/gear/gel-kits/${kit.id}/pieces`)
        .send({ name: 'cool half', miredShift: -70, lossStops: 0.75 })
        .expect(201);
      expect(added.body.position).toBe(4);
      await owner.agent
        .patch(`/v1/gear/gel-kits/${kit.id}/pieces/${pieces[0]!.id}`)
        .send({ lossStops: 0.5 })
        .expect(200);
      await owner.agent.delete(`/v1/gear/gel-kits/${kit.id}/pieces/${pieces[1]!.id}`).expect(204);
      const got = await owner.agent.get(`/v1/gear/gel-kits/${kit.id}`).expect(200);
      expect(
        got.body.pieces.map((p: { name: string; lossStops: number }) => [p.name, p.lossStops]),
      ).toEqual([
        ['warm half', 0.5],
        ['cool quarter', 0.4],
        ['green quarter', 0.15],
        ['cool half', 0.75],
      ]);
      const renamed = await owner.agent
        .patch(`/v1/gear/gel-kits/${kit.id}`)
        .send({ name: 'Location kit' })
        .expect(200);
      expect(renamed.body.name).toBe('Location kit');
      await owner.agent.delete(`/v1/gear/gel-kits/${kit.id}`).expect(204);
      await owner.agent.get(`/v1/gear/gel-kits/${kit.id}`).expect(404);
      const left = await ds.query(
        `SELECT count(*)::int AS n FROM gear_gel_pieces WHERE kit_id = $1`,
        [kit.id],
      );
      expect(left[0].n).toBe(0);
    });

    it('names the field for bad pieces, duplicate names and a full kit', async () => {
      let res = await owner.agent
        .post('/v1/gear/gel-kits')
        .send({
          name: 'k',
          pieces: [
            { name: 'a', miredShift: 20, lossStops: 0.1 },
            { name: 'b', miredShift: 20, lossStops: -1 },
          ],
        })
        .expect(422);
      expect(fields(res.body)).toContain('pieces[1].lossStops');
      res = await owner.agent
        .post('/v1/gear/gel-kits')
        .send({ name: 'k', pieces: [{ name: 'a', lossStops: 0.1 }] })
        .expect(422);
      expect(fields(res.body)).toContain('pieces[0].miredShift');
      res = await owner.agent
        .post('/v1/gear/gel-kits')
        .send({
          name: 'k',
          pieces: [
            { name: 'a', miredShift: 1, lossStops: 0 },
            { name: 'a', miredShift: 2, lossStops: 0 },
          ],
        })
        .expect(409);
      expect(fields(res.body)).toEqual(['pieces[1].name']);
      const kit = await createGelKit(owner, {
        pieces: Array.from({ length: 30 }, (_, i) => ({
          name: `cut ${i}`,
          miredShift: i,
          lossStops: 0.1,
        })),
      });
      res = await owner.agent
        .post(`/v1/gear/gel-kits/${kit.id}/pieces`)
        .send({ name: 'one more', miredShift: 5, lossStops: 0.1 })
        .expect(409);
      expect(fields(res.body)).toEqual(['pieces']);
      res = await owner.agent
        .post(`/v1/gear/gel-kits/${kit.id}/pieces`)
        .send({ name: 'x', miredShift: 500, lossStops: 0.1 })
        .expect(422);
      expect(fields(res.body)).toContain('miredShift');
    });
  });

  describe('roles', () => {
    it('photographers and developers read gear but cannot change it; admins can', async () => {
      const light = await createLight(owner);
      const kit = await createGelKit(owner, { pieces: SMALL_KIT_PIECES });
      for (const role of ['photographer', 'developer'] as const) {
        const m = await memberOf(t.url, ds, owner, role);
        await m.agent.get('/v1/gear/lights').expect(200);
        await m.agent.get(`/v1/gear/lights/${light.id}`).expect(200);
        await m.agent.get('/v1/gear/modifiers').expect(200);
        await m.agent.get(`/v1/gear/gel-kits/${kit.id}`).expect(200);
        const writes = [
          m.agent.post('/v1/gear/lights').send({ name: `by ${role}`, guideNumber: 40 }),
          m.agent.patch(`/v1/gear/lights/${light.id}`).send({ name: 'renamed' }),
          m.agent.delete(`/v1/gear/lights/${light.id}`),
          m.agent.post('/v1/gear/modifiers').send({ name: `by ${role}`, lossStops: 1 }),
          m.agent.post('/v1/gear/gel-kits').send({ name: `by ${role}` }),
          m.agent
            .post(`/v1/gear/gel-kits/${kit.id}/pieces`)
            .send({ name: 'n', miredShift: 1, lossStops: 0 }),
        ];
        for (const w of writes) {
          const res = await w;
          expect({ role, status: res.status }).toEqual({ role, status: 403 });
        }
      }
      const admin = await memberOf(t.url, ds, owner, 'admin');
      await admin.agent
        .patch(`/v1/gear/lights/${light.id}`)
        .send({ name: `Admin-renamed ${light.id.slice(0, 6)}` })
        .expect(200);
      await request(t.url).get('/v1/gear/lights').expect(401);
    });
  });

  describe('tenant isolation', () => {
    it("another organisation's gear is 404 on every route, and absent from its lists", async () => {
      const light = await createLight(owner);
      const mod = await createModifier(owner);
      const kit = await createGelKit(owner, { pieces: SMALL_KIT_PIECES });
      const piece = (kit.pieces as { id: string }[])[0]!;
      const calls = [
        other.agent.get(`/v1/gear/lights/${light.id}`),
        other.agent.patch(`/v1/gear/lights/${light.id}`).send({ name: 'mine now' }),
        other.agent.delete(`/v1/gear/lights/${light.id}`),
        other.agent.get(`/v1/gear/modifiers/${mod.id}`),
        other.agent.delete(`/v1/gear/modifiers/${mod.id}`),
        other.agent.get(`/v1/gear/gel-kits/${kit.id}`),
        other.agent
          .post(`/v1/gear/gel-kits/${kit.id}/pieces`)
          .send({ name: 'n', miredShift: 1, lossStops: 0 }),
        other.agent.patch(`/v1/gear/gel-kits/${kit.id}/pieces/${piece.id}`).send({ lossStops: 1 }),
        other.agent.delete(`/v1/gear/gel-kits/${kit.id}/pieces/${piece.id}`),
        other.agent.get('/v1/gear/lights/not-a-uuid'),
      ];
      for (const c of calls) {
        const res = await c;
        expect(res.status).toBe(404);
        expect(res.body.errors?.[0]?.field).toMatch(/^(id|kitId|pieceId)$/);
      }
      const lists = await Promise.all(
        ['lights', 'modifiers', 'gel-kits'].map((k) =>
          other.agent.get(`/v1/gear/${k}`).expect(200),
        ),
      );
      const ids = lists.flatMap((l) => l.body.data.map((x: { id: string }) => x.id));
      expect(ids).not.toEqual(expect.arrayContaining([light.id]));
      expect(ids).not.toContain(mod.id);
      expect(ids).not.toContain(kit.id);
      // Still there, unchanged, for its owner.
      const mine = await owner.agent.get(`/v1/gear/lights/${light.id}`).expect(200);
      expect(mine.body.name).toBe(light.name);
    });
  });
});
