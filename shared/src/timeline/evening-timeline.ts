import {
  computeTwilight,
  readTwilightInput,
  type TimeWindow,
  type MissingReason,
} from '../twilight/compute-twilight.js';
import { LightingInputError } from '../errors.js';
import {
  cautionsFor,
  readSiteConditions,
  type Caution,
  type SiteConditionsInput,
} from '../setup/cautions.js';
import { round } from '../units/math.js';
import {
  clockOf,
  offsetMinutes,
  requireDate,
  requireInstant,
  toLocalIso,
  type CalendarDate,
} from '../units/time-zone.js';
import {
  optionalNumber,
  requireArray,
  requireNumber,
  requireObject,
  requireOneOf,
  requireString,
} from '../units/validate.js';
import type { CodedWarning, TimelineWarningCode } from '../warning-codes.js';

/** One booked event of the day (ceremony, speeches, dinner...). */
export interface BookedEvent {
  /** What it is, as the caller names it (1..80 characters). */
  label: string;
  /**
   * When it starts: a local wall-clock time `HH:MM` (24-hour) on the timeline's date, or an ISO
   * 8601 instant with `Z` or an offset (for an event after midnight, say).
   */
  start: string;
  /** When it ends, written the same ways; after `start`. */
  end: string;
}

export interface TimelineInput {
  /** Degrees, -90..90, north positive. */
  latitude: number;
  /** Degrees, -180..180, east positive. */
  longitude: number;
  /** Local calendar date, YYYY-MM-DD (1900-2100). */
  date: string;
  /** IANA time zone, e.g. `Europe/London`. */
  timeZone: string;
  /** The booked events, at most {@link MAX_EVENTS}; default none. */
  events?: BookedEvent[];
  /** Length wanted for the portrait session, minutes, 1..240. */
  portraitMinutes: number;
  /**
   * Minutes the crew needs to set up before the session, 0..120; default
   * {@link DEFAULT_SETUP_MINUTES}.
   */
  setupMinutes?: number;
  /**
   * Where the session goes in its free stretch: {@link DEFAULT_PLACEMENT} (as early in the blue
   * hour as the stretch allows), `latest` or `mid-blue-hour`.
   */
  placement?: SessionPlacement;
  /** Site conditions, as /v1/setup takes them; they add safety cautions. */
  conditions?: SiteConditionsInput;
  /** Light stands on site, 0..10; default {@link DEFAULT_LIGHT_STANDS}. */
  lightStands?: number;
}

/** Most events one timeline takes. */
export const MAX_EVENTS = 30;
/** Longest event label, characters. */
export const MAX_LABEL_LENGTH = 80;
/** Portrait session length range, minutes. */
export const PORTRAIT_MINUTES_RANGE = { min: 1, max: 240 } as const;
/** Set-up time range, minutes. */
export const SETUP_MINUTES_RANGE = { min: 0, max: 120 } as const;
/** Set-up time before the session when none is given (common practice, no source). */
export const DEFAULT_SETUP_MINUTES = 10;
/**
 * Where the session sits in its free stretch, inside the part of the window in the blue hour (the
 * whole window when the blue hour misses it), moved into the stretch when it does not fit there:
 * - `earliest`: it starts at that part's start (the session starts with the blue hour, or as soon
 *   after as the stretch lets it);
 * - `latest`: it ends at that part's end (as late in the blue hour as the stretch lets it);
 * - `mid-blue-hour`: it is centred on that part's middle.
 */
export const SESSION_PLACEMENTS = ['earliest', 'latest', 'mid-blue-hour'] as const;
export type SessionPlacement = (typeof SESSION_PLACEMENTS)[number];
/** Placement when none is given: the planner's behaviour before the choice existed. */
export const DEFAULT_PLACEMENT: SessionPlacement = 'earliest';
/** Light stands range. */
export const LIGHT_STANDS_RANGE = { min: 0, max: 10, integer: true } as const;
/**
 * Light stands assumed when none are given: a key and a backlight, one stand each (common
 * practice, no source).
 */
export const DEFAULT_LIGHT_STANDS = 2;
/** Free stretches shorter than this (minutes) are not offered as slots (common practice, no source). */
export const MIN_SLOT_MINUTES = 1;

