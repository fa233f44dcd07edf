// Frame analysis from bytes to numbers, against outside references: each test image is rendered
// with sharp from pixel values computed in test/factories/srgb-reference.ts (IEC 61966-2-1 and
// CIE 15, cross-checked with chroma-js), never with the analysis module's own colour helpers, and
// the analysis must recover the published colour temperature and Duv of the chromaticity.
import sharp from 'sharp';
import { renderFrame } from '../../test/factories/frames.js';
import { DomainError } from '../common/errors/domain-error.js';
import { toProblem } from '../common/filters/problem.filter.js';
import { srgbOfXy, srgbOfXyViaChroma } from '../../test/factories/srgb-reference.js';
import { analyseFrame } from './frame-analysis.js';

const PATCH = { x: 160, y: 100, width: 160, height: 120 };
const mired = (k: number) => 1e6 / k;

interface Reference {
  name: string;
  x: number;
  y: number;
  kelvin: number;
  /** Published Duv, or null where none is at hand. */
  duv: number | null;
  source: string;
}

const REFERENCES: Reference[] = [
  // CIE 15:2004, standard illuminant A: a Planckian radiator at 2856 K, so Duv 0 by definition.
  { name: 'CIE A', x: 0.44757, y: 0.40745, kelvin: 2856, duv: 0, source: 'CIE 15:2004' },
  // CIE 15:2004, D50 and D65 chromaticities and CCTs (5003 K, 6504 K); D65's Duv +0.0032 is
  // from memory (Ohno 2014, LEUKOS 10:47).
  { name: 'CIE D50', x: 0.34567, y: 0.3585, kelvin: 5003, duv: null, source: 'CIE 15:2004' },
  { name: 'CIE D65', x: 0.31271, y: 0.32902, kelvin: 6504, duv: 0.0032, source: 'CIE 15:2004' },
  // Planckian locus points, CIE 1931 2° observer, four decimals, as tabulated in colorimetry
  // handbooks (e.g. Wyszecki & Stiles, Color Science, 2nd ed.): from memory. Duv 0 by definition.
  ...(
    [
      [2000, 0.5267, 0.4133],
      [3000, 0.4369, 0.4041],
      [4000, 0.3805, 0.3768],
      [5000, 0.3451, 0.3516],
      [10000, 0.2807, 0.2884],
      [20000, 0.2565, 0.2577],
    ] as const
  ).map(([kelvin, x, y]) => ({
    name: `Planckian ${kelvin} K`,
    x,
    y,
    kelvin,
    duv: 0,
    source: 'locus table, from memory',
  })),
];

// Tolerances, in mireds because a fixed error in chromaticity is a fixed error in mireds, not in
// kelvin. PNG (lossless): the four-decimal chromaticities (about 0.15 mired at 10000-20000 K), the
// 8-bit randomly rounded pixels averaged over 19,200 px and the four-decimal IEC matrices, inverse
// to about 1e-4; measured here at most 0.17 mired and 1e-4 in Duv over these references. JPEG at
// quality 100 also rounds every pixel through 8-bit YCbCr, which shifts a flat patch's mean
// colour: measured here up to 1.8 mired and 6e-4 in Duv (seeds 7-9, Y 0.2 and 0.3).
const TOLERANCE = {
  png: { mired: 0.3, duv: 0.0002 },
  jpeg: { mired: 2.5, duv: 0.001 },
} as const;

const analyse = async (buf: Buffer, patch: typeof PATCH | null = PATCH) =>
  (await analyseFrame({ buf, patch, cameraKelvin: 5500, maxPixels: 50_000_000 })).analysis;

describe('test-image pixel values (outside the analysis module)', () => {
  it.each(REFERENCES)(
    '$name: IEC 61966-2-1 formulas and chroma-js give the same code values',
    ({ x, y }) => {
      const iec = srgbOfXy(x, y, 0.2);
      const lib = srgbOfXyViaChroma(x, y, 0.2);
      for (let i = 0; i < 3; i++) expect(Math.abs(iec[i]! - lib[i]!)).toBeLessThan(0.25);
    },
  );

  it('sRGB white is D65 (IEC 61966-2-1): x 0.3127, y 0.3290 renders R = G = B', () => {
    const [r, g, b] = srgbOfXy(0.3127, 0.329, 0.2);
    expect(Math.abs(r - g)).toBeLessThan(0.05);
    expect(Math.abs(b - g)).toBeLessThan(0.05);
    // Y 0.2 encodes as 1.055 * 0.2^(1/2.4) - 0.055 = 0.4845 (IEC 61966-2-1 transfer function).
    expect(g / 255).toBeCloseTo(0.4845, 3);
  });
});

