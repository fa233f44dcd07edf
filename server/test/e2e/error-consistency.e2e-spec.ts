// Refusals read the same everywhere: limits in words (never a raw regex), one error per field,
// body problems naming `body` in the filter's own words, and a spec that describes the API keys
// and the server as they are.
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { DEMO_BODIES, keyedOrg, type KeyedOrg, post } from '../factories/compute.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';

type FieldProblem = { field: string; reason: string };

/** No reason may show a regular expression (anchors, classes, quantifiers). */
const noRegex = (errors: FieldProblem[]) => {
  for (const e of errors) expect(e.reason).not.toMatch(/[\^$]|\[[^\]]*\]|\{\d/);
};

describe('error consistency', () => {
  let t: TestApp;
  let ds: DataSource;
  let org: KeyedOrg;

  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
    org = await keyedOrg(t.url);
    // Frame listing is part of the uploads feature (studio plan).
    await ds.query(`UPDATE organizations SET plan_code = 'studio' WHERE id = $1`, [
      org.owner.organizationId,
    ]);
  });

  afterAll(async () => {
    await t?.close();
    await ds?.destroy();
  });

  it('query limits, statuses and key ids are refused in words, one error per field', async () => {
    const frames = (limit: string) =>
      request(t.url)
        .get('/v1/frames')
        .query({ limit })
        .set('Authorization', `Bearer ${org.test.secret}`);
    for (const limit of ['0', '101', '1.5', 'abc']) {
      const res = await frames(limit);
      expect(res.status).toBe(422);
      expect(res.body.type).toBe('https://lumenwright.test/problems/invalid-input');
      expect(res.body.errors).toEqual([
        { field: 'limit', reason: 'must be a whole number from 1 to 100' },
      ]);
    }
    await frames('100').expect(200);

    const events = (query: Record<string, string>) =>
      org.owner.agent.get('/v1/usage/events').query(query);
    const cases: [Record<string, string>, FieldProblem][] = [
      [{ limit: '1000' }, { field: 'limit', reason: 'must be a whole number from 1 to 200' }],
      [{ limit: '0' }, { field: 'limit', reason: 'must be a whole number from 1 to 200' }],
      [{ limit: '1.5' }, { field: 'limit', reason: 'must be a whole number from 1 to 200' }],
      [{ limit: 'abc' }, { field: 'limit', reason: 'must be a whole number from 1 to 200' }],
      [{ status: 'abc' }, { field: 'status', reason: 'must be a whole number from 100 to 599' }],
      [{ status: '42' }, { field: 'status', reason: 'must be a whole number from 100 to 599' }],
      [{ keyId: 'not-a-uuid' }, { field: 'keyId', reason: 'must be a UUID' }],
      [
        { from: 'yesterday' },
        {
          field: 'from',
          reason: 'must be a date (YYYY-MM-DD) or an ISO 8601 date-time with Z or an offset',
        },
      ],
    ];
    for (const [query, problem] of cases) {
      const res = await events(query);
      expect(res.status).toBe(422);
      expect(res.body.errors).toEqual([problem]);
    }
    await events({ limit: '200', status: '200' }).expect(200);

    // A date-time where a calendar date is expected: one error for `from`, not two.
    const summary = await org.owner.agent
      .get('/v1/usage/summary')
      .query({ from: '2026-12-03T10:00:00Z' });
    expect(summary.status).toBe(422);
    expect(summary.body.errors).toEqual([
      { field: 'from', reason: 'must be a calendar date, YYYY-MM-DD' },
    ]);
    const keyId = await org.owner.agent.get('/v1/usage/summary').query({ keyId: 'nope' });
    expect(keyId.body.errors).toEqual([{ field: 'keyId', reason: 'must be a UUID' }]);
    noRegex([...summary.body.errors, ...keyId.body.errors]);
  });

  it('a gear id that is not a UUID says so in words', async () => {
    const res = await post(t.url, 'balance', org.test.secret, {
      ...DEMO_BODIES.balance,
      gelKitId: 'not-a-uuid',
    });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ field: 'gelKitId', reason: 'must be a UUID' }]);
  });

  it('console bodies read like the compute ones: a field left out is required, one problem per field', async () => {
    const keys = (body: Record<string, unknown>) => org.owner.agent.post('/v1/keys').send(body);
    const empty = await keys({});
    expect(empty.status).toBe(422);
    expect(empty.body.detail).toBe('name is required (and 1 more).');
    expect(empty.body.errors).toEqual([
      { field: 'name', reason: 'is required' },
      { field: 'environment', reason: 'is required' },
    ]);
    // A number for a name fails its type check and its length; only the type check is told.
    const typed = await keys({ name: 5, environment: 'test' });
    expect(typed.status).toBe(422);
    expect(typed.body.errors).toEqual([{ field: 'name', reason: 'must be a string' }]);
    expect(typed.body.detail).toBe('name must be a string.');
    const stray = await keys({ name: 'Stray field', environment: 'test', colour: 'blue' });
    expect(stray.body.errors).toEqual([{ field: 'colour', reason: 'is not a known field' }]);
    // Nested: a kit's piece left without a shift is named by its path, in the DTO's own words.
    const kit = await org.owner.agent
      .post('/v1/gear/gel-kits')
      .send({ name: 'Dusk roll', pieces: [{ name: 'Half warming', lossStops: 0.33 }] });
    expect(kit.status).toBe(422);
    expect(kit.body.errors).toEqual([
      { field: 'pieces[0].miredShift', reason: 'is required unless greenShift is sent' },
    ]);
  });

  it('the nearest light distance follows the unit: 0.1 ft is refused, 0.33 ft and 0.1 m are not', async () => {
    const setup = (distance: number, distanceUnit: 'm' | 'ft') =>
      post(t.url, 'setup', org.test.secret, {
        ...DEMO_BODIES.setup,
        key: { guideNumber: 60, distance, distanceUnit },
      });
    const near = await setup(0.1, 'ft');
    expect(near.status).toBe(422);
    expect(near.body.errors).toEqual([
      { field: 'key.distance', reason: 'must be between 0.33 and 164' },
    ]);
    await setup(0.33, 'ft').expect(200);
    await setup(0.1, 'm').expect(200);
  });

  it('JSON sent as text/plain and broken JSON read like every other body refusal', async () => {
    const text = await request(t.url)
      .post('/v1/balance')
      .set('Authorization', `Bearer ${org.test.secret}`)
      .set('Content-Type', 'text/plain')
      .send(JSON.stringify(DEMO_BODIES.balance));
    expect(text.status).toBe(415);
    expect(text.body).toMatchObject({
      type: 'https://lumenwright.test/problems/unsupported-media-type',
      detail: 'Send the request body as application/json.',
      errors: [{ field: 'body', reason: 'must be sent as application/json' }],
    });
    const broken = await request(t.url)
      .post('/v1/balance')
      .set('Authorization', `Bearer ${org.test.secret}`)
      .set('Content-Type', 'application/json')
      .send('{"cameraKelvin": 3800,');
    expect(broken.status).toBe(400);
    expect(broken.body).toMatchObject({
      type: 'https://lumenwright.test/problems/bad-request',
      detail: 'The request body is not valid JSON.',
      errors: [{ field: 'body', reason: 'is not valid JSON' }],
    });
    expect(broken.text).not.toMatch(/content-type is set to/);
  });

  it('the served spec names the configured public URL and describes opaque API keys', async () => {
    const behind = await bootApp({ PUBLIC_URL: 'https://api.lumenwright.test/' });
    let doc;
    try {
      doc = (await request(behind.url).get('/openapi.json').expect(200)).body;
    } finally {
      await behind.close();
    }
    expect(doc.servers).toEqual([
      { url: 'https://api.lumenwright.test', description: 'This server' },
    ]);
    const apiKey = doc.components.securitySchemes.apiKey;
    expect(apiKey.scheme).toBe('bearer');
    expect(apiKey.bearerFormat).not.toBe('JWT');
    expect(apiKey.description).toMatch(/opaque/i);
  });
});