/** The phases of the evening the timeline shows, from the twilight computation. */
export const TIMELINE_PHASES = [
  'golden-hour',
  'sunset',
  'blue-hour',
  'civil-dusk',
  'nautical-dusk',
] as const;
export type TimelinePhase = (typeof TIMELINE_PHASES)[number];

/** What an entry of the merged timeline is. */
export const TIMELINE_ENTRY_KINDS = ['phase', 'event', 'set-up', 'portraits'] as const;
export type TimelineEntryKind = (typeof TIMELINE_ENTRY_KINDS)[number];

/** Which stretch of sky the slots were looked for in. */
export const WINDOW_BASES = ['blue-hour', 'sunset-to-civil-dusk'] as const;
export type WindowBasis = (typeof WINDOW_BASES)[number];

/** One line of the merged timeline. */
export interface TimelineEntry {
  kind: TimelineEntryKind;
  /** The phase (`kind` phase), else null. */
  phase: TimelinePhase | null;
  /** Index of the booked event in the request (`kind` event), else null. */
  eventIndex: number | null;
  /** The event's label, or words for the phase, set-up or session. */
  label: string;
  /** ISO 8601 local time with offset. */
  start: string;
  /** End, ISO 8601 local time with offset; null for a moment (sunset, civil dusk...). */
  end: string | null;
}

/** A proposed portrait slot: a free stretch inside the window, and the session placed in it. */
export interface PortraitSlot {
  /**
   * 1 = best: most minutes of the wanted session in the blue hour, then longest, then by the
   * placement: the earliest session, the latest, or the one nearest the blue hour's middle.
   */
  rank: number;
  /** First minute of the stretch the session may start (set-up already done before it). */
  start: string;
  /** End of the stretch (the window's end or the next event's start). */
  end: string;
  /** Length of the stretch, minutes (0.1 min). */
  minutes: number;
  /** The crew starts setting up (session start minus set-up time; outside any event). */
  setupFrom: string;
  /** The wanted session, or as much of it as fits, placed as `placement` asks. */
  session: { start: string; end: string; minutes: number };
  /**
   * Minutes of the session inside the blue hour (0.1 min); when the sun turns before the blue
   * hour's lower edge (white nights), the minutes after the blue hour's start.
   */
  blueHourMinutes: number;
  /** Whether the whole wanted length fits. */
  fitsWantedLength: boolean;
}

export interface TimelineResult {
  date: string;
  timeZone: string;
  portraitMinutes: number;
  setupMinutes: number;
  placement: SessionPlacement;
  lightStands: number;
  /** The twilight phases the timeline uses (null with a reason when the sun does not get there). */
  twilight: {
    sunset: string | null;
    civilDusk: string | null;
    nauticalDusk: string | null;
    goldenHour: TimeWindow;
    blueHour: TimeWindow;
    reasons: Record<string, MissingReason>;
    notes: string[];
  };
  /** The stretch of sky the slots were looked for in; all null when there is none. */
  window: { basis: WindowBasis | null; start: string | null; end: string | null };
  /** Phases, booked events and the best slot's set-up and session, in time order. */
  timeline: TimelineEntry[];
  /** Proposed slots, best first. */
  slots: PortraitSlot[];
  /**
   * Safety cautions for the conditions and the stands (from {@link cautionsFor}, as /v1/setup
   * gives them); the ones for working in the dark are always there.
   */
  cautions: Caution[];
  warnings: CodedWarning<TimelineWarningCode>[];
}

const MIN = 60_000;
const HHMM = /^([01]\d|2[0-3]):([0-5]\d)$/;

/** The UTC instant of a local wall-clock time on `date` in `timeZone` (two-pass offset fix). */
function wallToEpoch(date: CalendarDate, minutes: number, timeZone: string): number {
  const wall = Date.UTC(date.year, date.month - 1, date.day, 0, minutes);
  const guess = wall - offsetMinutes(wall, timeZone) * MIN;
  return wall - offsetMinutes(guess, timeZone) * MIN;
}

interface Day {
  date: CalendarDate;
  timeZone: string;
  /** Local 00:00 on the date and 12:00 the next day: the span event times may fall in. */
  fromMs: number;
  untilMs: number;
}