describe('analyseFrame recovers published colour temperatures and Duv', () => {
  it.each(
    REFERENCES.flatMap((r) => (['jpeg', 'png'] as const).map((format) => ({ ...r, format }))),
  )('$name ($source) from a $format patch', async ({ x, y, kelvin, duv, format }) => {
    const buf = await renderFrame({ patch: { ...PATCH, cx: x, cy: y, Y: 0.2 }, format });
    const a = await analyse(buf);
    expect(a.patch.source).toBe('caller');
    expect(a.colour.cctMeaningful).toBe(true);
    const tolerance = TOLERANCE[format];
    expect(Math.abs(mired(a.colour.cctKelvin!) - mired(kelvin))).toBeLessThanOrEqual(
      tolerance.mired,
    );
    if (duv !== null) expect(Math.abs(a.colour.duv! - duv)).toBeLessThanOrEqual(tolerance.duv);
    expect(a.warnings).toEqual([]);
  });

  it('finds the patch by itself on a busy coloured background and reads CIE A as 2856 K', async () => {
    // CIE 15:2004: illuminant A, x 0.44757, y 0.40745, 2856 K.
    const buf = await renderFrame({ patch: { ...PATCH, cx: 0.44757, cy: 0.40745, Y: 0.25 } });
    const a = await analyse(buf, null);
    expect(a.patch.source).toBe('auto');
    expect(a.patch.x).toBeGreaterThanOrEqual(PATCH.x);
    expect(a.patch.x + a.patch.width).toBeLessThanOrEqual(PATCH.x + PATCH.width);
    expect(Math.abs(mired(a.colour.cctKelvin!) - mired(2856))).toBeLessThanOrEqual(
      TOLERANCE.jpeg.mired,
    );
  });
});

describe('analyseFrame says when the white-balance fine-tune runs past the usual range', () => {
  // Fine-tune steps are WB_FINE_TUNE_STEP_MIRED (5) mireds, cameras usually offer about ±7 of
  // them: both from memory. The offset is the patch's mired distance from the sRGB neutral, D65.
  const stepsFor = (kelvin: number) => -Math.round((mired(kelvin) - mired(6504)) / 5);

  it('CIE A (2856 K, CIE 15:2004) at a 5500 K camera: about 39 steps toward blue, with a note', async () => {
    const buf = await renderFrame({
      patch: { ...PATCH, cx: 0.44757, cy: 0.40745, Y: 0.2 },
      format: 'png',
    });
    const c = (await analyse(buf)).colour;
    expect(Math.abs(c.whiteBalance!.amberBlueSteps - stepsFor(2856))).toBeLessThanOrEqual(1);
    const note = c.notes.find((n) => n.code === 'fine-tune-beyond-range')?.message;
    expect(note).toMatch(/^Fine-tuning this takes/);
    expect(note).toContain(`${Math.abs(c.whiteBalance!.amberBlueSteps)} steps toward blue`);
    expect(note).toContain(`set the white balance to about ${c.whiteBalance!.kelvin} K instead`);
  });

  it('a patch a few mireds from neutral needs a step or two and gets no such note', async () => {
    // x 0.3155, y 0.3248: a chromaticity a little warmer than D65 (x 0.3127, y 0.3290), chosen
    // for the test; any patch within ±7 steps (35 mireds) must get no note.
    const buf = await renderFrame({
      patch: { ...PATCH, cx: 0.3155, cy: 0.3248, Y: 0.2 },
      format: 'png',
    });
    const c = (await analyse(buf)).colour;
    expect(Math.abs(c.whiteBalance!.amberBlueSteps)).toBeLessThanOrEqual(2);
    expect(c.notes.some((n) => n.code === 'fine-tune-beyond-range')).toBe(false);
  });
});

describe('analyseFrame flags patches outside the CCT method range', () => {
  // Robertson's table (Wyszecki & Stiles, Table 1(3.11)) spans 1667 K to infinite temperature.
  it('a patch warmer than 1667 K: no CCT, and a warning naming the warm end', async () => {
    // On the warm side of the 1667 K isotemperature line (CIE 1960 u = 0.33724 there, nearly
    // vertical; black bodies at 1500 K sit at u = 0.358: from memory) and 0.015 below the locus,
    // inside the sRGB gamut: CIE 1960 u 0.355, v 0.345, i.e. x 0.5462, y 0.3538.
    const buf = await renderFrame({ patch: { ...PATCH, cx: 0.5462, cy: 0.3538, Y: 0.15 } });
    const a = await analyse(buf);
    expect(a.colour.cctKelvin).toBeNull();
    expect(a.colour.cctMeaningful).toBe(false);
    expect(a.colour.gel).toBeNull();
    expect(a.warnings).toHaveLength(1);
    expect(a.warnings[0]!.code).toBe('warmer-than-cct-range');
    expect(a.warnings[0]!.message).toMatch(/warmer than 1667 K/);
    expect(a.colour.notes).toContainEqual(a.warnings[0]);
  });

  it('a patch bluer than any black body: no CCT, and a warning naming the blue end', async () => {
    // The Planckian locus ends at x 0.2399, y 0.2340 as T -> infinity (from memory); x 0.22,
    // y 0.21 lies beyond it, inside the sRGB gamut.
    const buf = await renderFrame({ patch: { ...PATCH, cx: 0.22, cy: 0.21, Y: 0.2 } });
    const a = await analyse(buf);
    expect(a.colour.cctKelvin).toBeNull();
    expect(a.colour.cctMeaningful).toBe(false);
    expect(a.warnings).toHaveLength(1);
    expect(a.warnings[0]!.code).toBe('bluer-than-cct-range');
    expect(a.warnings[0]!.message).toMatch(/bluer than any black body/);
    expect(a.colour.notes).toContainEqual(a.warnings[0]);
  });

  it('an off-locus patch inside the range keeps the Duv note and no range warning', async () => {
    // x 0.3, y 0.45 is far above the locus (|Duv| > 0.05, Ohno 2014): a CCT, but not meaningful.
    const buf = await renderFrame({ patch: { ...PATCH, cx: 0.3, cy: 0.45, Y: 0.2 } });
    const a = await analyse(buf);
    expect(a.colour.cctMeaningful).toBe(false);
    expect(a.colour.duv!).toBeGreaterThan(0.05);
    expect(a.warnings).toEqual([]);
    const far = a.colour.notes.find((n) => n.code === 'far-from-locus');
    expect(far?.message).toMatch(/too far from the Planckian locus/);
  });
});

