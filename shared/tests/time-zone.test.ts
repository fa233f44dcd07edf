/**
 * Time zones: the zone's name as the runtime's copy of the IANA tz database spells it, refusals
 * of fixed offsets, and the warning when a zone is far from the place's solar time.
 *
 * Outside sources: UTC offsets come from the IANA tz database through Intl (read here with
 * `timeZoneName: 'longOffset'`, independently of the library's own offset code); mean solar time
 * runs 15° of longitude per hour ([DER] 360° / 24 h); the principal locations of zones are from
 * the IANA tz database's zone1970.tab (rows quoted beside the cases); other places' coordinates
 * are from memory.
 */
import { describe, expect, it } from 'vitest';
import {
  LightingInputError,
  ZONE_SOLAR_MISMATCH_HOURS,
  computeTwilight,
  planDuskSetup,
} from '../src/index.js';

/** UTC offset in hours of `timeZone` at noon UTC on `date`, via Intl ("GMT+05:30" → 5.5). */
function intlOffsetHours(timeZone: string, date: string): number {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(new Date(`${date}T12:00:00Z`))
    .find((p) => p.type === 'timeZoneName')?.value as string;
  const m = /GMT(?:([+-])(\d{2}):(\d{2}))?/.exec(name);
  if (!m?.[1]) return 0;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) + Number(m[3]) / 60);
}

/** Zone offset minus solar offset (longitude / 15 h), wrapped into -12..12 h. */
function solarGapHours(timeZone: string, date: string, longitude: number): number {
  const raw = intlOffsetHours(timeZone, date) - longitude / 15;
  return ((((raw + 12) % 24) + 24) % 24) - 12;
}

const codes = (ws: Array<{ code: string }>) => ws.map((w) => w.code);

function refusal(fn: () => unknown): LightingInputError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(LightingInputError);
    return e as LightingInputError;
  }
  throw new Error('did not throw');
}

const SETUP_KEY = { guideNumber: 60, distance: 2.5 };