function readTime(field: string, value: unknown, day: Day): number {
  const hm = typeof value === 'string' ? HHMM.exec(value) : null;
  if (hm) {
    const epoch = wallToEpoch(day.date, Number(hm[1]) * 60 + Number(hm[2]), day.timeZone);
    // A wall time the clocks skip (spring forward) has no instant: refuse it rather than move it.
    if (toLocalIso(epoch, day.timeZone).slice(11, 16) !== value) {
      throw new LightingInputError(
        field,
        `does not exist on ${day.date.year}-${String(day.date.month).padStart(2, '0')}-${String(day.date.day).padStart(2, '0')} in ${day.timeZone} (the clocks go forward then)`,
      );
    }
    return epoch;
  }
  if (typeof value !== 'string' || !value.includes('T')) {
    throw new LightingInputError(
      field,
      'must be a local time HH:MM (24-hour) or an ISO 8601 date-time with Z or an offset',
    );
  }
  const ms = requireInstant(field, value);
  if (ms < day.fromMs || ms > day.untilMs) {
    throw new LightingInputError(
      field,
      'must fall between 00:00 on the date and 12:00 the next day, local time',
    );
  }
  return ms;
}

interface Booked {
  index: number;
  label: string;
  startMs: number;
  endMs: number;
}

function readEvents(value: unknown, day: Day): Booked[] {
  if (value === undefined || value === null) return [];
  return requireArray('events', value, MAX_EVENTS).map((item, index) => {
    const field = `events[${index}]`;
    const o = requireObject(field, item);
    const label = requireString(`${field}.label`, o.label, MAX_LABEL_LENGTH);
    const startMs = readTime(`${field}.start`, o.start, day);
    const endMs = readTime(`${field}.end`, o.end, day);
    if (endMs <= startMs) throw new LightingInputError(`${field}.end`, 'must be after start');
    return { index, label, startMs, endMs };
  });
}

interface Params {
  latitude: number;
  longitude: number;
  date: string;
  timeZone: string;
  events: Booked[];
  portraitMinutes: number;
  setupMinutes: number;
  placement: SessionPlacement;
  conditions: ReturnType<typeof readSiteConditions>;
  lightStands: number;
}

/** Validate a {@link TimelineInput}; throws LightingInputError naming the field. */
export function readTimelineInput(input: unknown): Params {
  const o = requireObject('input', input);
  // The place, date and zone as the twilight computation reads them (same fields, same refusals).
  const { latitude, longitude, timeZone } = readTwilightInput({
    latitude: o.latitude,
    longitude: o.longitude,
    date: o.date,
    timeZone: o.timeZone,
  });
  const date = requireDate('date', o.date);
  const next = new Date(Date.UTC(date.year, date.month - 1, date.day + 1));
  const day: Day = {
    date,
    timeZone,
    fromMs: wallToEpoch(date, 0, timeZone),
    untilMs: wallToEpoch(
      { year: next.getUTCFullYear(), month: next.getUTCMonth() + 1, day: next.getUTCDate() },
      12 * 60,
      timeZone,
    ),
  };
  const events = readEvents(o.events, day);
  return {
    latitude,
    longitude,
    date: o.date as string,
    timeZone,
    events,
    portraitMinutes: requireNumber('portraitMinutes', o.portraitMinutes, PORTRAIT_MINUTES_RANGE),
    setupMinutes: optionalNumber(
      'setupMinutes',
      o.setupMinutes,
      DEFAULT_SETUP_MINUTES,
      SETUP_MINUTES_RANGE,
    ),
    placement: requireOneOf('placement', o.placement, SESSION_PLACEMENTS, DEFAULT_PLACEMENT),
    conditions: readSiteConditions('conditions', o.conditions),
    lightStands: optionalNumber(
      'lightStands',
      o.lightStands,
      DEFAULT_LIGHT_STANDS,
      LIGHT_STANDS_RANGE,
    ),
  };
}

/** A closed span of epoch ms. */
interface Span {
  start: number;
  end: number;
}

const overlap = (a: Span, b: Span): number =>
  Math.max(0, Math.min(a.end, b.end) - Math.max(a.start, b.start));

/**
 * The free gaps between the booked events (merged where they touch or overlap), from -∞ to +∞:
 * interval arithmetic (common practice, no source).
 */
