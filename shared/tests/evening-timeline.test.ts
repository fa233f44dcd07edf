/**
 * The evening timeline: its twilight phases checked against two outside references, suncalc
 * 2.0.2 (the reference library the project uses, called directly here) and astronomy-engine
 * 2.1.19 (the independent reference the twilight tests use, ±30 s below 60° latitude); the slot
 * logic against hand-made schedules whose answers follow from interval arithmetic on the
 * reference times (common practice, no source).
 */
import { Body, Observer, SearchAltitude, SearchHourAngle, SearchRiseSet } from 'astronomy-engine';
import fc from 'fast-check';
import { getPosition, getTimes } from 'suncalc';
import { describe, expect, it } from 'vitest';
import {
  CAUTION_DEFERENCE,
  DEFAULT_LIGHT_STANDS,
  DEFAULT_PLACEMENT,
  DEFAULT_SETUP_MINUTES,
  LightingInputError,
  planDuskSetup,
  planEveningTimeline,
  SESSION_PLACEMENTS,
  TIMELINE_WARNING_CODES,
  WIND_STRIKE_KMH,
  type BookedEvent,
  type TimelineInput,
} from '../src/index.js';

const MIN = 60_000;
// An invented riverside-terrace wedding (real coordinates are fine; the venue is made up).
const TERRACE = {
  latitude: 51.507,
  longitude: -0.1,
  date: '2026-06-20',
  timeZone: 'Europe/London',
};
// An invented vineyard evening in the southern summer.
const VINEYARD = {
  latitude: -33.92,
  longitude: 18.42,
  date: '2026-12-05',
  timeZone: 'Africa/Johannesburg',
};
// Svalbard at the June solstice: the sun does not set.
const POLAR_DAY = {
  latitude: 78.22,
  longitude: 15.65,
  date: '2026-06-21',
  timeZone: 'Arctic/Longyearbyen',
};

const at = (iso: string | null): number => {
  expect(iso).not.toBeNull();
  return Date.parse(iso!);
};
const z = (t: number) => new Date(t).toISOString();
const codes = (r: { warnings: { code: string }[] }) => r.warnings.map((w) => w.code);
const plan = (over: Partial<TimelineInput> & { events?: BookedEvent[] }) =>
  planEveningTimeline({ ...TERRACE, portraitMinutes: 20, ...over } as TimelineInput);

/** The reference blue hour etc. from astronomy-engine, searched from the date's solar noon. */
function astro(place: { latitude: number; longitude: number }, localMidnightUtc: number) {
  const obs = new Observer(place.latitude, place.longitude, 0);
  const noon = SearchHourAngle(Body.Sun, obs, 0, new Date(localMidnightUtc)).time;
  const alt = (deg: number) => SearchAltitude(Body.Sun, obs, -1, noon, 0.5, deg)?.date.getTime();
  return {
    // SearchRiseSet: upper limb with standard refraction, as sunset is defined (USNO).
    sunset: SearchRiseSet(Body.Sun, obs, -1, noon, 0.5)?.date.getTime(),
    civilDusk: alt(-6),
    nauticalDusk: alt(-12),
    blueStart: alt(-4),
    blueEnd: alt(-8),
  };
}

