// POST /v1/timeline end to end: a real key, the real validation, the shared math behind it, and
// the metering (one usage event for a call retried with its Idempotency-Key).
import { getTimes } from 'suncalc';
import type { DataSource } from 'typeorm';
import { compileSchema } from '../../src/compute/validation/json-schema.js';
import { RESPONSE_SCHEMAS } from '../../src/compute/schemas/index.js';
import { UsageWriter } from '../../src/usage/usage-writer.service.js';
import { bootApp, type TestApp } from '../setup/app.js';
import { openDataSource } from '../setup/db.js';
import { DEMO_BODIES, keyedOrg, post, type KeyedOrg } from '../factories/compute.js';

const BODY = DEMO_BODIES.timeline!;
const EVENT = { label: 'Ceremony', start: '16:00', end: '16:45' };

describe('POST /v1/timeline', () => {
  let t: TestApp;
  let ds: DataSource;
  let org: KeyedOrg;
  beforeAll(async () => {
    t = await bootApp();
    ds = await openDataSource();
    org = await keyedOrg(t.url);
    // Functional checks, not limit checks: the roomiest plan, as in compute.e2e-spec.ts.
    await ds.query(`UPDATE organizations SET plan_code = 'platform' WHERE id = $1`, [
      org.owner.organizationId,
    ]);
  });
  afterAll(async () => {
    await ds?.destroy();
    await t?.close();
  });

  it('answers the invented terrace wedding: phases as /v1/twilight gives them, a slot clear of dinner, speeches and set-up', async () => {
    const res = await post(t.url, 'timeline', org.live.secret, BODY);
    expect(res.status).toBe(200);
    expect(compileSchema(RESPONSE_SCHEMAS.timeline!)(res.body)).toEqual([]);
    // The same place and date through /v1/twilight: the same blue hour and sunset.
    const tw = await post(t.url, 'twilight', org.live.secret, {
      latitude: BODY.latitude,
      longitude: BODY.longitude,
      date: BODY.date,
      timeZone: BODY.timeZone,
    }).expect(200);
    expect(res.body.twilight.blueHour).toEqual(tw.body.blueHour);
    expect(res.body.twilight.sunset).toBe(tw.body.sunset);
    // suncalc 2.0.2 getTimes at local noon (11:00Z; Europe/London is UTC+1 in June) [reference
    // library]: sunset within a second.
    const ref = getTimes(new Date(Date.UTC(2026, 5, 20, 11)), 51.507, -0.1);
    expect(Math.abs(Date.parse(res.body.twilight.sunset) - ref.sunset!.getTime())).toBeLessThan(
      1000,
    );
    // Interval arithmetic (common practice, no source): speeches end 21:40, 10 minutes of set-up
    // (the default), so nothing starts before 21:50 nor before the blue hour.
    const best = res.body.slots[0];
    expect(best.rank).toBe(1);
    const speechesEnd = Date.parse('2026-06-20T21:40:00+01:00');
    expect(Date.parse(best.setupFrom)).toBeGreaterThanOrEqual(speechesEnd);
    expect(Date.parse(best.session.start) - Date.parse(best.setupFrom)).toBe(10 * 60_000);
    expect(Date.parse(best.session.start)).toBeGreaterThanOrEqual(
      Date.parse(res.body.twilight.blueHour.start),
    );
    expect(res.body.window.basis).toBe('blue-hour');
    const kinds = res.body.timeline.map((e: { kind: string }) => e.kind);
    expect(kinds.filter((k: string) => k === 'event')).toHaveLength(2);
    expect(kinds).toContain('portraits');
    // No placement, conditions or stands given: the earliest placement, a key and a backlight
    // (2 stands, common practice, no source), and the cautions for stands and the dark.
    expect(res.body.placement).toBe('earliest');
    expect(res.body.lightStands).toBe(2);
    expect(res.body.cautions.map((c: { id: string }) => c.id)).toEqual([
      'stands-wind',
      'batteries',
      'dark-footing',
    ]);
  });

  it('places the session as late in the blue hour as the stretch allows, and gives the same cautions /v1/setup gives', async () => {
    const conditions = { windKmh: 35, nearWater: true, nearRoad: true };
    const res = await post(t.url, 'timeline', org.live.secret, {
      ...BODY,
      placement: 'latest',
      conditions,
    });
    expect(res.status).toBe(200);
    expect(compileSchema(RESPONSE_SCHEMAS.timeline!)(res.body)).toEqual([]);
    expect(res.body.placement).toBe('latest');
    // suncalc 2.0.2 [reference library]: the blue hour ends after civil dusk (-6°) and before
    // nautical dusk (-12°), as its -8° edge must.
    const ref = getTimes(new Date(Date.UTC(2026, 5, 20, 11)), 51.507, -0.1);
    const blueEnd = Date.parse(res.body.twilight.blueHour.end);
    expect(blueEnd).toBeGreaterThan(ref.dusk!.getTime());
    expect(blueEnd).toBeLessThan(ref.nauticalDusk!.getTime());
    // Interval arithmetic (common practice, no source): nothing is booked after 21:40, so the
    // 20-minute session ends with the blue hour, its 10 minutes of set-up right before it.
    const best = res.body.slots[0];
    expect(Date.parse(best.session.end)).toBe(blueEnd);
    expect(blueEnd - Date.parse(best.session.start)).toBe(20 * 60_000);
    expect(Date.parse(best.session.start) - Date.parse(best.setupFrom)).toBe(10 * 60_000);
    expect(Date.parse(best.setupFrom)).toBeGreaterThanOrEqual(
      Date.parse('2026-06-20T21:40:00+01:00'),
    );
    // The cautions: item for item what /v1/setup answers for the same conditions with a key
    // and a rim light (two stands), each deferring to local codes and venue rules.
    const setup = await post(t.url, 'setup', org.live.secret, {
      ...DEMO_BODIES.setup,
      rim: { guideNumber: 45, distanceBehind: 3, lightHeight: 2 },
      conditions,
    }).expect(200);
    expect(res.body.cautions).toEqual(setup.body.cautions);
    expect(res.body.cautions.map((c: { id: string }) => c.id)).toEqual([
      'stands-wind',
      'roads-at-night',
      'water-at-night',
      'batteries',
      'dark-footing',
    ]);
    for (const c of res.body.cautions) expect(c.text).toMatch(/Follow local codes, venue rules/);
    // No stands on site: no stand caution; the ones for the dark stay.
    const none = await post(t.url, 'timeline', org.live.secret, {
      ...BODY,
      lightStands: 0,
    }).expect(200);
    expect(none.body.cautions.map((c: { id: string }) => c.id)).toEqual([
      'batteries',
      'dark-footing',
    ]);
  });

  it('centres the session on the blue hour’s middle with placement mid-blue-hour', async () => {
    const res = await post(t.url, 'timeline', org.live.secret, {
      ...BODY,
      placement: 'mid-blue-hour',
    }).expect(200);
    // Interval arithmetic (common practice, no source); answers carry whole seconds.
    const { start, end } = res.body.twilight.blueHour;
    const middle = (Date.parse(start) + Date.parse(end)) / 2;
    const s = res.body.slots[0].session;
    const centre = (Date.parse(s.start) + Date.parse(s.end)) / 2;
    expect(Math.abs(centre - middle)).toBeLessThanOrEqual(1000);
  });

  it('names `events[2].end` for an event that ends before it starts', async () => {
    const res = await post(t.url, 'timeline', org.live.secret, {
      ...BODY,
      events: [EVENT, EVENT, { label: 'Dinner', start: '20:00', end: '19:00' }],
    });
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.errors).toEqual([{ field: 'events[2].end', reason: 'must be after start' }]);
  });

  it.each([
    ['a number out of range', { latitude: 91 }, 'latitude'],
    ['minutes below their range', { portraitMinutes: 0 }, 'portraitMinutes'],
    ['a number sent as a string', { setupMinutes: '10' }, 'setupMinutes'],
    ['a missing required field', { portraitMinutes: undefined }, 'portraitMinutes'],
    ['a bad date', { date: '2026-02-30' }, 'date'],
    ['a UTC offset for the zone', { timeZone: '+01:00' }, 'timeZone'],
    ['an unknown field', { colour: 'blue' }, 'colour'],
    ['a placement not in the list', { placement: 'sunset' }, 'placement'],
    ['wind beyond its range', { conditions: { windKmh: 401 } }, 'conditions.windKmh'],
    ['wind sent as words', { conditions: { windKmh: 'breezy' } }, 'conditions.windKmh'],
    [
      'a flag that is not true or false',
      { conditions: { nearRoad: 'yes' } },
      'conditions.nearRoad',
    ],
    ['an unknown condition', { conditions: { gusts: 40 } }, 'conditions.gusts'],
    ['conditions that are not an object', { conditions: 'windy' }, 'conditions'],
    ['stands in halves', { lightStands: 1.5 }, 'lightStands'],
    ['too many stands', { lightStands: 11 }, 'lightStands'],
    ['too many events', { events: Array.from({ length: 31 }, () => EVENT) }, 'events'],
    ['an event that is not an object', { events: [EVENT, 'dinner'] }, 'events[1]'],
    ['an empty label', { events: [{ ...EVENT, label: '' }] }, 'events[0].label'],
    ['a time in no known form', { events: [{ ...EVENT, start: '7pm' }] }, 'events[0].start'],
    [
      // IANA tz database: Europe/London skips 01:00–02:00 on 2026-03-29.
      'a local time the clocks skip',
      {
        date: '2026-03-29',
        timeZone: 'Europe/London',
        events: [{ ...EVENT, start: '01:30', end: '03:00' }],
      },
      'events[0].start',
    ],
    [
      'an instant outside the day',
      { events: [{ ...EVENT, end: '2026-06-21T13:00:00+01:00' }] },
      'events[0].end',
    ],
  ])('refuses %s with a 422 naming the field', async (_kind, over, field) => {
    const res = await post(t.url, 'timeline', org.live.secret, { ...BODY, ...over });
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    expect(res.body.errors.map((e: { field: string }) => e.field)).toEqual([field]);
  });

  it('counts a call retried with its Idempotency-Key once, and replays the first answer', async () => {
    const studio = await keyedOrg(t.url);
    const key = `timeline-retry-${Date.now().toString(36)}`;
    const first = await post(t.url, 'timeline', studio.live.secret, BODY).set(
      'Idempotency-Key',
      key,
    );
    const retry = await post(t.url, 'timeline', studio.live.secret, BODY).set(
      'Idempotency-Key',
      key,
    );
    expect(first.status).toBe(200);
    expect(first.headers['idempotency-replayed']).toBeUndefined();
    expect(retry.status).toBe(200);
    expect(retry.headers['idempotency-replayed']).toBe('true');
    expect(retry.text).toBe(first.text);
    const read = () =>
      ds.query(
        `SELECT status, billable_units FROM usage_events WHERE key_id = $1 AND endpoint = 'timeline'`,
        [studio.live.id],
      ) as Promise<{ status: number; billable_units: number }[]>;
    let rows = await read();
    for (let i = 0; i < 100 && rows.length < 1; i++) {
      await new Promise((r) => setTimeout(r, 50));
      await t.app.get(UsageWriter).flush();
      rows = await read();
    }
    // Room for a second event that should not exist to arrive, then read again.
    await new Promise((r) => setTimeout(r, 300));
    await t.app.get(UsageWriter).flush();
    expect(await read()).toEqual([{ status: 200, billable_units: 1 }]);
  });
});