export function freeGaps(busy: ReadonlyArray<Span>): Span[] {
  const sorted = [...busy].sort((a, b) => a.start - b.start);
  const gaps: Span[] = [];
  let from = -Infinity;
  for (const b of sorted) {
    if (b.start > from) gaps.push({ start: from, end: b.start });
    from = Math.max(from, b.end);
  }
  gaps.push({ start: from, end: Infinity });
  return gaps;
}

interface RawSlot {
  stretch: Span;
  session: Span;
  blueMs: number;
}

/**
 * Where a session of `len` ms wants to start for a placement, aiming at `target` (interval
 * arithmetic, common practice, no source); the caller moves it into the stretch.
 */
function wantedStart(placement: SessionPlacement, target: Span, len: number): number {
  if (placement === 'latest') return target.end - len;
  if (placement === 'mid-blue-hour') return Math.round((target.start + target.end - len) / 2);
  return target.start;
}

/** Equal slots (blue minutes, length) ordered as the placement prefers. */
function placementOrder(placement: SessionPlacement, target: Span) {
  const middle = (target.start + target.end) / 2;
  const offCentre = (s: Span) => Math.abs((s.start + s.end) / 2 - middle);
  if (placement === 'latest') return (a: RawSlot, b: RawSlot) => b.session.end - a.session.end;
  if (placement === 'mid-blue-hour') {
    return (a: RawSlot, b: RawSlot) =>
      offCentre(a.session) - offCentre(b.session) || a.session.start - b.session.start;
  }
  return (a: RawSlot, b: RawSlot) => a.session.start - b.session.start;
}

/**
 * The stretches of `window` where the session can run: inside a free gap, after the set-up time
 * that also has to fit in that gap (the crew may set up before the window opens). The session
 * (the wanted length, or the whole stretch if shorter) aims at `target` (the part of the window
 * in the blue hour, else the window) as `placement` says, moved into the stretch.
 */
function slotsIn(
  window: Span,
  gaps: Span[],
  setupMs: number,
  wantedMs: number,
  blue: Span | null,
  placement: SessionPlacement,
): RawSlot[] {
  const inWindow = blue && overlap(blue, window) > 0;
  const target = inWindow
    ? { start: Math.max(blue.start, window.start), end: Math.min(blue.end, window.end) }
    : window;
  const out: RawSlot[] = [];
  for (const g of gaps) {
    const stretch = {
      start: Math.max(g.start + setupMs, window.start),
      end: Math.min(g.end, window.end),
    };
    if (stretch.end - stretch.start < MIN_SLOT_MINUTES * MIN) continue;
    const len = Math.min(wantedMs, stretch.end - stretch.start);
    const want = wantedStart(placement, target, len);
    const start = Math.min(Math.max(want, stretch.start), stretch.end - len);
    const session = { start, end: start + len };
    out.push({ stretch, session, blueMs: blue ? overlap(session, blue) : 0 });
  }
  const tie = placementOrder(placement, target);
  return out.sort(
    (a, b) =>
      b.blueMs - a.blueMs ||
      b.session.end - b.session.start - (a.session.end - a.session.start) ||
      tie(a, b),
  );
}

const PHASE_LABELS: Record<TimelinePhase, string> = {
  'golden-hour': 'Golden hour',
  sunset: 'Sunset',
  'blue-hour': 'Blue hour',
  'civil-dusk': 'Civil dusk',
  'nautical-dusk': 'Nautical dusk',
};

const ms = (iso: string | null): number | null => (iso === null ? null : Date.parse(iso));
const span = (start: string | null, end: string | null): Span | null => {
  const s = ms(start);
  const e = ms(end);
  return s === null || e === null ? null : { start: s, end: e };
};
const minutesOf = (s: Span): number => round((s.end - s.start) / MIN, 1);

/**
 * The evening as a wedding or session timeline: the twilight phases (from
 * {@link computeTwilight}), the booked events merged with them in time order, and the proposed
 * portrait slots: free stretches that overlap no event (set-up time included) inside the blue
 * hour, or, when the blue hour is missing or fully booked, between sunset and civil dusk; ranked
 * by how many minutes of the wanted session fall in the blue hour. Polar day and night follow the
 * twilight computation: missing phases are null with a reason, and the answer warns.
 */