describe('planEveningTimeline: the phases against outside references', () => {
  it.each([
    // IANA tz database: Europe/London is UTC+1 on 2026-06-20, Africa/Johannesburg UTC+2 all year.
    ['terrace, London midsummer', TERRACE, Date.UTC(2026, 5, 19, 23)],
    ['vineyard, Cape summer', VINEYARD, Date.UTC(2026, 11, 4, 22)],
  ])('%s: sunset and dusk match suncalc to the second', (_name, place, midnightUtc) => {
    const r = planEveningTimeline({ ...place, portraitMinutes: 20 });
    // suncalc 2.0.2 getTimes at local noon [LIB]: sunset (-0.833°), dusk (-6°), nauticalDusk (-12°).
    const ref = getTimes(new Date(midnightUtc + 12 * 3600_000), place.latitude, place.longitude);
    expect(Math.abs(at(r.twilight.sunset) - ref.sunset!.getTime())).toBeLessThanOrEqual(1000);
    expect(Math.abs(at(r.twilight.civilDusk) - ref.dusk!.getTime())).toBeLessThanOrEqual(1000);
    expect(Math.abs(at(r.twilight.nauticalDusk) - ref.nauticalDusk!.getTime())).toBeLessThanOrEqual(
      1000,
    );
  });

  it.each([
    ['terrace, London midsummer', TERRACE, Date.UTC(2026, 5, 19, 23)],
    ['vineyard, Cape summer', VINEYARD, Date.UTC(2026, 11, 4, 22)],
  ])('%s: sunset, dusk and blue hour within 30 s of astronomy-engine', (_name, place, midnight) => {
    const r = planEveningTimeline({ ...place, portraitMinutes: 20 });
    const ref = astro(place, midnight);
    // astronomy-engine 2.1.19 [LIB]; ±30 s as the twilight reference tests allow below 60°.
    expect(Math.abs(at(r.twilight.sunset) - ref.sunset!)).toBeLessThan(30_000);
    expect(Math.abs(at(r.twilight.civilDusk) - ref.civilDusk!)).toBeLessThan(30_000);
    expect(Math.abs(at(r.twilight.nauticalDusk) - ref.nauticalDusk!)).toBeLessThan(30_000);
    // Blue hour -4° to -8° geometric (common practice, no standard), as in the twilight code.
    expect(Math.abs(at(r.twilight.blueHour.start) - ref.blueStart!)).toBeLessThan(30_000);
    expect(Math.abs(at(r.twilight.blueHour.end) - ref.blueEnd!)).toBeLessThan(30_000);
    expect(r.window).toEqual({
      basis: 'blue-hour',
      start: r.twilight.blueHour.start,
      end: r.twilight.blueHour.end,
    });
  });

  it('polar day (78.2° N, June solstice): no sunset, no window, no slot, a polar-day warning', () => {
    const place = { latitude: POLAR_DAY.latitude, longitude: POLAR_DAY.longitude };
    const r = planEveningTimeline({ ...POLAR_DAY, portraitMinutes: 20 });
    // suncalc 2.0.2 [LIB]: alwaysUp, and the sun's altitude at local midnight is above 0.
    const ref = getTimes(new Date(Date.UTC(2026, 5, 21, 10)), place.latitude, place.longitude);
    expect(ref.alwaysUp).toBe(true);
    const midnightAlt = getPosition(new Date(Date.UTC(2026, 5, 21, 22)), 78.22, 15.65).altitude;
    expect(midnightAlt).toBeGreaterThan(0);
    expect(r.twilight.sunset).toBeNull();
    expect(r.twilight.reasons.sunset).toBe('sun-never-sets');
    expect(r.window).toEqual({ basis: null, start: null, end: null });
    expect(r.slots).toEqual([]);
    expect(codes(r)).toEqual(['polar-day']);
  });

  it('polar night (69.65° N, December solstice): no sunset, but a blue hour after the midday low', () => {
    const place = { latitude: 69.6492, longitude: 18.9553 };
    const r = planEveningTimeline({
      ...place,
      date: '2026-12-21',
      timeZone: 'Europe/Oslo',
      portraitMinutes: 30,
    });
    // suncalc 2.0.2 [LIB]: alwaysDown. astronomy-engine [LIB]: the sun still crosses -4° and -8°
    // in the afternoon, so the blue hour exists; within 60 s (the 60-72° tolerance of the
    // twilight reference tests).
    const ref = getTimes(new Date(Date.UTC(2026, 11, 21, 11)), place.latitude, place.longitude);
    expect(ref.alwaysDown).toBe(true);
    const a = astro(place, Date.UTC(2026, 11, 20, 23));
    expect(r.twilight.sunset).toBeNull();
    expect(r.twilight.reasons.sunset).toBe('sun-never-rises');
    expect(Math.abs(at(r.twilight.blueHour.start) - a.blueStart!)).toBeLessThan(60_000);
    expect(Math.abs(at(r.twilight.blueHour.end) - a.blueEnd!)).toBeLessThan(60_000);
    expect(codes(r)).toEqual(['polar-night']);
    expect(r.window.basis).toBe('blue-hour');
    expect(r.slots).toHaveLength(1);
    expect(r.slots[0]!.session.start).toBe(r.twilight.blueHour.start);
  });

  it('white night (60.17° N, June solstice): the sun turns between -6° and -8°, so slots lie between sunset and civil dusk, after the blue hour’s start', () => {
    const place = { latitude: 60.1699, longitude: 24.9384 };
    const r = planEveningTimeline({
      ...place,
      date: '2026-06-21',
      timeZone: 'Europe/Helsinki',
      portraitMinutes: 20,
    });
    // astronomy-engine [LIB] (IANA: Europe/Helsinki is UTC+3 in June): the sun crosses -4° and
    // -6° but never reaches -8° that night; 60 s tolerance above 60° as in the twilight tests.
    const a = astro(place, Date.UTC(2026, 5, 20, 21));
    expect(a.blueEnd).toBeUndefined();
    expect(Math.abs(at(r.twilight.blueHour.start) - a.blueStart!)).toBeLessThan(60_000);
    expect(Math.abs(at(r.twilight.civilDusk) - a.civilDusk!)).toBeLessThan(60_000);
    expect(r.twilight.blueHour.end).toBeNull();
    expect(r.window).toEqual({
      basis: 'sunset-to-civil-dusk',
      start: r.twilight.sunset,
      end: r.twilight.civilDusk,
    });
    expect(codes(r)).toEqual(['outside-blue-hour']);
    // The session starts with the blue band, all of it in the band (interval arithmetic).
    const s = r.slots[0]!;
    expect(s.session.start).toBe(r.twilight.blueHour.start);
    expect(s.blueHourMinutes).toBe(20);
  });

  it('white night (64.15° N, June solstice): the sun sets but never reaches civil dusk, so no window', () => {
    const place = { latitude: 64.1466, longitude: -21.9426 };
    const r = planEveningTimeline({
      ...place,
      date: '2026-06-21',
      timeZone: 'Atlantic/Reykjavik',
      portraitMinutes: 20,
    });
    // astronomy-engine [LIB] (IANA: Atlantic/Reykjavik is UTC+0): a sunset, no -6° crossing.
    const a = astro(place, Date.UTC(2026, 5, 21));
    expect(a.sunset).toBeDefined();
    expect(a.civilDusk).toBeUndefined();
    expect(Math.abs(at(r.twilight.sunset) - a.sunset!)).toBeLessThan(60_000);
    expect(r.twilight.civilDusk).toBeNull();
    expect(r.window).toEqual({ basis: null, start: null, end: null });
    expect(r.slots).toEqual([]);
    expect(codes(r)).toEqual(['no-window']);
  });
});