describe('analyseFrame codes its warnings about the patch itself', () => {
  // Flat grey PNGs made with sharp; the code values turn into luminance through the sRGB
  // transfer function (IEC 61966-2-1). The thresholds (1 % clipped, 10 % unevenness, Y < 0.01)
  // are the analysis' own: common practice, no source.
  const flat = (width: number, height: number, v: number) =>
    sharp({ create: { width, height, channels: 3, background: { r: v, g: v, b: v } } });
  const whole = { x: 0, y: 0, width: 64, height: 64 };

  it('code value 255 everywhere: clipped (every channel at or above 250)', async () => {
    const a = await analyse(await flat(64, 64, 255).png().toBuffer(), whole);
    expect(a.warnings.map((w) => w.code)).toEqual(['patch-clipped']);
  });

  it('code value 20 everywhere: Y = ((20/255 + 0.055)/1.055)^2.4 = 0.0070, under 0.01: dark', async () => {
    const a = await analyse(await flat(64, 64, 20).png().toBuffer(), whole);
    expect(a.patch.luminance).toBeCloseTo(0.007, 3);
    expect(a.warnings.map((w) => w.code)).toEqual(['patch-dark']);
  });

  it('half code value 60, half 200: Y 0.045 and 0.578, far over 10 % variation: uneven', async () => {
    const buf = await flat(64, 64, 60)
      .composite([{ input: await flat(32, 64, 200).png().toBuffer(), left: 32, top: 0 }])
      .png()
      .toBuffer();
    const a = await analyse(buf, whole);
    expect(a.patch.luminanceCv).toBeGreaterThan(0.1);
    expect(a.warnings.map((w) => w.code)).toEqual(['patch-uneven']);
  });
});

describe('analyseFrame refuses what it cannot use with the one 422 type, naming the field', () => {
  const refusal = async (p: Promise<unknown>) => {
    const e = await p.then(
      () => null,
      (err: unknown) => err,
    );
    expect(e).toBeInstanceOf(DomainError);
    return e as DomainError;
  };

  it('a truncated file, an image over the pixel limit, an image with nothing neutral', async () => {
    const good = await renderFrame({ patch: { ...PATCH, cx: 0.31271, cy: 0.32902, Y: 0.3 } });
    const cut = await refusal(
      analyseFrame({
        buf: good.subarray(0, Math.floor(good.length / 2)),
        patch: null,
        cameraKelvin: null,
        maxPixels: 50_000_000,
      }),
    );
    expect([cut.code, cut.errors]).toEqual([
      'invalid_input',
      [{ field: 'file', reason: 'is corrupt or truncated' }],
    ]);
    // 480 x 320 = 153,600 pixels: over a 100,000-pixel limit.
    const big = await refusal(
      analyseFrame({ buf: good, patch: null, cameraKelvin: null, maxPixels: 100_000 }),
    );
    expect([big.code, big.errors]).toEqual([
      'invalid_input',
      [{ field: 'file', reason: 'has more than 100000 pixels' }],
    ]);
    // Saturated red everywhere: no neutral area for the automatic search.
    const red = await sharp({
      create: { width: 320, height: 240, channels: 3, background: { r: 230, g: 20, b: 20 } },
    })
      .png()
      .toBuffer();
    const none = await refusal(
      analyseFrame({ buf: red, patch: null, cameraKelvin: null, maxPixels: 50_000_000 }),
    );
    expect(none.code).toBe('invalid_input');
    expect(none.errors.map((x) => x.field)).toEqual(['patchX']);
    for (const e of [cut, big, none]) {
      expect(toProblem(e).problem).toMatchObject({
        status: 422,
        type: 'https://lumenwright.test/problems/invalid-input',
      });
    }
  });
});
