/** Property tests (fast-check): invariants that follow from the cited definitions. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  applyMiredShift,
  computeFalloff,
  computeFlash,
  computeFlashAperture,
  miredShift,
  solveBalance,
  stopsBetween,
} from '../src/index.js';

const gn = fc.double({ min: 5, max: 80, noNaN: true });
const dist = fc.double({ min: 0.5, max: 20, noNaN: true });
const fnum = fc.double({ min: 1, max: 32, noNaN: true });
const iso = fc.double({ min: 50, max: 12800, noNaN: true });

describe('flash (ISO 1230 guide-number relation)', () => {
  it('power rises with distance and with aperture', () => {
    fc.assert(
      fc.property(
        gn,
        dist,
        fnum,
        iso,
        fc.double({ min: 1.01, max: 3, noNaN: true }),
        (g, d, n, s, k) => {
          const base = computeFlash({
            guideNumber: g,
            distance: d,
            aperture: n,
            iso: s,
          }).powerFraction;
          expect(
            computeFlash({ guideNumber: g, distance: Math.min(1000, d * k), aperture: n, iso: s })
              .powerFraction,
          ).toBeGreaterThan(base);
          expect(
            computeFlash({ guideNumber: g, distance: d, aperture: Math.min(128, n * k), iso: s })
              .powerFraction,
          ).toBeGreaterThan(base);
        },
      ),
    );
  });
  it('power <-> aperture round-trips', () => {
    fc.assert(
      fc.property(
        gn,
        dist,
        fnum,
        iso,
        fc.double({ min: 0, max: 3, noNaN: true }),
        (g, d, n, s, loss) => {
          const p = computeFlash({
            guideNumber: g,
            distance: d,
            aperture: n,
            iso: s,
            modifierLossStops: loss,
          }).powerFraction;
          fc.pre(p >= 1 / 4096 && p <= 1);
          const back = computeFlashAperture({
            guideNumber: g,
            distance: d,
            iso: s,
            modifierLossStops: loss,
            powerFraction: p,
          });
          expect(back.aperture).toBeCloseTo(n, 2);
        },
      ),
    );
  });
});

describe('falloff (inverse square)', () => {
  it('is antisymmetric and additive', () => {
    fc.assert(
      fc.property(dist, dist, dist, (a, b, c) => {
        expect(stopsBetween(a, b)).toBeCloseTo(-stopsBetween(b, a), 9);
        expect(stopsBetween(a, c)).toBeCloseTo(stopsBetween(a, b) + stopsBetween(b, c), 9);
        const r = computeFalloff({ subjectDistance: a, backgroundDistance: b });
        expect(r.subjectToBackgroundStops).toBeCloseTo(stopsBetween(a, b), 2);
      }),
    );
  });
});

describe('mireds', () => {
  it('shifts add: gelling by a then b equals gelling by a + b', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 2000, max: 12000, noNaN: true }),
        fc.double({ min: -150, max: 150, noNaN: true }),
        fc.double({ min: -150, max: 150, noNaN: true }),
        (k, a, b) => {
          fc.pre(1e6 / k + a + b > 20 && 1e6 / k + a > 20);
          expect(applyMiredShift(applyMiredShift(k, a), b)).toBeCloseTo(
            applyMiredShift(k, a + b),
            6,
          );
          expect(miredShift(k, applyMiredShift(k, a))).toBeCloseTo(a, 6);
        },
      ),
    );
  });
});

type KitGel = { miredShift: number; greenShift: number };
/**
 * Stacks the solver may choose [DER]: no warming piece with a cooling one, no plus-green with
 * minus-green (opposing pieces only cost light; common practice, no source), and the gelled
 * 5500 K flash stays a real colour temperature within 1500..20000 K (mired 50..666.7).
 */
function allowedStack(gels: readonly KitGel[], idx: number[]): boolean {
  const m = idx.map((i) => (gels[i] as KitGel).miredShift);
  const g = idx.map((i) => (gels[i] as KitGel).greenShift);
  if (m.some((x) => x > 0) && m.some((x) => x < 0)) return false;
  if (g.some((x) => x > 0) && g.some((x) => x < 0)) return false;
  const flashMired = 1e6 / 5500 + m.reduce((a, b) => a + b, 0);
  return flashMired >= 1e6 / 20000 - 1e-9 && flashMired <= 1e6 / 1500 + 1e-9;
}