describe('planEveningTimeline: slots from hand-made schedules (interval arithmetic, common practice, no source)', () => {
  const base = plan({});
  const bs = at(base.twilight.blueHour.start);
  const be = at(base.twilight.blueHour.end);
  const sunset = at(base.twilight.sunset);
  const civil = at(base.twilight.civilDusk);
  const blueMin = (be - bs) / MIN;

  it('no events: one slot from the blue hour’s start, set-up before it, the wanted length fits', () => {
    expect(blueMin).toBeGreaterThan(20);
    expect(base.slots).toHaveLength(1);
    const s = base.slots[0]!;
    expect(base.setupMinutes).toBe(DEFAULT_SETUP_MINUTES);
    expect(at(s.start)).toBe(bs);
    expect(at(s.end)).toBe(be);
    expect(s.minutes).toBeCloseTo(blueMin, 1);
    expect(at(s.session.start)).toBe(bs);
    expect(at(s.session.end)).toBe(bs + 20 * MIN);
    expect(at(s.setupFrom)).toBe(bs - DEFAULT_SETUP_MINUTES * MIN);
    expect(s.session.minutes).toBe(20);
    expect(s.blueHourMinutes).toBe(20);
    expect(s.fitsWantedLength).toBe(true);
    expect(base.warnings).toEqual([]);
  });

  it('an event in the middle splits the blue hour; the stretch that holds more of the wanted session ranks first', () => {
    const speeches = { label: 'Speeches', start: z(bs + 10 * MIN), end: z(bs + 20 * MIN) };
    const r = plan({ events: [speeches], setupMinutes: 5, portraitMinutes: 15 });
    // Before: [bs, bs+10] (10 min). After: [bs+20+5 set-up, be].
    const after = be - (bs + 25 * MIN);
    expect(after).toBeGreaterThan(10 * MIN);
    expect(r.slots.map((s) => [at(s.start), at(s.end)])).toEqual([
      [bs + 25 * MIN, be],
      [bs, bs + 10 * MIN],
    ]);
    expect(r.slots.map((s) => s.rank)).toEqual([1, 2]);
    const fits = Math.min(15, after / MIN);
    expect(r.slots[0]!.blueHourMinutes).toBeCloseTo(fits, 1);
    expect(r.slots[1]!.blueHourMinutes).toBe(10);
    expect(r.slots[1]!.fitsWantedLength).toBe(false);
    expect(codes(r)).toEqual(
      after >= 15 * MIN
        ? ['event-overlaps-window']
        : ['shorter-than-wanted', 'event-overlaps-window'],
    );
  });

  it('set-up time that must follow an event pushes the session into the blue hour', () => {
    const dinner = { label: 'Dinner', start: z(bs - 90 * MIN), end: z(bs - 3 * MIN) };
    const r = plan({ events: [dinner], setupMinutes: 10 });
    // Dinner ends 3 min before the blue hour; 10 min of set-up end 7 min into it.
    expect(at(r.slots[0]!.start)).toBe(bs + 7 * MIN);
    expect(at(r.slots[0]!.setupFrom)).toBe(bs - 3 * MIN);
    expect(codes(r)).toEqual([]); // the dinner ends before the window opens
  });

  it('a fully booked blue hour moves the search to sunset–civil dusk, the session as late as it goes', () => {
    const dancing = { label: 'First dance', start: z(bs - MIN), end: z(be + MIN) };
    const r = plan({ events: [dancing] });
    expect(r.window).toEqual({
      basis: 'sunset-to-civil-dusk',
      start: base.twilight.sunset,
      end: base.twilight.civilDusk,
    });
    expect(r.slots).toHaveLength(1);
    const s = r.slots[0]!;
    expect([at(s.start), at(s.end)]).toEqual([sunset, bs - MIN]);
    expect([at(s.session.start), at(s.session.end)]).toEqual([bs - 21 * MIN, bs - MIN]);
    expect(s.blueHourMinutes).toBe(0);
    expect(codes(r)).toEqual(['outside-blue-hour', 'event-overlaps-window']);
    expect(civil).toBeGreaterThan(bs); // the fallback window does reach into the booked span
  });

  it('no free minute anywhere in the window: no slot and a no-free-stretch warning', () => {
    const party = { label: 'Reception', start: z(sunset - 60 * MIN), end: z(be + 60 * MIN) };
    const r = plan({ events: [party] });
    expect(r.slots).toEqual([]);
    expect(r.window.basis).toBe('blue-hour');
    expect(codes(r)).toEqual(['no-free-stretch', 'event-overlaps-window']);
    expect(r.timeline.some((e) => e.kind === 'portraits')).toBe(false);
  });

  it('a stretch shorter than wanted is still offered, with a warning', () => {
    const cake = { label: 'Cake', start: z(bs + 12 * MIN), end: z(be + 30 * MIN) };
    const r = plan({ events: [cake], portraitMinutes: 30 });
    expect(r.slots).toHaveLength(1);
    expect(r.slots[0]!.session.minutes).toBe(12);
    expect(r.slots[0]!.fitsWantedLength).toBe(false);
    expect(codes(r)).toEqual(['shorter-than-wanted', 'event-overlaps-window']);
  });

  it('merges events and phases in time order and reads HH:MM as local time on the date', () => {
    const r = plan({
      events: [
        { label: 'Ceremony', start: '16:00', end: '17:00' },
        { label: 'Dinner', start: '19:30', end: '21:30' },
        // After midnight: an instant with an offset.
        { label: 'Last dance', start: '2026-06-20T23:30:00+01:00', end: '2026-06-20T23:59:00Z' },
      ],
    });
    // IANA tz database: Europe/London keeps BST (UTC+1) in June, so 19:30 local is 18:30Z.
    const dinner = r.timeline.find((e) => e.eventIndex === 1)!;
    expect(dinner).toEqual({
      kind: 'event',
      phase: null,
      eventIndex: 1,
      label: 'Dinner',
      start: '2026-06-20T19:30:00+01:00',
      end: '2026-06-20T21:30:00+01:00',
    });
    expect(r.timeline.find((e) => e.eventIndex === 2)!.end).toBe('2026-06-21T00:59:00+01:00');
    const starts = r.timeline.map((e) => Date.parse(e.start));
    expect(starts).toEqual([...starts].sort((a, b) => a - b));
    expect(r.timeline.filter((e) => e.kind === 'phase').map((e) => e.phase)).toEqual([
      'golden-hour',
      'sunset',
      'blue-hour',
      'civil-dusk',
      'nautical-dusk',
    ]);
    const setup = r.timeline.find((e) => e.kind === 'set-up')!;
    const session = r.timeline.find((e) => e.kind === 'portraits')!;
    expect(setup.end).toBe(session.start);
    expect(session.start).toBe(r.slots[0]!.session.start);
  });

  it('reads HH:MM on a daylight-saving change day with the evening’s offset', () => {
    // IANA tz database: Europe/London returns to GMT (UTC+0) at 02:00 on 2026-10-25.
    const r = plan({
      date: '2026-10-25',
      events: [{ label: 'Ceremony', start: '15:00', end: '16:00' }],
    });
    expect(r.timeline.find((e) => e.kind === 'event')!.start).toBe('2026-10-25T15:00:00+00:00');
  });

  it('refuses a wall time the clocks skip, and takes the minutes either side of the gap', () => {
    // IANA tz database: Europe/London goes from 01:00 GMT to 02:00 BST on 2026-03-29, so 01:30
    // does not exist that day; 00:59 is GMT (+00:00) and 02:00 is BST (+01:00).
    const day = { date: '2026-03-29' };
    let refusal: LightingInputError | null = null;
    try {
      plan({ ...day, events: [{ label: 'Breakfast', start: '01:30', end: '03:00' }] });
    } catch (e) {
      refusal = e as LightingInputError;
    }
    expect(refusal).toBeInstanceOf(LightingInputError);
    expect(refusal!.field).toBe('events[0].start');
    expect(refusal!.message).toMatch(/does not exist on 2026-03-29 in Europe\/London/);
    const r = plan({ ...day, events: [{ label: 'Breakfast', start: '00:59', end: '02:00' }] });
    const e = r.timeline.find((x) => x.kind === 'event')!;
    expect(e.start).toBe('2026-03-29T00:59:00+00:00');
    expect(e.end).toBe('2026-03-29T02:00:00+01:00');
  });

  it('never puts a session or its set-up on top of an event, and keeps slots in the window (random schedules)', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            from: fc.integer({ min: -120, max: 90 }),
            len: fc.integer({ min: 1, max: 60 }),
          }),
          { maxLength: 8 },
        ),
        fc.integer({ min: 1, max: 60 }),
        fc.integer({ min: 0, max: 30 }),
        fc.constantFrom(...SESSION_PLACEMENTS),
        (raw, portraitMinutes, setupMinutes, placement) => {
          const events = raw.map((e, i) => ({
            label: `Event ${i}`,
            start: z(bs + e.from * MIN),
            end: z(bs + (e.from + e.len) * MIN),
          }));
          const r = plan({ events, portraitMinutes, setupMinutes, placement });
          const ws = at(r.window.start);
          const we = at(r.window.end);
          for (const s of r.slots) {
            const from = at(s.setupFrom);
            const to = at(s.session.end);
            expect(at(s.session.start) - from).toBe(setupMinutes * MIN);
            expect(at(s.session.start)).toBeGreaterThanOrEqual(ws);
            // The session stays inside its own free stretch, whatever the placement.
            expect(at(s.session.start)).toBeGreaterThanOrEqual(at(s.start));
            expect(to).toBeLessThanOrEqual(at(s.end));
            expect(to).toBeLessThanOrEqual(we);
            for (const e of events) {
              const clash = Math.min(to, Date.parse(e.end)) - Math.max(from, Date.parse(e.start));
              expect(clash).toBeLessThanOrEqual(0);
            }
          }
          const blue = r.slots.map((s) => s.blueHourMinutes);
          expect(blue).toEqual([...blue].sort((a, b) => b - a));
          for (const w of r.warnings) expect(TIMELINE_WARNING_CODES).toContain(w.code);
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('planEveningTimeline: bad input names the field', () => {
  const ok = { label: 'Ceremony', start: '16:00', end: '17:00' };
  const fieldOf = (input: unknown): string | null => {
    try {
      planEveningTimeline(input as TimelineInput);
      return null;
    } catch (e) {
      expect(e).toBeInstanceOf(LightingInputError);
      return (e as LightingInputError).field;
    }
  };
  it.each([
    [{ events: [ok, ok, { label: 'Dinner', start: '20:00', end: '19:00' }] }, 'events[2].end'],
    [{ events: [ok, { label: 'Dinner', start: '20:00', end: '20:00' }] }, 'events[1].end'],
    [{ events: [{ ...ok, start: 'seven' }] }, 'events[0].start'],
    [{ events: [{ ...ok, start: '24:00' }] }, 'events[0].start'],
    [{ events: [{ ...ok, end: '2026-06-21T13:00:00+01:00' }] }, 'events[0].end'],
    [{ events: [{ ...ok, start: '2026-06-19T23:00:00+01:00' }] }, 'events[0].start'],
    [{ events: [{ ...ok, label: ' ' }] }, 'events[0].label'],
    [{ events: [ok, 'dinner'] }, 'events[1]'],
    [{ events: Array.from({ length: 31 }, () => ok) }, 'events'],
    [{ portraitMinutes: 0 }, 'portraitMinutes'],
    [{ portraitMinutes: undefined }, 'portraitMinutes'],
    [{ setupMinutes: 121 }, 'setupMinutes'],
    [{ timeZone: '+01:00' }, 'timeZone'],
    [{ date: '2026-02-30' }, 'date'],
    [{ latitude: 91 }, 'latitude'],
    [{ placement: 'noon' }, 'placement'],
    [{ placement: 2 }, 'placement'],
    [{ lightStands: 11 }, 'lightStands'],
    [{ lightStands: 1.5 }, 'lightStands'],
    [{ lightStands: -1 }, 'lightStands'],
    [{ conditions: 'windy' }, 'conditions'],
    [{ conditions: null }, 'conditions'],
    [{ conditions: { windKmh: 401 } }, 'conditions.windKmh'],
    [{ conditions: { windKmh: -1 } }, 'conditions.windKmh'],
    [{ conditions: { windKmh: '20' } }, 'conditions.windKmh'],
    [{ conditions: { nearRoad: 'yes' } }, 'conditions.nearRoad'],
    [{ conditions: { modellingLamps: 1 } }, 'conditions.modellingLamps'],
  ])('%j → %s', (over, field) => {
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, ...over })).toBe(field);
  });

  it('takes 30 events, the edges of the ranges, and no events at all', () => {
    expect(fieldOf({ ...TERRACE, portraitMinutes: 240, setupMinutes: 120 })).toBeNull();
    expect(fieldOf({ ...TERRACE, portraitMinutes: 1, setupMinutes: 0, events: [] })).toBeNull();
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, lightStands: 0 })).toBeNull();
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, lightStands: 10 })).toBeNull();
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, conditions: { windKmh: 0 } })).toBeNull();
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, conditions: { windKmh: 400 } })).toBeNull();
    const hhmm = (min: number) =>
      `${String(Math.floor(min / 60)).padStart(2, '0')}:${String(min % 60).padStart(2, '0')}`;
    // 30 back-to-back 20-minute events from 10:00.
    const thirty = Array.from({ length: 30 }, (_, i) => ({
      label: `Event ${i}`,
      start: hhmm(600 + 20 * i),
      end: hhmm(620 + 20 * i),
    }));
    expect(fieldOf({ ...TERRACE, portraitMinutes: 20, events: thirty })).toBeNull();
  });
});

