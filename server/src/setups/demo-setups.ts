// Two invented saved setups for the demo studio: an engagement session on a lakeside terrace
// (gear named by id) and a winter jetty session (values inline). Places, people and the town
// are invented; the dates are fixed so a definition always plans the same. Each has a version
// (demoSetupVersion): changing a definition here updates the demo row on the next seed, unless the
// studio edited it (setups.seeder.ts).
import { demoVersion } from '../database/seeds/demo-versions.js';

export const DEMO_VENUE = 'Boathouse terrace, Tallowmere Water, Quillby-on-Wend';

interface DemoSetup {
  /** Stable key of the item in demo_seed_rows (the name may change between versions). */
  key: string;
  name: string;
  venue: string;
  notes: string;
  /** The inputs, given the ids the demo gear got when seeded. */
  inputs: (ids: DemoGearIds) => Record<string, unknown>;
  /**
   * Versions (demoSetupVersion) of the definitions earlier seeders wrote, before rows were
   * recorded in demo_seed_rows: a row holding one of them exactly is the seeder's, and moves to
   * the current definition; a row by the same name holding anything else is the studio's own.
   */
  earlierVersions: string[];
}

export interface DemoGearIds {
  keyLight: string;
  rimLight: string;
  octa: string;
  grid: string;
  gelKit: string;
}

/**
 * What stands for each demo gear id in a version: ids differ between databases, versions must
 * not.
 */
export const GEAR_TOKENS: DemoGearIds = {
  keyLight: 'demo-gear:keyLight',
  rimLight: 'demo-gear:rimLight',
  octa: 'demo-gear:octa',
  grid: 'demo-gear:grid',
  gelKit: 'demo-gear:gelKit',
};

/** The fields of a saved setup a demo definition gives (what a version covers). */
export interface DemoSetupContent {
  name: string;
  venue: string | null;
  notes: string | null;
  inputs: Record<string, unknown>;
}

/** The version of a saved setup's content, with this database's demo gear ids as tokens. */
export function demoSetupVersion(content: DemoSetupContent, ids: DemoGearIds): string {
  const token = new Map(
    Object.entries(ids).map(([role, id]) => [id, GEAR_TOKENS[role as keyof DemoGearIds]]),
  );
  const inputs = JSON.parse(JSON.stringify(content.inputs), (_k, v: unknown) =>
    typeof v === 'string' ? (token.get(v) ?? v) : v,
  ) as unknown;
  return demoVersion({
    name: content.name,
    venue: content.venue,
    notes: content.notes,
    inputs,
  });
}

const PLACE = { latitude: 54.21, longitude: -2.47, timeZone: 'Europe/London', elevation: 120 };

export const DEMO_SETUPS: DemoSetup[] = [
  {
    key: 'terrace-engagement',
    name: 'Ines & Tobiah — engagement, lakeside terrace',
    venue: DEMO_VENUE,
    notes:
      'Couple arrives 19:15 for golden-hour frames first. Terrace rail on the water side; the boathouse lights come on at 20:00.',
    inputs: (g) => ({
      ...PLACE,
      date: '2026-09-12',
      sky: 'clear',
      // On a tripod at f/2.8, with the strobe well back: close in, even its lowest power would
      // be too much for the blue-hour ISO (the planner says so).
      camera: { aperture: 2.8, isoMax: 3200, support: 'tripod', kelvin: 3800 },
      key: { lightId: g.keyLight, modifierId: g.octa, distance: 4.5, angleFromCameraDeg: 50 },
      rim: { lightId: g.rimLight, modifierId: g.grid, distanceBehind: 3, lightHeight: 1.2 },
      gelKitId: g.gelKit,
      targetMiredOffset: 10,
      backgroundDistance: 16,
      conditions: { windKmh: 12, nearWater: true },
    }),
    earlierVersions: [
      // First seeded version: handheld at f/4 with the octa at 2.2 m.
      'af5b43269d38440696549a48e4f8eb30a848eefae4c324ee949c742ad32de9aa',
    ],
  },
  {
    key: 'winter-jetty',
    name: 'Marisol & Teodor — winter jetty session',
    venue: 'Old ferry jetty, Quillby-on-Wend',
    notes:
      'Cold haze machine on the shore side (venue permission on file). Short window: bring spare packs warm.',
    inputs: () => ({
      ...PLACE,
      date: '2026-12-05',
      sky: 'partly-cloudy',
      // The background may go down to 2 stops under (taste): once the key and rim reach their
      // lowest power the planner darkens the background instead, and the usable window runs to
      // 16:24 rather than 16:18.
      camera: { aperture: 2.8, isoMax: 6400, support: 'tripod', biasFloorStops: -2 },
      key: {
        guideNumber: 60,
        guideNumberUnit: 'm',
        distance: 4,
        modifier: 'softbox-double-diffusion',
        modifierLossStops: 2.5,
      },
      rim: { guideNumber: 36, distanceBehind: 2.5, lightHeight: 1, beamAngleDeg: 40 },
      backgroundDistance: 25,
      conditions: { windKmh: 24, nearWater: true, coldFogOrHaze: true },
    }),
    earlierVersions: [
      // First seeded version: a plain softbox (1.5 stops) at 2 m.
      'fe2fac26464ddb7b124dbad13b2a29b298381461c2a2bb9c3a03a55047dede8a',
      // Second: double diffusion at 4 m, background held at the fixed bias (no floor).
      '11a77ebca9d1b9dfcf46900c5540d65a7763eaec246cbad039b16d21b0d30601',
    ],
  },
];