describe('gel solver equals brute force on random kits', () => {
  const gel = fc.record({
    miredShift: fc.integer({ min: -160, max: 160 }),
    greenShift: fc.constantFrom(0, 0, 0, 7.5, -7.5, 15),
    lossStops: fc.integer({ min: 0, max: 20 }).map((x) => x / 10),
  });
  it('best stack by |mired residual|, then |green residual|, then fewer gels, then less loss', () => {
    fc.assert(
      fc.property(
        fc.array(gel, { minLength: 1, maxLength: 9 }),
        fc.integer({ min: 2000, max: 12000 }),
        fc.integer({ min: 0, max: 3 }),
        fc.constantFrom(0, 0, 7.5, 15),
        (kit, cameraKelvin, maxGels, tint) => {
          const gels = kit.map((g, i) => ({ name: `g${i}`, ...g }));
          const required = 1e6 / cameraKelvin - 1e6 / 5500;
          // Brute force over every subset by bitmask.
          let best: number[] = [];
          let bestKey = [Math.abs(required), Math.abs(tint), 0, 0];
          for (let mask = 1; mask < 1 << gels.length; mask++) {
            const idx = gels.map((_, i) => i).filter((i) => mask & (1 << i));
            if (idx.length > maxGels || !allowedStack(gels, idx)) continue;
            const sum = (f: (g: (typeof gels)[number]) => number) =>
              idx.reduce((s, i) => s + f(gels[i] as (typeof gels)[number]), 0);
            const key = [
              Math.abs(sum((g) => g.miredShift) - required),
              Math.abs(sum((g) => g.greenShift) - tint),
              idx.length,
              sum((g) => g.lossStops),
            ];
            const better = (() => {
              for (let k = 0; k < 4; k++) {
                const d = (key[k] as number) - (bestKey[k] as number);
                if (Math.abs(d) > 1e-9) return d < 0;
              }
              return false;
            })();
            if (better) {
              best = idx;
              bestKey = key;
            }
          }
          const r = solveBalance({ cameraKelvin, cameraTint: tint, gels, maxGels });
          expect(Math.abs(r.residualMired)).toBeCloseTo(bestKey[0] as number, 1);
          expect(r.gels.length).toBe(bestKey[2]);
          expect(r.gelLossStops).toBeCloseTo(bestKey[3] as number, 6);
          expect(best.length).toBe(r.gels.length);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('gel solver with a mired tolerance equals brute force on random kits', () => {
  const gel = fc.record({
    miredShift: fc.integer({ min: -160, max: 160 }),
    greenShift: fc.constantFrom(0, 0, 0, 7.5, -7.5),
    lossStops: fc.integer({ min: 0, max: 20 }).map((x) => x / 10),
  });
  it('fewest gels (then least loss, then closest) among stacks within the tolerance', () => {
    fc.assert(
      fc.property(
        fc.array(gel, { minLength: 1, maxLength: 8 }),
        fc.integer({ min: 2000, max: 12000 }),
        fc.integer({ min: 1, max: 3 }),
        fc.integer({ min: 0, max: 30 }),
        (kit, cameraKelvin, maxGels, tolerance) => {
          const gels = kit.map((g, i) => ({ name: `g${i}`, ...g }));
          const required = 1e6 / cameraKelvin - 1e6 / 5500;
          // Every subset (by bitmask) within maxGels, the empty stack included.
          const stacks: { mired: number; green: number; n: number; loss: number }[] = [];
          for (let mask = 0; mask < 1 << gels.length; mask++) {
            const idx = gels.map((_, i) => i).filter((i) => mask & (1 << i));
            if (idx.length > maxGels || !allowedStack(gels, idx)) continue;
            const sum = (f: (g: (typeof gels)[number]) => number) =>
              idx.reduce((s, i) => s + f(gels[i] as (typeof gels)[number]), 0);
            stacks.push({
              mired: Math.abs(sum((g) => g.miredShift) - required),
              green: Math.abs(sum((g) => g.greenShift)),
              n: idx.length,
              loss: sum((g) => g.lossStops),
            });
          }
          const within = stacks.filter((s) => s.mired <= tolerance + 1e-9);
          const order =
            (keys: (keyof (typeof stacks)[number])[]) =>
            (a: (typeof stacks)[number], b: (typeof stacks)[number]) => {
              for (const k of keys) if (Math.abs(a[k] - b[k]) > 1e-9) return a[k] - b[k];
              return 0;
            };
          const best = within.length
            ? [...within].sort(order(['green', 'n', 'loss', 'mired']))[0]!
            : [...stacks].sort(order(['mired', 'green', 'n', 'loss']))[0]!;
          const r = solveBalance({ cameraKelvin, gels, maxGels, miredTolerance: tolerance });
          expect(Math.abs(r.residualMired)).toBeCloseTo(best.mired, 1);
          expect(r.gels.length).toBe(best.n);
          expect(r.gelLossStops).toBeCloseTo(best.loss, 6);
          if (within.length)
            expect(Math.abs(r.residualMired)).toBeLessThanOrEqual(tolerance + 0.01);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('balance answers stay real colour temperatures (mireds end at 0 = infinite K) [DER]', () => {
  it('gelled flash and fine-tuned camera within 1500..20000 K, or the offset is refused', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1500, max: 20000 }),
        fc.integer({ min: 2500, max: 10000 }),
        fc.integer({ min: -200, max: 200 }),
        fc.array(
          fc.record({
            name: fc.constant('piece'),
            miredShift: fc.integer({ min: -400, max: 400 }),
            lossStops: fc.constant(0.5),
          }),
          { minLength: 1, maxLength: 6 },
        ),
        fc.integer({ min: 0, max: 4 }),
        (cameraKelvin, flashKelvin, targetMiredOffset, gels, maxGels) => {
          const target = 1e6 / cameraKelvin + targetMiredOffset;
          const input = { cameraKelvin, flashKelvin, targetMiredOffset, gels, maxGels };
          if (target < 50 || target > 1e6 / 1500) {
            expect(() => solveBalance(input)).toThrow(/targetMiredOffset/);
            return;
          }
          const r = solveBalance(input);
          for (const k of [r.resultingFlashKelvin, r.whiteBalanceFineTune.cameraKelvin]) {
            expect(k).toBeGreaterThanOrEqual(1500);
            expect(k).toBeLessThanOrEqual(20000);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