describe('a zone far from the place’s solar time is warned about', () => {
  it('Alps coordinates with a Pacific-coast zone: warned, with the real offsets in the message', () => {
    const input = {
      latitude: 47,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'America/Los_Angeles',
    };
    // IANA tz database via Intl: Los Angeles keeps UTC-7 (summer time) on 2026-06-21.
    expect(intlOffsetHours(input.timeZone, input.date)).toBe(-7);
    // [DER] 8° E is 8/15 = 0.53 h ahead of UTC in mean solar time: 7.53 h from the zone.
    expect(Math.abs(solarGapHours(input.timeZone, input.date, 8))).toBeCloseTo(7.53, 2);
    const out = computeTwilight(input);
    expect(codes(out.warnings)).toEqual(['time-zone-mismatch']);
    const msg = out.warnings[0]?.message ?? '';
    expect(msg).toContain('America/Los_Angeles is UTC\u221207:00 on 2026-06-21');
    expect(msg).toContain('7.5 h behind');
    expect(msg).toContain('about UTC+00:32'); // [DER] 8 × 4 min = 32 min
    // On a UTC-7 clock, the sun's noon at 8° E (about 11:30 UTC) reads about 04:30 ([DER]).
    expect(out.solarNoon.slice(11, 13)).toBe('04');
    expect(msg).toContain(`solar noon comes at 04:`);
  });

  it('the same place with its own zone (Europe/Zurich) is not warned about', () => {
    // IANA via Intl: UTC+2 in June; solar +0.53 h: 1.47 h apart [DER].
    expect(solarGapHours('Europe/Zurich', '2026-06-21', 8)).toBeCloseTo(1.47, 2);
    const out = computeTwilight({
      latitude: 47,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'Europe/Zurich',
    });
    expect(out.warnings).toEqual([]);
  });

  it('the dusk setup plan passes the warning through, in plan.warnings and plan.twilight', () => {
    const bad = planDuskSetup({
      latitude: 47,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'America/Los_Angeles',
      key: SETUP_KEY,
    });
    expect(codes(bad.warnings)).toContain('time-zone-mismatch');
    expect(codes(bad.twilight.warnings)).toEqual(['time-zone-mismatch']);
    const good = planDuskSetup({
      latitude: 47,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'Europe/Zurich',
      key: SETUP_KEY,
    });
    expect(codes(good.warnings)).not.toContain('time-zone-mismatch');
    expect(good.twilight.warnings).toEqual([]);
  });

  // Real places whose legal time is legitimately 1-3 h off their solar time: none may warn.
  // Offsets: IANA tz database via Intl. Coordinates: IANA zone1970.tab where the zone is named
  // for the place, otherwise from memory.
  const REAL: Array<{
    place: string;
    lat: number;
    lon: number;
    tz: string;
    date: string;
    /** Least |gap| (h) expected, to show the case really is far from solar time. */
    atLeast: number;
  }> = [
    // Xinjiang on Beijing time (zone1970.tab: Asia/Urumqi +4348+08735; Kashgar from memory).
    {
      place: 'Urumqi',
      lat: 43.8,
      lon: 87.583,
      tz: 'Asia/Shanghai',
      date: '2026-06-21',
      atLeast: 2,
    },
    {
      place: 'Kashgar',
      lat: 39.47,
      lon: 75.99,
      tz: 'Asia/Shanghai',
      date: '2026-12-21',
      atLeast: 2.8,
    },
    // zone1970.tab: Europe/Madrid +4024-00341.
    {
      place: 'Madrid',
      lat: 40.4,
      lon: -3.683,
      tz: 'Europe/Madrid',
      date: '2026-06-21',
      atLeast: 2,
    },
    // Galicia on Central European summer time (from memory: 42.9° N 8.5° W).
    {
      place: 'Galicia',
      lat: 42.88,
      lon: -8.54,
      tz: 'Europe/Madrid',
      date: '2026-07-01',
      atLeast: 2.5,
    },
    // zone1970.tab: America/Argentina/Mendoza -3253-06849.
    {
      place: 'Mendoza',
      lat: -32.883,
      lon: -68.817,
      tz: 'America/Argentina/Mendoza',
      date: '2026-06-21',
      atLeast: 1.5,
    },
    // zone1970.tab: Pacific/Kiritimati +0152-15720 — UTC+14 at 157° W, across the date line.
    {
      place: 'Kiritimati',
      lat: 1.867,
      lon: -157.333,
      tz: 'Pacific/Kiritimati',
      date: '2026-06-21',
      atLeast: 0.4,
    },
    // zone1970.tab: Pacific/Apia -1350-17144 (UTC+13 at 171.7° W).
    {
      place: 'Apia',
      lat: -13.833,
      lon: -171.733,
      tz: 'Pacific/Apia',
      date: '2026-01-10',
      atLeast: 0.4,
    },
    // zone1970.tab: Pacific/Tongatapu -210800-1751200 (UTC+13 at 175.2° W).
    {
      place: 'Nuku\u02bbalofa',
      lat: -21.133,
      lon: -175.2,
      tz: 'Pacific/Tongatapu',
      date: '2026-06-21',
      atLeast: 0.6,
    },
    // zone1970.tab: America/Nome +643004-1652423, Alaska summer time UTC-8 at 165.4° W.
    {
      place: 'Nome',
      lat: 64.501,
      lon: -165.406,
      tz: 'America/Nome',
      date: '2026-06-21',
      atLeast: 3,
    },
    // zone1970.tab: America/Adak +515248-1763929.
    {
      place: 'Adak',
      lat: 51.88,
      lon: -176.658,
      tz: 'America/Adak',
      date: '2026-07-15',
      atLeast: 2.7,
    },
    // zone1970.tab: America/Inuvik +682059-1334300, Mountain summer time UTC-6 at 133.7° W
    // (September: midnight sun over, so the evening has a sunset).
    {
      place: 'Inuvik',
      lat: 68.35,
      lon: -133.717,
      tz: 'America/Inuvik',
      date: '2026-09-15',
      atLeast: 2.8,
    },
    // zone1970.tab: America/Nuuk +6411-05144.
    {
      place: 'Nuuk',
      lat: 64.183,
      lon: -51.733,
      tz: 'America/Nuuk',
      date: '2026-07-15',
      atLeast: 2.4,
    },
    // zone1970.tab: Asia/Kolkata +2232+08822.
    {
      place: 'Kolkata',
      lat: 22.533,
      lon: 88.367,
      tz: 'Asia/Kolkata',
      date: '2026-03-20',
      atLeast: 0,
    },
  ];
  for (const c of REAL) {
    it(`${c.place} with ${c.tz} on ${c.date} is not warned about`, () => {
      const gap = Math.abs(solarGapHours(c.tz, c.date, c.lon));
      expect(gap).toBeGreaterThanOrEqual(c.atLeast);
      expect(gap).toBeLessThan(ZONE_SOLAR_MISMATCH_HOURS);
      const out = computeTwilight({
        latitude: c.lat,
        longitude: c.lon,
        date: c.date,
        timeZone: c.tz,
      });
      expect(out.warnings).toEqual([]);
      expect(out.sunset).not.toBeNull();
    });
  }

  it('the difference is taken round the clock at the date line', () => {
    // Kiritimati: IANA via Intl gives UTC+14; solar time at 157.33° W is UTC-10.49 h [DER]. The
    // raw difference is 24.49 h, a whole day plus 0.49 h: the clock keeps the sun's hours.
    expect(intlOffsetHours('Pacific/Kiritimati', '2026-06-21')).toBe(14);
    expect(solarGapHours('Pacific/Kiritimati', '2026-06-21', -157.333)).toBeCloseTo(0.49, 2);
    const kiritimati = { latitude: 1.867, longitude: -157.333, date: '2026-06-21' };
    // Solar noon on the UTC+14 clock comes near 12:30 ([DER] 12:00 + 0.49 h, ± equation of time).
    const own = computeTwilight({ ...kiritimati, timeZone: 'Pacific/Kiritimati' });
    expect(own.solarNoon.slice(11, 13)).toBe('12');
    // The same place on UTC+9 (IANA via Intl: Asia/Tokyo): raw difference 19.49 h, i.e. 4.51 h
    // behind the sun round the clock [DER]: warned, though the raw figure is under 24.
    expect(solarGapHours('Asia/Tokyo', '2026-06-21', -157.333)).toBeCloseTo(-4.51, 2);
    const tokyo = computeTwilight({ ...kiritimati, timeZone: 'Asia/Tokyo' });
    expect(codes(tokyo.warnings)).toEqual(['time-zone-mismatch']);
    expect(tokyo.warnings[0]?.message).toContain('4.5 h behind');
    // A zone half a day off (Alps on New Zealand winter time, UTC+12 via Intl) is warned about.
    expect(intlOffsetHours('Pacific/Auckland', '2026-06-21')).toBe(12);
    const nz = computeTwilight({
      latitude: 47,
      longitude: 8,
      date: '2026-06-21',
      timeZone: 'Pacific/Auckland',
    });
    expect(codes(nz.warnings)).toEqual(['time-zone-mismatch']);
    expect(nz.warnings[0]?.message).toContain('11.5 h ahead of');
  });

  it('the threshold sits at 3.5 h either side of solar time (UTC against a longitude)', () => {
    // Etc/UTC is UTC+0 all year (IANA via Intl). [DER] 51° is 3.4 h, 54° is 3.6 h of solar time.
    const at = (longitude: number) =>
      codes(
        computeTwilight({ latitude: 20, longitude, date: '2026-03-20', timeZone: 'Etc/UTC' })
          .warnings,
      );
    expect(at(51)).toEqual([]);
    expect(at(-51)).toEqual([]);
    expect(at(54)).toEqual(['time-zone-mismatch']);
    expect(at(-54)).toEqual(['time-zone-mismatch']);
  });
});

