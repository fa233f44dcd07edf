// Operation-level request examples for the compute routes, from the invented demo scenario: an
// evening engagement shoot by Harrowgate Lane Studio on a riverside terrace (51.5 N, 0.1 W) around
// the June solstice. The document builder attaches them to each POST /v1/<endpoint>;
// examples.spec.ts checks each against its request schema and runs it through the math.

export interface RequestExample {
  summary: string;
  description?: string;
  value: Record<string, unknown>;
}

const TERRACE = { latitude: 51.507, longitude: -0.1 };

/** The invented terrace wedding's evening (the timeline examples). */
const WEDDING = {
  ...TERRACE,
  date: '2026-06-20',
  timeZone: 'Europe/London',
  events: [
    { label: 'Ceremony', start: '16:00', end: '16:45' },
    { label: 'Dinner', start: '19:00', end: '21:15' },
    { label: 'Speeches', start: '21:15', end: '21:40' },
    { label: 'First dance', start: '22:20', end: '22:35' },
    { label: 'Late buffet', start: '23:30', end: '2026-06-21T00:30:00+01:00' },
  ],
  portraitMinutes: 20,
};

export const COMPUTE_EXAMPLES: Record<string, Record<string, RequestExample>> = {
  twilight: {
    riversideTerrace: {
      summary: 'Sunset, golden and blue hour on the terrace, midsummer',
      value: { ...TERRACE, date: '2026-06-20', timeZone: 'Europe/London' },
    },
  },
  exposure: {
    plainApex: {
      summary: 'Plain APEX: EV 9 metered, f/4 at ISO 400, solve the shutter',
      value: { ev100: 9, aperture: 4, iso: 400 },
    },
    backgroundAtDusk: {
      summary: 'Background mode: the terrace at 21:40, a stop under the sky, flash sync 1/200',
      description:
        'The ambient EV100 is estimated for the place and time; the solver picks ISO and shutter ' +
        'within the limits and warns about tripod, sync speed and subject motion.',
      value: {
        place: { ...TERRACE, time: '2026-06-20T21:40:00+01:00', sky: 'clear' },
        aperture: 4,
        biasStops: -1,
        support: 'handheld',
        flashSyncSeconds: 0.005,
      },
    },
  },
  flash: {
    keyThroughSoftbox: {
      summary: 'GN 60 m key at 3 m through a softbox, f/5.6 at ISO 200, with a half-CTO gel',
      value: {
        guideNumber: 60,
        guideNumberUnit: 'm',
        distance: 3,
        distanceUnit: 'm',
        aperture: 5.6,
        iso: 200,
        modifierLossStops: 1.5,
        gelLossStops: 0.67,
      },
    },
  },
  falloff: {
    subjectAndBackdrop: {
      summary: 'Couple at 2.5 m, river wall 9 m from the light',
      value: { subjectDistance: 2.5, backgroundDistance: 9, distanceUnit: 'm' },
    },
  },
  backlight: {
    rimOnAStand: {
      summary: 'Rim light 2 m up, 3 m behind the couple',
      value: { lightHeight: 2, distanceBehind: 3, distanceUnit: 'm' },
    },
  },
  balance: {
    warmTheFlash: {
      summary: 'Camera at 3800 K for a cool sky: gel a 5600 K flash to match',
      value: { cameraKelvin: 3800, flashKelvin: 5600 },
    },
  },
  timeline: {
    weddingEvening: {
      summary:
        'A terrace wedding: dinner, speeches and the first dance around a 20-minute portrait session',
      description:
        'Times as HH:MM on the date, or instants with an offset for events after midnight. The ' +
        'slots avoid every event and the 15 minutes of set-up before the session.',
      value: { ...WEDDING, setupMinutes: 15 },
    },
    lateByTheRiver: {
      summary: 'The same wedding, the session as late in the blue hour as it goes, by the river',
      description:
        'placement "latest" ends the session with the blue hour, or when the next event starts ' +
        '(here the first dance); the conditions, as /v1/setup takes them, add the wind and ' +
        'water cautions to the ones for working in the dark.',
      value: {
        ...WEDDING,
        placement: 'latest',
        conditions: { windKmh: 15, nearWater: true },
        lightStands: 2,
      },
    },
  },
  setup: {
    eveningPlan: {
      summary: 'The whole evening: key in a softbox, a rim light, the river behind',
      value: {
        ...TERRACE,
        date: '2026-06-20',
        timeZone: 'Europe/London',
        key: { guideNumber: 60, distance: 2.5, modifier: 'softbox' },
        rim: { guideNumber: 30, distanceBehind: 2.5, lightHeight: 2 },
        backgroundDistance: 12,
        conditions: { windKmh: 15, nearWater: true },
      },
    },
  },
};