describe('planEveningTimeline: where the session sits in its stretch (placement)', () => {
  // Interval arithmetic on the planner's own blue hour (common practice, no source), and the
  // blue hour itself against astronomy-engine 2.1.19 [LIB] within 30 s, as above.
  const ref = astro(TERRACE, Date.UTC(2026, 5, 19, 23));
  const base = plan({});
  const bs = at(base.twilight.blueHour.start);
  const be = at(base.twilight.blueHour.end);
  const mid = (bs + be) / 2;
  const placed = (placement: (typeof SESSION_PLACEMENTS)[number], over = {}) =>
    plan({ placement, ...over });

  it('defaults to the earliest, as the planner always placed it, and says so', () => {
    expect(DEFAULT_PLACEMENT).toBe('earliest');
    expect(base.placement).toBe('earliest');
    expect(placed('earliest').slots).toEqual(base.slots);
    expect(placed('earliest').timeline).toEqual(base.timeline);
  });

  it('earliest: the session starts with the blue hour (astronomy-engine’s -4° crossing)', () => {
    const s = placed('earliest').slots[0]!;
    expect(at(s.session.start)).toBe(bs);
    expect(Math.abs(at(s.session.start) - ref.blueStart!)).toBeLessThan(30_000);
  });

  it('latest: the session ends with the blue hour (the -8° crossing), set-up 10 min before it', () => {
    const r = placed('latest');
    const s = r.slots[0]!;
    expect(r.placement).toBe('latest');
    expect(at(s.session.end)).toBe(be);
    expect(at(s.session.start)).toBe(be - 20 * MIN);
    expect(at(s.setupFrom)).toBe(be - 30 * MIN);
    expect(Math.abs(at(s.session.end) - ref.blueEnd!)).toBeLessThan(30_000);
    expect(s.blueHourMinutes).toBe(20);
    // The merged timeline follows the slot.
    const session = r.timeline.find((e) => e.kind === 'portraits')!;
    expect(session.start).toBe(s.session.start);
    expect(r.timeline.find((e) => e.kind === 'set-up')!.start).toBe(s.setupFrom);
  });

  it('mid-blue-hour: the session is centred on the blue hour’s middle (to the second)', () => {
    const s = placed('mid-blue-hour').slots[0]!;
    const centre = (at(s.session.start) + at(s.session.end)) / 2;
    // ISO times carry whole seconds: the centre is the middle to within a second.
    expect(Math.abs(centre - mid)).toBeLessThanOrEqual(1000);
    expect(Math.abs(centre - (ref.blueStart! + ref.blueEnd!) / 2)).toBeLessThan(30_000);
    expect(at(s.session.end) - at(s.session.start)).toBe(20 * MIN);
    expect(at(s.session.start) - at(s.setupFrom)).toBe(10 * MIN);
  });

  it('a session longer than the blue hour fills the stretch whatever the placement', () => {
    const blueMin = (be - bs) / MIN;
    expect(blueMin).toBeLessThan(60);
    for (const placement of SESSION_PLACEMENTS) {
      const s = placed(placement, { portraitMinutes: 60 }).slots[0]!;
      expect([at(s.session.start), at(s.session.end)]).toEqual([bs, be]);
      expect(s.fitsWantedLength).toBe(false);
    }
  });

  it('an event where the placement aims moves the session into the free stretch, clear of it and its set-up', () => {
    // Toasts over the blue hour's last 10 minutes: the latest session ends where they start.
    const toasts = { label: 'Toasts', start: z(be - 10 * MIN), end: z(be + 20 * MIN) };
    const late = placed('latest', { events: [toasts] }).slots[0]!;
    expect(at(late.session.end)).toBe(be - 10 * MIN);
    expect(at(late.session.start)).toBe(be - 30 * MIN);
    // Cake cut across the middle (`cut`: the middle to the whole second, as answers carry whole
    // seconds), 5 min of set-up: two stretches [bs, cut-3] and [cut+3+5, be].
    const cut = Math.floor((bs + be) / 2000) * 1000;
    const cake = { label: 'Cake', start: z(cut - 3 * MIN), end: z(cut + 3 * MIN) };
    const r = placed('mid-blue-hour', { events: [cake], portraitMinutes: 5, setupMinutes: 5 });
    expect(cut - 3 * MIN - bs).toBeGreaterThan(5 * MIN); // both stretches hold the 5 minutes
    expect(be - (cut + 8 * MIN)).toBeGreaterThan(5 * MIN);
    const [first, second] = r.slots;
    // Each aims at the middle and is pushed back into its stretch: the first ends at the cake,
    // the second starts when the set-up after it is done; equal blue minutes and length, so the
    // one nearer the middle ranks first (the first: its centre 5.5 min off, the other's 10.5).
    expect([at(first!.session.start), at(first!.session.end)]).toEqual([
      cut - 8 * MIN,
      cut - 3 * MIN,
    ]);
    expect([at(second!.session.start), at(second!.session.end)]).toEqual([
      cut + 8 * MIN,
      cut + 13 * MIN,
    ]);
    expect(at(second!.setupFrom)).toBe(cut + 3 * MIN);
  });

  it('breaks ties between equal stretches the placement’s way', () => {
    // An 8-minute dinner course early in the blue hour: two stretches that both hold a 5-minute
    // session entirely in the blue hour (equal blue minutes, equal length).
    expect((mid - bs) / MIN).toBeGreaterThan(14 + 2.5);
    const course = { label: 'Course', start: z(bs + 6 * MIN), end: z(bs + 14 * MIN) };
    const over = { events: [course], portraitMinutes: 5, setupMinutes: 0 };
    const earliest = placed('earliest', over).slots;
    const latest = placed('latest', over).slots;
    const centred = placed('mid-blue-hour', over).slots;
    expect(earliest.map((s) => at(s.session.start))).toEqual([bs, bs + 14 * MIN]);
    expect(latest.map((s) => at(s.session.end))).toEqual([be, bs + 6 * MIN]);
    // The middle lies in the later stretch, far enough in for the session to centre on it; the
    // earlier stretch's session ends at the course (its centre more than 14 minutes off).
    expect(at(centred[0]!.session.start)).toBeGreaterThan(bs + 14 * MIN);
    expect(
      Math.abs((at(centred[0]!.session.start) + at(centred[0]!.session.end)) / 2 - mid),
    ).toBeLessThanOrEqual(1000);
    expect(at(centred[1]!.session.end)).toBe(bs + 6 * MIN);
  });

  it('white night (60.17° N): latest ends at civil dusk, the window’s end in the blue band', () => {
    const place = { latitude: 60.1699, longitude: 24.9384 };
    const input = {
      ...place,
      date: '2026-06-21',
      timeZone: 'Europe/Helsinki',
      portraitMinutes: 10,
    };
    const r = planEveningTimeline({ ...input, placement: 'latest' });
    // astronomy-engine [LIB]: civil dusk (-6°) within 60 s, as in the white-night test above.
    const a = astro(place, Date.UTC(2026, 5, 20, 21));
    expect(r.window.basis).toBe('sunset-to-civil-dusk');
    const s = r.slots[0]!;
    expect(s.session.end).toBe(r.twilight.civilDusk);
    expect(Math.abs(at(s.session.end) - a.civilDusk!)).toBeLessThan(60_000);
    expect(s.blueHourMinutes).toBe(10);
    // Centred: on the middle of blue-hour start to civil dusk.
    const c = planEveningTimeline({ ...input, placement: 'mid-blue-hour' }).slots[0]!;
    const part = (at(r.twilight.blueHour.start) + at(r.twilight.civilDusk)) / 2;
    expect(Math.abs((at(c.session.start) + at(c.session.end)) / 2 - part)).toBeLessThanOrEqual(
      1000,
    );
  });
});