describe('the zone comes back spelled as the tz database spells it', () => {
  const at = (timeZone: string) =>
    computeTwilight({ latitude: 47.37, longitude: 8.54, date: '2026-06-21', timeZone });

  it('a mis-cased name answers with the canonical spelling Intl reports', () => {
    // IANA tz database via Intl: resolvedOptions() spells the zone "Europe/Zurich".
    const canonical = new Intl.DateTimeFormat('en-US', {
      timeZone: 'europe/zurich',
    }).resolvedOptions().timeZone;
    expect(canonical).toBe('Europe/Zurich');
    expect(at('europe/zurich').timeZone).toBe('Europe/Zurich');
    expect(at('EUROPE/ZURICH').timeZone).toBe('Europe/Zurich');
    expect(at('Europe/Zurich').timeZone).toBe('Europe/Zurich');
    // The times themselves are the same zone's (UTC+2 in June via Intl).
    expect(at('europe/zurich').sunset).toBe(at('Europe/Zurich').sunset);
    expect(at('europe/zurich').sunset?.endsWith('+02:00')).toBe(true);
  });

  it('the setup plan answers with the canonical spelling too', () => {
    const plan = planDuskSetup({
      latitude: 47.37,
      longitude: 8.54,
      date: '2026-06-21',
      timeZone: 'europe/zurich',
      key: SETUP_KEY,
    });
    expect(plan.twilight.timeZone).toBe('Europe/Zurich');
  });

  it('a current IANA name is kept even where Intl reports an older link for it', () => {
    // zone1970.tab lists Asia/Kolkata and Europe/Kyiv; some Intl builds report the backward links
    // Asia/Calcutta and Europe/Kiev for them. The caller's current name is what comes back.
    expect(at('Asia/Kolkata').timeZone).toBe('Asia/Kolkata');
    expect(at('Europe/Kyiv').timeZone).toBe('Europe/Kyiv');
    // A mis-cased one takes Intl's spelling: a zone with the same offsets (IANA via Intl).
    const fixed = at('asia/kolkata').timeZone;
    expect(fixed).toBe(
      new Intl.DateTimeFormat('en-US', { timeZone: 'Asia/Kolkata' }).resolvedOptions().timeZone,
    );
    expect(/^[A-Z]/.test(fixed)).toBe(true);
    expect(intlOffsetHours(fixed, '2026-06-21')).toBe(5.5);
  });
});