export function planEveningTimeline(input: TimelineInput): TimelineResult {
  const p = readTimelineInput(input);
  const tw = computeTwilight({
    latitude: p.latitude,
    longitude: p.longitude,
    date: p.date,
    timeZone: p.timeZone,
    stepMinutes: 60,
  });
  const iso = (t: number) => toLocalIso(t, p.timeZone);
  const clock = (t: number) => clockOf(iso(t));
  const warnings: CodedWarning<TimelineWarningCode>[] = [...tw.warnings];

  const blue = span(tw.blueHour.start, tw.blueHour.end);
  // White nights: the sun enters the blue band but turns before its lower edge, so the blue hour
  // has a start and no end; from that start on, the sky is in the band for the rest of the window.
  const openBlue =
    !blue && tw.blueHour.start !== null && tw.reasons['blueHour.end'] === 'sun-always-above'
      ? { start: Date.parse(tw.blueHour.start), end: Infinity }
      : null;
  const fallback = span(tw.sunset, tw.civilDusk);
  const gaps = freeGaps(p.events.map((e) => ({ start: e.startMs, end: e.endMs })));
  const setupMs = p.setupMinutes * MIN;
  const wantedMs = p.portraitMinutes * MIN;

  if (tw.reasons.sunset === 'sun-never-sets') {
    warnings.push({
      code: 'polar-day',
      message: `The sun does not set on ${p.date} here (polar day): no blue hour, no dusk.`,
    });
  } else if (tw.reasons.sunset === 'sun-never-rises') {
    warnings.push({
      code: 'polar-night',
      message: `The sun does not rise on ${p.date} here (polar night): the window, if any, is the twilight of the sun's midday low.`,
    });
  }

  let basis: WindowBasis | null = null;
  let window: Span | null = null;
  let raw: RawSlot[] = [];
  if (blue) {
    basis = 'blue-hour';
    window = blue;
    raw = slotsIn(blue, gaps, setupMs, wantedMs, blue, p.placement);
  }
  if (!raw.length && fallback) {
    const inFallback = slotsIn(fallback, gaps, setupMs, wantedMs, blue ?? openBlue, p.placement);
    if (inFallback.length || !window) {
      if (blue) {
        warnings.push({
          code: 'outside-blue-hour',
          message: `The blue hour (${clock(blue.start)}–${clock(blue.end)}) has no free stretch; slots are looked for between sunset and civil dusk.`,
        });
      } else if (openBlue) {
        warnings.push({
          code: 'outside-blue-hour',
          message: `The sun turns before the blue hour's lower edge (the blue hour starts at ${clock(openBlue.start)} and has no end); slots are looked for between sunset and civil dusk, as much as possible after ${clock(openBlue.start)}.`,
        });
      } else {
        warnings.push({
          code: 'outside-blue-hour',
          message: `No blue hour on this date (${tw.reasons['blueHour.start'] ?? tw.reasons['blueHour.end']}); slots are looked for between sunset and civil dusk.`,
        });
      }
      basis = 'sunset-to-civil-dusk';
      window = fallback;
      raw = inFallback;
    }
  }
  if (!window && !warnings.some((w) => w.code === 'polar-day' || w.code === 'polar-night')) {
    const why = tw.reasons.civilDusk ?? tw.reasons['blueHour.end'] ?? tw.reasons.sunset;
    warnings.push({
      code: 'no-window',
      message: `Neither a blue hour nor sunset to civil dusk on this date${why ? ` (${why})` : ''}.`,
    });
  }
  if (window && !raw.length) {
    warnings.push({
      code: 'no-free-stretch',
      message: `No free stretch of ${MIN_SLOT_MINUTES} minute or more in ${clock(window.start)}–${clock(window.end)} once the events and ${p.setupMinutes} minutes of set-up are placed.`,
    });
  }
  const best = raw[0];
  if (best && best.session.end - best.session.start < wantedMs) {
    warnings.push({
      code: 'shorter-than-wanted',
      message: `The longest free stretch is ${minutesOf(best.session)} minutes, shorter than the ${p.portraitMinutes} wanted.`,
    });
  }
  if (window) {
    for (const e of p.events) {
      if (overlap({ start: e.startMs, end: e.endMs }, window) > 0) {
        warnings.push({
          code: 'event-overlaps-window',
          message: `"${e.label}" (${clock(e.startMs)}–${clock(e.endMs)}) overlaps the window ${clock(window.start)}–${clock(window.end)}.`,
        });
      }
    }
  }

  const slots: PortraitSlot[] = raw.map((s, i) => ({
    rank: i + 1,
    start: iso(s.stretch.start),
    end: iso(s.stretch.end),
    minutes: minutesOf(s.stretch),
    setupFrom: iso(s.session.start - setupMs),
    session: {
      start: iso(s.session.start),
      end: iso(s.session.end),
      minutes: minutesOf(s.session),
    },
    blueHourMinutes: round(s.blueMs / MIN, 1),
    fitsWantedLength: s.session.end - s.session.start >= wantedMs,
  }));

  return {
    date: tw.date,
    timeZone: tw.timeZone,
    portraitMinutes: p.portraitMinutes,
    setupMinutes: p.setupMinutes,
    placement: p.placement,
    lightStands: p.lightStands,
    twilight: {
      sunset: tw.sunset,
      civilDusk: tw.civilDusk,
      nauticalDusk: tw.nauticalDusk,
      goldenHour: tw.goldenHour,
      blueHour: tw.blueHour,
      reasons: tw.reasons,
      notes: tw.notes,
    },
    window: {
      basis,
      start: window ? iso(window.start) : null,
      end: window ? iso(window.end) : null,
    },
    timeline: mergeTimeline(tw, p.events, best, setupMs, iso),
    slots,
    cautions: cautionsFor({ ...p.conditions, standsCount: p.lightStands }),
    warnings,
  };
}