describe('planEveningTimeline: safety cautions', () => {
  const ids = (r: { cautions: { id: string }[] }) => r.cautions.map((c) => c.id);

  it('always carries the cautions for working in the dark, and a key and backlight on stands by default', () => {
    const r = plan({});
    // Default stands: key + backlight (common practice, no source).
    expect(DEFAULT_LIGHT_STANDS).toBe(2);
    expect(r.lightStands).toBe(2);
    expect(ids(r)).toEqual(['stands-wind', 'batteries', 'dark-footing']);
    // Without a forecast the wind caution asks to check one.
    expect(r.cautions[0]!.text).toMatch(/Check the forecast for gusts/);
    // Every caution stands alone and defers to local codes, venue rules and the makers.
    for (const c of r.cautions) expect(c.text.endsWith(CAUTION_DEFERENCE)).toBe(true);
  });

  it('no stands, no stand caution; the dark ones stay', () => {
    expect(ids(plan({ lightStands: 0 }))).toEqual(['batteries', 'dark-footing']);
  });

  it('adds one caution per condition, in the setup’s order, with the wind strike threshold', () => {
    const r = plan({
      conditions: {
        windKmh: 35,
        nearRoad: true,
        nearWater: true,
        coldFogOrHaze: true,
        modellingLamps: true,
      },
    });
    expect(ids(r)).toEqual([
      'stands-wind',
      'roads-at-night',
      'water-at-night',
      'cold-fog-haze',
      'hot-lamps',
      'batteries',
      'dark-footing',
    ]);
    // 35 km/h is above the strike threshold (30 km/h, common practice, no source).
    expect(35).toBeGreaterThanOrEqual(WIND_STRIKE_KMH);
    expect(r.cautions[0]!.text).toMatch(/lower or strike softboxes/);
    expect(plan({ conditions: { windKmh: 12 } }).cautions[0]!.text).not.toMatch(/strike/);
  });

  it('matches what /v1/setup’s planner says for the same conditions and a key plus rim light', () => {
    const conditions = { windKmh: 24, nearWater: true, coldFogOrHaze: true };
    const setup = planDuskSetup({
      ...TERRACE,
      key: { guideNumber: 60, distance: 2.5 },
      rim: { guideNumber: 45, distanceBehind: 3, lightHeight: 2 },
      conditions,
    });
    expect(plan({ conditions }).cautions).toEqual(setup.cautions);
  });

  it('gives the cautions even when the evening has no window (polar day)', () => {
    // The same polar-day evening as above (suncalc: alwaysUp there on that date).
    const r = planEveningTimeline({
      ...POLAR_DAY,
      portraitMinutes: 20,
      conditions: { nearWater: true },
    });
    expect(r.slots).toEqual([]);
    expect(ids(r)).toContain('water-at-night');
  });
});
