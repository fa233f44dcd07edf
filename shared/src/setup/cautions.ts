/**
 * Safety cautions for a dusk flash shoot. General good practice only: every caution defers to
 * local codes, venue rules, permits and licensed practice.
 */
import { maybeNumber, optionalBoolean, requireObject } from '../units/validate.js';

export interface Caution {
  id: string;
  title: string;
  text: string;
}

export interface CautionConditions {
  windKmh?: number;
  nearRoad: boolean;
  nearWater: boolean;
  coldFogOrHaze: boolean;
  modellingLamps: boolean;
  standsCount: number;
}

/** Site conditions as a request states them (every field optional, flags default false). */
export interface SiteConditionsInput {
  /** Forecast wind, km/h, 0..400. */
  windKmh?: number;
  nearRoad?: boolean;
  nearWater?: boolean;
  coldFogOrHaze?: boolean;
  modellingLamps?: boolean;
}

/** Forecast wind range the conditions take, km/h. */
export const WIND_KMH_RANGE = { min: 0, max: 400 } as const;

/**
 * Validate a request's optional `conditions` object (omitted = no flags, no wind given); a bad
 * value throws a LightingInputError naming it under `field` (`conditions.windKmh`).
 */
export function readSiteConditions(
  field: string,
  value: unknown,
): Omit<CautionConditions, 'standsCount'> {
  const c = value === undefined ? {} : requireObject(field, value);
  return {
    windKmh: maybeNumber(`${field}.windKmh`, c.windKmh, WIND_KMH_RANGE),
    nearRoad: optionalBoolean(`${field}.nearRoad`, c.nearRoad, false),
    nearWater: optionalBoolean(`${field}.nearWater`, c.nearWater, false),
    coldFogOrHaze: optionalBoolean(`${field}.coldFogOrHaze`, c.coldFogOrHaze, false),
    modellingLamps: optionalBoolean(`${field}.modellingLamps`, c.modellingLamps, false),
  };
}

const DEFER =
  ' Follow local codes, venue rules and permit conditions, and the instructions of the equipment maker; where they say more, they win.';

/** The sentence every caution ends with: local rules and the makers' instructions come first. */
export const CAUTION_DEFERENCE = DEFER.trim();

/**
 * A caution's own advice without the closing deference, for lists that state the deference once
 * (the console, the shot sheet). API answers keep it on every caution, so each stands alone.
 */
export function cautionAdvice(c: Caution): string {
  return c.text.endsWith(DEFER) ? c.text.slice(0, -DEFER.length) : c.text;
}

/** Gusts above this speed, km/h: take light stands and large modifiers down. Common practice, no source. */
export const WIND_STRIKE_KMH = 30;

function windText(windKmh: number | undefined): string {
  const base =
    'Weigh every stand with sandbags on the legs, keep a person on each tall stand or boom, and face large modifiers edge-on to the wind.';
  if (windKmh === undefined) return `${base} Check the forecast for gusts.`;
  return windKmh >= WIND_STRIKE_KMH
    ? `${base} Forecast wind ${windKmh} km/h is at or above ${WIND_STRIKE_KMH} km/h: lower or strike softboxes and umbrellas, or use handheld or ground-level lights.`
    : `${base} Forecast wind ${windKmh} km/h; gusts can be stronger near buildings and water.`;
}

/** The cautions that apply to a planned setup. */
export function cautionsFor(c: CautionConditions): Caution[] {
  const out: Caution[] = [];
  if (c.standsCount > 0) {
    out.push({
      id: 'stands-wind',
      title: 'Light stands in wind',
      text: windText(c.windKmh) + DEFER,
    });
  }
  if (c.nearRoad) {
    out.push({
      id: 'roads-at-night',
      title: 'Roads after dark',
      text:
        'Keep people, stands and cables off the carriageway; wear high-visibility clothing and use a spotter. Do not fire flashes toward oncoming drivers. Filming or staging on or beside a road may need a permit.' +
        DEFER,
    });
  }
  if (c.nearWater) {
    out.push({
      id: 'water-at-night',
      title: 'Water edges after dark',
      text:
        'Edges, rocks and jetties get slippery and hard to see as light fails: keep a torch, mark the edge, never back toward water while framing, and keep mains or battery packs away from water.' +
        DEFER,
    });
  }
  if (c.coldFogOrHaze) {
    out.push({
      id: 'cold-fog-haze',
      title: 'Cold aerosol fog and haze',
      text:
        'Cold fog from cryogenic or dry-ice sources can cause frostbite on contact and displaces oxygen in low, still areas; fog fluid leaves ground slippery; haze can trigger smoke detectors and fire alarms. Get the venue\u2019s written permission and ventilate.' +
        DEFER,
    });
  }
  if (c.modellingLamps) {
    out.push({
      id: 'hot-lamps',
      title: 'Hot modelling lamps',
      text:
        'Modelling lamps get hot enough to burn skin and scorch gels or fabric: keep gels off the lamp, let heads cool before packing, and keep them away from dry vegetation.' +
        DEFER,
    });
  }
  out.push({
    id: 'batteries',
    title: 'Batteries',
    text:
      'Carry lithium packs in protective cases, never use a swollen or damaged pack, keep them out of rain and away from heat, and follow transport rules for spares. Cold cuts capacity: keep spares warm.' +
      DEFER,
  });
  out.push({
    id: 'dark-footing',
    title: 'Footing and cables in the dark',
    text:
      'Tape or route cables and stand legs out of walkways and bring headlamps with a red setting so eyes stay adapted.' +
      DEFER,
  });
  return out;
}