type Twilight = ReturnType<typeof computeTwilight>;

/** Phases, events and the best slot's set-up and session, ordered by start (moments first). */
function mergeTimeline(
  tw: Twilight,
  events: Booked[],
  best: RawSlot | undefined,
  setupMs: number,
  iso: (t: number) => string,
): TimelineEntry[] {
  const rows: Array<{ at: number; until: number | null; order: number; entry: TimelineEntry }> = [];
  const phase = (
    name: TimelinePhase,
    start: string | null,
    end: string | null,
    moment: boolean,
  ) => {
    if (start === null || (!moment && end === null)) return;
    rows.push({
      at: Date.parse(start),
      until: moment ? null : Date.parse(end!),
      order: 0,
      entry: {
        kind: 'phase',
        phase: name,
        eventIndex: null,
        label: PHASE_LABELS[name],
        start,
        end: moment ? null : end,
      },
    });
  };
  phase('golden-hour', tw.goldenHour.start, tw.goldenHour.end, false);
  phase('sunset', tw.sunset, null, true);
  phase('blue-hour', tw.blueHour.start, tw.blueHour.end, false);
  phase('civil-dusk', tw.civilDusk, null, true);
  phase('nautical-dusk', tw.nauticalDusk, null, true);
  for (const e of events) {
    rows.push({
      at: e.startMs,
      until: e.endMs,
      order: 1,
      entry: {
        kind: 'event',
        phase: null,
        eventIndex: e.index,
        label: e.label,
        start: iso(e.startMs),
        end: iso(e.endMs),
      },
    });
  }
  if (best) {
    const setupStart = best.session.start - setupMs;
    if (setupMs > 0) {
      rows.push({
        at: setupStart,
        until: best.session.start,
        order: 2,
        entry: {
          kind: 'set-up',
          phase: null,
          eventIndex: null,
          label: 'Crew set-up',
          start: iso(setupStart),
          end: iso(best.session.start),
        },
      });
    }
    rows.push({
      at: best.session.start,
      until: best.session.end,
      order: 3,
      entry: {
        kind: 'portraits',
        phase: null,
        eventIndex: null,
        label: 'Portrait session',
        start: iso(best.session.start),
        end: iso(best.session.end),
      },
    });
  }
  return rows
    .sort(
      (a, b) =>
        a.at - b.at ||
        (a.until === null ? 0 : 1) - (b.until === null ? 0 : 1) ||
        a.order - b.order ||
        (a.entry.eventIndex ?? 0) - (b.entry.eventIndex ?? 0),
    )
    .map((r) => r.entry);
}