describe('fixed offsets and unknown names are refused, asking for an IANA name', () => {
  const base = { latitude: 47.37, longitude: 8.54, date: '2026-06-21' };
  for (const offset of ['+02:00', '-05:30', '+0200', 'UTC+2', 'GMT-03:00']) {
    it(`"${offset}" is refused naming timeZone, with an example zone name`, () => {
      const e = refusal(() => computeTwilight({ ...base, timeZone: offset }));
      expect(e.field).toBe('timeZone');
      expect(e.reason).toContain('is a UTC offset');
      expect(e.reason).toContain('IANA time zone name such as Europe/Zurich');
    });
  }

  it('an unknown name and a non-string are refused with the same example', () => {
    const unknown = refusal(() => computeTwilight({ ...base, timeZone: 'Mars/Olympus_Mons' }));
    expect(unknown.field).toBe('timeZone');
    expect(unknown.reason).toContain('"Mars/Olympus_Mons" is not a known time zone');
    expect(unknown.reason).toContain('such as Europe/Zurich');
    const missing = refusal(() => computeTwilight({ ...base, timeZone: 2 as never }));
    expect(missing.reason).toBe('must be an IANA time zone name such as Europe/Zurich');
  });

  it('the setup refuses an offset naming timeZone', () => {
    const e = refusal(() => planDuskSetup({ ...base, timeZone: '+02:00', key: SETUP_KEY }));
    expect(e.field).toBe('timeZone');
    expect(e.reason).toContain('such as Europe/Zurich');
  });
});
