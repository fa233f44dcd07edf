// Saved setups on the real database: CRUD per role, tenant isolation, validation, search,
// pagination, duplicate, the plan's saved-setups limit and the printable shot sheet.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { clockOf, planDuskSetup, type DuskSetupInput } from '@lumenwright/shared';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { signUp, type SignedInAgent } from '../factories/accounts.js';
import { memberOf } from '../factories/gear.js';
import { LAKESIDE_INPUTS, saveSetup } from '../factories/setups.js';

const fields = (body: { errors?: { field: string }[] }) => (body.errors ?? []).map((e) => e.field);

describe('saved setups', () => {
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

  it('a photographer saves, reads, edits and deletes a setup; the plan is the shared planner’s', async () => {
    const photo = await memberOf(t.url, ds, owner, 'photographer');
    const made = await photo.agent
      .post('/v1/setups')
      .send({
        name: 'Lakeside engagement',
        venue: 'Boathouse terrace',
        notes: 'Jetty closes at dusk',
        inputs: LAKESIDE_INPUTS,
      })
      .expect(201);
    expect(made.body).toMatchObject({
      name: 'Lakeside engagement',
      date: '2026-09-12',
      timeZone: 'Europe/London',
      createdBy: { id: photo.userId },
    });
    // Same inputs, same pure function: the stored plan is exactly what the planner computes.
    expect(made.body.plan).toEqual(
      JSON.parse(JSON.stringify(planDuskSetup(LAKESIDE_INPUTS as DuskSetupInput))),
    );
    expect(made.body.windowStart).toBe(made.body.plan.window.start);
    const id = made.body.id as string;

    const got = await photo.agent.get(`/v1/setups/${id}`).expect(200);
    expect(got.body.inputs).toEqual(LAKESIDE_INPUTS);
    const renamed = await photo.agent
      .patch(`/v1/setups/${id}`)
      .send({ name: 'Lakeside engagement (final)', notes: null })
      .expect(200);
    expect(renamed.body).toMatchObject({
      name: 'Lakeside engagement (final)',
      notes: null,
      venue: 'Boathouse terrace',
    });
    expect(renamed.body.plan).toEqual(made.body.plan);

    const moved = { ...LAKESIDE_INPUTS, date: '2026-12-05' };
    const replanned = await photo.agent
      .patch(`/v1/setups/${id}`)
      .send({ inputs: moved })
      .expect(200);
    expect(replanned.body.date).toBe('2026-12-05');
    expect(replanned.body.plan).toEqual(
      JSON.parse(JSON.stringify(planDuskSetup(moved as DuskSetupInput))),
    );
    expect(replanned.body.plan.twilight.sunset).not.toBe(made.body.plan.twilight.sunset);

    await photo.agent.delete(`/v1/setups/${id}`).set('User-Agent', 'lakeside-test').expect(204);
    await photo.agent.get(`/v1/setups/${id}`).expect(404);
    // Who deleted it stays on record, with what it was.
    const events = await ds.query(
      `SELECT actor_user_id, target_type, metadata, user_agent FROM audit_events
        WHERE organization_id = $1 AND action = 'setup.deleted' AND target_id = $2`,
      [owner.organizationId, id],
    );
    expect(events).toEqual([
      {
        actor_user_id: photo.userId,
        target_type: 'setup',
        metadata: {
          name: 'Lakeside engagement (final)',
          venue: 'Boathouse terrace',
          shootDate: '2026-12-05',
        },
        user_agent: 'lakeside-test',
      },
    ]);
    await photo.agent.delete(`/v1/setups/${id}`).expect(404);
  });

  it('developers read setups and sheets but cannot change them; admins and owners can', async () => {
    const s = await saveSetup(owner);
    const dev = await memberOf(t.url, ds, owner, 'developer');
    await dev.agent.get('/v1/setups').expect(200);
    await dev.agent.get(`/v1/setups/${s.id}`).expect(200);
    await dev.agent.get(`/v1/setups/${s.id}/sheet`).expect(200);
    for (const res of [
      await dev.agent.post('/v1/setups').send({ name: 'dev', inputs: LAKESIDE_INPUTS }),
      await dev.agent.patch(`/v1/setups/${s.id}`).send({ name: 'dev' }),
      await dev.agent.post(`/v1/setups/${s.id}/duplicate`).send({}),
      await dev.agent.delete(`/v1/setups/${s.id}`),
    ]) {
      expect(res.status).toBe(403);
    }
    const admin = await memberOf(t.url, ds, owner, 'admin');
    await admin.agent.patch(`/v1/setups/${s.id}`).send({ venue: 'Upper lawn' }).expect(200);
    await request(t.url).get('/v1/setups').expect(401);
    await request(t.url).get(`/v1/setups/${s.id}/sheet`).expect(401);
  });

  it("another organisation's setup is 404 everywhere and never listed", async () => {
    const s = await saveSetup(owner, { name: `Private ${Date.now()}` });
    for (const res of [
      await other.agent.get(`/v1/setups/${s.id}`),
      await other.agent.get(`/v1/setups/${s.id}/sheet`),
      await other.agent.patch(`/v1/setups/${s.id}`).send({ name: 'taken' }),
      await other.agent.post(`/v1/setups/${s.id}/duplicate`).send({}),
      await other.agent.delete(`/v1/setups/${s.id}`),
      await other.agent.get('/v1/setups/123'),
    ]) {
      expect(res.status).toBe(404);
      expect(fields(res.body)).toEqual(['id']);
    }
    const list = await other.agent.get('/v1/setups').query({ limit: 100 }).expect(200);
    expect(list.body.data.map((x: { id: string }) => x.id)).not.toContain(s.id);
    await owner.agent.get(`/v1/setups/${s.id}`).expect(200);
  });

  it('names the field in 422 problems, inputs included', async () => {
    const bad: [Record<string, unknown>, string][] = [
      [{ inputs: LAKESIDE_INPUTS }, 'name'],
      [{ name: 'x' }, 'inputs'],
      [{ name: 'x', inputs: 'lakeside' }, 'inputs'],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, latitude: 95 } }, 'inputs.latitude'],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, latitude: '54' } }, 'inputs.latitude'],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, key: undefined } }, 'inputs.key'],
      [
        { name: 'x', inputs: { ...LAKESIDE_INPUTS, key: { distance: 2 } } },
        'inputs.key.guideNumber',
      ],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, timeZone: 'Mars/Olympus' } }, 'inputs.timeZone'],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, date: '2026-02-30' } }, 'inputs.date'],
      [{ name: 'x', inputs: { ...LAKESIDE_INPUTS, flux: 3 } }, 'inputs.flux'],
      [{ name: 'x', venue: 7, inputs: LAKESIDE_INPUTS }, 'venue'],
    ];
    for (const [body, field] of bad) {
      const res = await owner.agent.post('/v1/setups').send(body);
      expect({ field, status: res.status }).toEqual({ field, status: 422 });
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(fields(res.body)).toContain(field);
    }
    const s = await saveSetup(owner);
    const res = await owner.agent
      .patch(`/v1/setups/${s.id}`)
      .send({ inputs: { ...LAKESIDE_INPUTS, longitude: 200 } })
      .expect(422);
    expect(fields(res.body)).toContain('inputs.longitude');
  });

  it('searches name, venue and notes, case-insensitively, with wildcards taken literally', async () => {
    const org = await signUp(t.url);
    const tag = `heron${Date.now().toString(36)}`;
    const a = await saveSetup(org, { name: `Jetty ${tag}`, venue: 'Old jetty' });
    const b = await saveSetup(org, {
      name: 'Terrace portraits',
      venue: `${tag.toUpperCase()} boathouse`,
    });
    const c = await saveSetup(org, { name: 'Lawn', notes: `meet at the ${tag} sign` });
    await saveSetup(org, { name: 'Unrelated 100% sure', venue: 'Orchard' });
    const hits = await org.agent.get('/v1/setups').query({ q: tag }).expect(200);
    expect(hits.body.data.map((x: { id: string }) => x.id).sort()).toEqual(
      [a.id, b.id, c.id].sort(),
    );
    const pct = await org.agent.get('/v1/setups').query({ q: '%' }).expect(200);
    expect(pct.body.data.map((x: { name: string }) => x.name)).toEqual(['Unrelated 100% sure']);
    const none = await org.agent.get('/v1/setups').query({ q: 'nothing-like-this' }).expect(200);
    expect(none.body).toEqual({ data: [], nextCursor: null });
  });

  it('pages newest first with a cursor, without gaps or repeats', async () => {
    const org = await signUp(t.url);
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await saveSetup(org, { name: `Page ${i}` })).id);
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res: request.Response = await org.agent
        .get('/v1/setups')
        .query({ limit: 2, ...(cursor ? { cursor } : {}) })
        .expect(200);
      seen.push(...res.body.data.map((x: { id: string }) => x.id));
      cursor = res.body.nextCursor;
      pages++;
    } while (cursor && pages < 10);
    expect(pages).toBe(3);
    expect(seen).toEqual([...ids].reverse());
    const bad = await org.agent.get('/v1/setups').query({ cursor: 'bm90LWEtY3Vyc29y' }).expect(422);
    expect(fields(bad.body)).toEqual(['cursor']);
  });

  it('lists upcoming shoots soonest first: past ones left out, a windowless polar day kept until it ends', async () => {
    const studio = await signUp(t.url);
    const day = (offset: number) =>
      new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
    // Near the pole the sun stays above or below the blue-hour band all day around the solstices,
    // so the plan has no window: the next 15 June or 15 December at least 5 days away.
    const year = new Date().getUTCFullYear();
    const polarDate = [`${year}-06-15`, `${year}-12-15`, `${year + 1}-06-15`].find(
      (d) => d >= day(5),
    )!;
    const save = (name: string, inputs: object) => saveSetup(studio, { name, inputs });
    await save('Last month', { ...LAKESIDE_INPUTS, date: day(-30) });
    const later = await save('In forty days', { ...LAKESIDE_INPUTS, date: day(40) });
    const soon = await save('In three days', { ...LAKESIDE_INPUTS, date: day(3) });
    const polar = await save('Polar', {
      ...LAKESIDE_INPUTS,
      latitude: 89,
      longitude: 10,
      timeZone: 'UTC',
      date: polarDate,
    });
    expect(polar.windowStart).toBeNull();

    const res = await studio.agent.get('/v1/setups/upcoming?limit=10').expect(200);
    const names = res.body.data.map((s: { name: string }) => s.name);
    expect(names).not.toContain('Last month');
    expect([...names].sort()).toEqual(['In forty days', 'In three days', 'Polar']);
    // Soonest first, by window start (or the local date when there is no window).
    const starts = res.body.data.map(
      (s: { windowStart: string | null; date: string }) => s.windowStart ?? `${s.date}T00:00:00Z`,
    );
    expect([...starts].sort((a, b) => Date.parse(a) - Date.parse(b))).toEqual(starts);
    expect(res.body.data[0].id).toBe(soon.id);
    expect(res.body.data.map((s: { id: string }) => s.id)).toContain(later.id);

    const two = await studio.agent.get('/v1/setups/upcoming?limit=2').expect(200);
    expect(two.body.data).toHaveLength(2);
    const three = await studio.agent.get('/v1/setups/upcoming').expect(200);
    expect(three.body.data).toHaveLength(3);
    const bad = await studio.agent.get('/v1/setups/upcoming?limit=0').expect(422);
    expect(fields(bad.body)).toEqual(['limit']);
    // Another organisation sees none of them.
    const elsewhere = await other.agent.get('/v1/setups/upcoming').expect(200);
    expect(elsewhere.body.data.map((s: { id: string }) => s.id)).not.toContain(soon.id);
  });

  it('duplicates a setup as it was saved, with a new id and name', async () => {
    const s = await saveSetup(owner, {
      name: 'Golden hour on the pier',
      notes: 'bring the ladder',
    });
    const copy = await owner.agent.post(`/v1/setups/${s.id}/duplicate`).send({}).expect(201);
    expect(copy.body.id).not.toBe(s.id);
    expect(copy.body).toMatchObject({
      name: 'Golden hour on the pier (copy)',
      notes: 'bring the ladder',
      venue: s.venue,
    });
    expect(copy.body.plan).toEqual(s.plan);
    expect(copy.body.inputs).toEqual(s.inputs);
    const named = await owner.agent
      .post(`/v1/setups/${s.id}/duplicate`)
      .send({ name: 'Pier, backup date' })
      .expect(201);
    expect(named.body.name).toBe('Pier, backup date');
    await owner.agent.get(`/v1/setups/${s.id}`).expect(200);
  });

  it("enforces the plan's savedSetups limit (403 problem), and lifts it on a plan without one", async () => {
    const org = await signUp(t.url);
    const [free] = await ds.query(`SELECT saved_setups FROM plans WHERE code = 'free'`);
    const limit = free.saved_setups as number;
    expect(limit).toBeGreaterThan(0);
    const first = await saveSetup(org);
    // Fill the rest of the allowance directly (each API save computes a plan; this is faster).
    await ds.query(
      `INSERT INTO setups (organization_id, name, shoot_date, time_zone, inputs, resolved_inputs, plan)
       SELECT organization_id, name || ' #' || g, shoot_date, time_zone, inputs, resolved_inputs, plan
         FROM setups, generate_series(2, $2::int) g WHERE id = $1`,
      [first.id, limit],
    );
    const over = await org.agent
      .post('/v1/setups')
      .send({ name: 'one too many', inputs: LAKESIDE_INPUTS })
      .expect(403);
    expect(over.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(over.body).toMatchObject({
      status: 403,
      limit: 'savedSetups',
      limitValue: limit,
      count: limit,
      planCode: 'free',
    });
    expect(over.body.detail).toMatch(/saved setups/);
    await org.agent.post(`/v1/setups/${first.id}/duplicate`).send({}).expect(403);
    await org.agent.delete(`/v1/setups/${first.id}`).expect(204);
    await saveSetup(org, { name: 'fits again' });
    const [unlimited] = await ds.query(
      `SELECT code FROM plans WHERE saved_setups IS NULL ORDER BY sort_order LIMIT 1`,
    );
    await ds.query(`UPDATE organizations SET plan_code = $2 WHERE id = $1`, [
      org.organizationId,
      unlimited.code,
    ]);
    await saveSetup(org, { name: 'beyond the free allowance' });
    const [{ n }] = await ds.query(
      `SELECT count(*)::int AS n FROM setups WHERE organization_id = $1`,
      [org.organizationId],
    );
    expect(n).toBe(limit + 1);
  });

  it('prints a shot sheet with the plan, the diagram, the gels and the cautions', async () => {
    const s = await saveSetup(owner, {
      name: 'Ines & Tobiah <script>alert(1)</script>',
      notes: 'Rail on the water side',
      inputs: { ...LAKESIDE_INPUTS, conditions: { windKmh: 35, nearWater: true, nearRoad: true } },
    });
    const res = await owner.agent.get(`/v1/setups/${s.id}/sheet`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    // A page under /v1: the page set of security headers (its inline styles are allowed), and
    // still not cached.
    expect(res.headers['content-security-policy']).toContain("style-src 'self' 'unsafe-inline'");
    expect(res.headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(res.headers['cache-control']).toBe('private, no-store');
    const html = res.text;
    expect(html).toMatch(/^<!doctype html>/);
    expect(html).not.toContain('<script>alert(1)</script>');
    expect(html).toContain('Ines &amp; Tobiah &lt;script&gt;');
    // Diagram: an SVG with the camera, subject, key and rim.
    const svg = /<svg[\s\S]*?<\/svg>/.exec(html)?.[0] ?? '';
    for (const label of ['camera', 'subject', 'key ·', 'rim ·']) expect(svg).toContain(label);
    expect(svg).toMatch(/role="img"/);
    // Plan values: first suggested minute, key power, gels and compensation.
    const plan = s.plan as unknown as ReturnType<typeof planDuskSetup>;
    const first = plan.suggestedMinutes[0]!;
    expect(html).toContain(clockOf(first.time)); // nearest minute, as the console prints it
    expect(html).toContain(first.keyFlash.powerLabel);
    for (const g of plan.gels.gels) expect(html).toContain(g.name);
    expect(html).toMatch(/raise flash power/);
    // Cautions: those the conditions call for, then every other one, deferring to local rules.
    for (const c of plan.cautions) expect(html).toContain(c.title);
    expect(html).toMatch(/sandbags/);
    expect(html).toMatch(/35 km\/h/);
    for (const topic of [
      'Roads after dark',
      'Water edges after dark',
      'Cold aerosol fog and haze',
      'Hot modelling lamps',
      'Batteries',
    ]) {
      expect(html).toContain(topic);
    }
    expect(html).toMatch(/local codes, venue rules/i);
    expect(html).toMatch(/licensed practice/);
    expect(html).toMatch(/@media print/);
  });
});
