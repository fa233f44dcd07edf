// Per-user preferences on /v1/me: metres or feet follow the person into any browser or session.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { PASSWORD, signUp } from '../factories/accounts.js';
import { bootApp, TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

describe('accounts: profile and preferences', () => {
  let t: TestApp;
  let db: DataSource;
  beforeAll(async () => {
    t = await bootApp();
    db = await openDataSource();
  }, 90000);
  afterAll(async () => {
    await db?.destroy();
    await t?.close();
  });

  it('starts in metres, in /v1/me and in the sign-in answer', async () => {
    const a = await signUp(t.url);
    const me = await a.agent.get('/v1/me').expect(200);
    expect(me.body.preferences).toEqual({ lengthUnit: 'm' });
    const signIn = await request(t.url)
      .post('/v1/auth/sign-in')
      .send({ email: a.email, password: PASSWORD })
      .expect(200);
    expect(signIn.body.preferences).toEqual({ lengthUnit: 'm' });
  });

  it('saves feet for the user: a fresh session elsewhere sees it, the name is left alone', async () => {
    const a = await signUp(t.url, { name: 'Maren Duskfield' });
    const res = await a.agent
      .patch('/v1/me')
      .send({ preferences: { lengthUnit: 'ft' } })
      .expect(200);
    expect(res.body.preferences).toEqual({ lengthUnit: 'ft' });
    expect(res.body.user.name).toBe('Maren Duskfield');

    // Another "browser": a new agent with its own session cookie.
    const other = request.agent(t.url);
    await other.post('/v1/auth/sign-in').send({ email: a.email, password: PASSWORD }).expect(200);
    expect((await other.get('/v1/me').expect(200)).body.preferences).toEqual({ lengthUnit: 'ft' });

    const [row] = await db.query(`SELECT length_unit FROM users WHERE id = $1`, [a.userId]);
    expect(row.length_unit).toBe('ft');
  });

  it('keeps each user’s choice to that user', async () => {
    const a = await signUp(t.url);
    const b = await signUp(t.url);
    await a.agent
      .patch('/v1/me')
      .send({ preferences: { lengthUnit: 'ft' } })
      .expect(200);
    expect((await b.agent.get('/v1/me').expect(200)).body.preferences.lengthUnit).toBe('m');
  });

  it('renames without touching preferences, and can change both at once', async () => {
    const a = await signUp(t.url);
    await a.agent
      .patch('/v1/me')
      .send({ preferences: { lengthUnit: 'ft' } })
      .expect(200);
    const renamed = await a.agent.patch('/v1/me').send({ name: '  Tove Lanternby ' }).expect(200);
    expect(renamed.body.user.name).toBe('Tove Lanternby');
    expect(renamed.body.preferences.lengthUnit).toBe('ft');
    const both = await a.agent
      .patch('/v1/me')
      .send({ name: 'Tove L.', preferences: { lengthUnit: 'm' } })
      .expect(200);
    expect(both.body.user.name).toBe('Tove L.');
    expect(both.body.preferences.lengthUnit).toBe('m');
    // Renames are audited (from → to); unit changes and same-name saves are not.
    await a.agent.patch('/v1/me').send({ name: 'Tove L.' }).expect(200);
    const rows: { metadata: { from: string; to: string } }[] = await db.query(
      `SELECT metadata FROM audit_events WHERE action = 'auth.name_changed' AND target_id = $1
        ORDER BY created_at`,
      [a.userId],
    );
    expect(rows.map((r) => r.metadata.to)).toEqual(['Tove Lanternby', 'Tove L.']);
    expect(rows[1]!.metadata.from).toBe('Tove Lanternby');
  });

  it('refuses bad input with 422 problem+json naming the field, and changes nothing', async () => {
    const a = await signUp(t.url, { name: 'Unchanged Name' });
    const cases: { body: unknown; fields: string[] }[] = [
      { body: { preferences: { lengthUnit: 'yd' } }, fields: ['preferences.lengthUnit'] },
      { body: { preferences: { lengthUnit: 'FT' } }, fields: ['preferences.lengthUnit'] },
      { body: { preferences: {} }, fields: ['preferences.lengthUnit'] },
      { body: { preferences: null }, fields: ['preferences'] },
      { body: { preferences: 'ft' }, fields: ['preferences'] },
      {
        body: { preferences: { lengthUnit: 'ft', theme: 'night' } },
        fields: ['preferences.theme'],
      },
      { body: { name: null }, fields: ['name'] },
      { body: { name: '' }, fields: ['name'] },
      { body: {}, fields: ['name', 'preferences'] },
    ];
    for (const c of cases) {
      const res = await a.agent.patch('/v1/me').send(c.body as object);
      expect({ body: c.body, status: res.status }).toEqual({ body: c.body, status: 422 });
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      const fields = res.body.errors.map((e: { field: string }) => e.field);
      expect({ body: c.body, fields: [...new Set(fields)].sort() }).toEqual({
        body: c.body,
        fields: c.fields,
      });
    }
    const me = await a.agent.get('/v1/me').expect(200);
    expect(me.body.user.name).toBe('Unchanged Name');
    expect(me.body.preferences.lengthUnit).toBe('m');
  });

  it('the database itself refuses a unit other than m or ft', async () => {
    const a = await signUp(t.url);
    await expect(
      db.query(`UPDATE users SET length_unit = 'yd' WHERE id = $1`, [a.userId]),
    ).rejects.toThrow(/users_length_unit_check/);
  });
});
