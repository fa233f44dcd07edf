// Invented evenings for the dusk setup's tests.
import type { DuskSetupInput } from '@lumenwright/shared';

/** An evening at 40.71° N planned minute by minute, with every usable minute listed (up to 10). */
export const EVENING_40N = {
  latitude: 40.7128,
  longitude: -74.006,
  date: '2026-09-20',
  timeZone: 'America/New_York',
  stepMinutes: 1,
  suggestions: 10,
} satisfies Partial<DuskSetupInput>;

// That evening with its usable minutes in two runs and a gap between (found with the shared
// planner): hand-held at f/2.8 from ISO 800 with the shutter held between sync (1/200 s) and a
// 1/160 s hand-held limit, a GN 20 m key 0.8 m away and a background floor of -6. At 19:15 the
// key is too strong at one bias and the next 1/3-stop step down is faster than sync;
// shared/tests/bias-floor.test.ts checks that minute with APEX and ISO 1230.
export const GAP_EVENING = {
  ...EVENING_40N,
  camera: {
    aperture: 2.8,
    isoMin: 800,
    isoMax: 25600,
    support: 'handheld',
    slowestHandheldSeconds: 1 / 160,
    flashSyncSeconds: 1 / 200,
    biasFloorStops: -6,
  },
  key: { guideNumber: 20, distance: 0.8, modifierLossStops: 1 },
} satisfies DuskSetupInput;
