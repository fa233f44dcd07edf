// Two invented saved setups for the demo studio: an engagement session on a lakeside terrace
// (gear named by id) and a winter jetty session (values inline). Places, people and the town
// are invented; the dates are fixed so the seeded plans never change.
export const DEMO_VENUE = 'Boathouse terrace, Tallowmere Water, Quillby-on-Wend';

interface DemoSetup {
  name: string;
  venue: string;
  notes: string;
  /** The inputs, given the ids the demo gear got when seeded. */
  inputs: (ids: DemoGearIds) => Record<string, unknown>;
}

export interface DemoGearIds {
  keyLight: string;
  rimLight: string;
  octa: string;
  grid: string;
  gelKit: string;
}

const PLACE = { latitude: 54.21, longitude: -2.47, timeZone: 'Europe/London', elevation: 120 };

export const DEMO_SETUPS: DemoSetup[] = [
  {
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
  },
  {
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
  },
];
