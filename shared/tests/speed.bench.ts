/**
 * Speed targets: each single calculation < 0.2 ms median; the timeline < 2 ms for 3 hours at
 * 2-minute steps; the whole dusk setup < 5 ms.
 */
import { bench, describe } from 'vitest';
import {
  cctFromXy,
  computeBacklight,
  computeFalloff,
  computeFlash,
  computeKeyLight,
  computeTwilight,
  planDuskSetup,
  solveBackgroundExposure,
  solveBalance,
  solveExposure,
} from '../src/index.js';

const place = {
  latitude: 51.5074,
  longitude: -0.1278,
  date: '2026-06-21',
  timeZone: 'Europe/London',
};

describe('single calculations (target < 0.2 ms median)', () => {
  bench('solveExposure', () => void solveExposure({ ev100: 9, aperture: 5.6, iso: 400 }));
  bench(
    'solveBackgroundExposure',
    () => void solveBackgroundExposure({ ev100: 5, aperture: 4, flashSyncSeconds: 1 / 200 }),
  );
  bench(
    'computeFlash',
    () =>
      void computeFlash({
        guideNumber: 40,
        distance: 2.5,
        aperture: 5.6,
        iso: 400,
        modifierLossStops: 1.3,
      }),
  );
  bench(
    'computeFalloff',
    () => void computeFalloff({ subjectDistance: 2, backgroundDistance: 20 }),
  );
  bench(
    'computeBacklight',
    () => void computeBacklight({ lightHeight: 1, distanceBehind: 1.8, beamAngleDeg: 20 }),
  );
  bench(
    'computeKeyLight',
    () => void computeKeyLight({ angleFromCameraDeg: 60, distance: 1.5, modifierSize: 0.9 }),
  );
  bench('solveBalance (catalogue, 3 gels)', () => void solveBalance({ cameraKelvin: 3200 }));
  bench('cctFromXy', () => void cctFromXy(0.31271, 0.32902));
  bench(
    'computeTwilight events only (60-min step)',
    () => void computeTwilight({ ...place, stepMinutes: 60 }),
  );
});

describe('timeline (target < 2 ms for 3 h at 2-min steps)', () => {
  // London midsummer: golden-hour start to astronomical dusk is over 3 hours (no astronomical
  // dusk there in June, so the timeline runs to solar midnight: ~5 h, a harder case).
  bench(
    'computeTwilight 2-min timeline, London 2026-09-20 (~3 h)',
    () => void computeTwilight({ ...place, date: '2026-09-20' }),
  );
  bench(
    'computeTwilight 2-min timeline, London 2026-06-21 (~5 h)',
    () => void computeTwilight(place),
  );
});

describe('whole setup (target < 5 ms)', () => {
  bench(
    'planDuskSetup',
    () =>
      void planDuskSetup({
        ...place,
        date: '2026-09-20',
        key: { guideNumber: 40, distance: 2, modifier: 'softbox' },
        rim: { guideNumber: 30, distanceBehind: 1.8, lightHeight: 1, beamAngleDeg: 20 },
        backgroundDistance: 30,
      }),
  );
});
