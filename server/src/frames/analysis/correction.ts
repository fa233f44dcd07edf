// From a measured neutral patch to numbers a photographer acts on: CCT and Duv (shared/), the
// mired offset from the sRGB neutral, the light's colour at the shot's white balance, the camera
// white-balance change or the gel (shared/ balance solver) that would neutralise it, and a
// scene EV from the EXIF settings and the patch brightness (APEX, shared/).
import {
  cctFromXy,
  ev100FromSettings,
  LightingInputError,
  mired,
  ROBERTSON_RANGE_KELVIN,
  solveBalance,
  WB_FINE_TUNE_STEP_MIRED,
  WB_FINE_TUNE_USUAL_STEPS,
  type CctResult,
  type CodedWarning,
  type FrameNoteCode,
} from '@lumenwright/shared';
import type { FrameExif } from './exif.js';
import type { PatchStats } from './patch.js';

/** sRGB's white is CIE D65, x = 0.3127, y = 0.3290 (IEC 61966-2-1; CIE 15:2004). */
export const SRGB_WHITE = { x: 0.3127, y: 0.329 } as const;
/** Daylight/flash preset assumed when the caller does not say: common practice, no source. */
export const ASSUMED_CAMERA_KELVIN = 5500;
/** A grey card reflects 18 %: metering's middle grey. Common practice, no source. */
export const MIDDLE_GREY = 0.18;

const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;

export interface Correction {
  chromaticity: { x: number; y: number };
  cctKelvin: number | null;
  duv: number | null;
  cctMeaningful: boolean;
  method: string;
  neutral: { x: number; y: number; cctKelvin: number };
  /** mired(patch CCT) - mired(neutral): + = the patch renders warmer (amber) than neutral. */
  miredOffset: number | null;
  tint: 'green' | 'magenta' | 'none';
  cameraKelvin: number;
  cameraKelvinSource: 'caller' | 'assumed';
  /** The light on the patch implied by the offset at the shot's white balance, kelvin. */
  lightKelvin: number | null;
  whiteBalance: { kelvin: number; miredShift: number; amberBlueSteps: number } | null;
  gel: {
    requiredMiredShift: number;
    gels: { name: string; miredShift: number; lossStops: number }[];
    residualMired: number;
    lossStops: number;
  } | null;
  notes: FrameNote[];
}

/** What the analysis writes: any listed code but `unclassified` (kept for older rows). */
export type FrameNote = CodedWarning<Exclude<FrameNoteCode, 'unclassified'>>;

export interface ExposureEstimate {
  settingsEv100: number | null;
  patchLuminance: number;
  sceneEv100: number | null;
  basis: string;
}

/**
 * Why there is no colour temperature when the patch lies past an end of the CCT method's range
 * (Robertson's table, 1667 K to infinite temperature; shared/ cctFromXy); null inside it.
 */
export function cctRangeWarning(
  range: CctResult['range'],
): CodedWarning<'warmer-than-cct-range' | 'bluer-than-cct-range'> | null {
  if (range === 'warmer') {
    return {
      code: 'warmer-than-cct-range',
      message: `The patch is warmer than ${Math.round(ROBERTSON_RANGE_KELVIN.min)} K, the warm end of the colour-temperature method's range: no colour temperature is reported.`,
    };
  }
  if (range === 'bluer') {
    return {
      code: 'bluer-than-cct-range',
      message:
        "The patch is bluer than any black body, past the infinite-temperature end of the colour-temperature method's range: no colour temperature is reported.",
    };
  }
  return null;
}

/** Warnings about the patch's colour for the analysis' `warnings` list. */
export function colourWarnings(
  stats: PatchStats,
): CodedWarning<'warmer-than-cct-range' | 'bluer-than-cct-range'>[] {
  if (!stats.xy) return [];
  const w = cctRangeWarning(cctFromXy(stats.xy.x, stats.xy.y).range);
  return w ? [w] : [];
}

export function correctionFor(stats: PatchStats, cameraKelvin: number | null): Correction {
  const notes: FrameNote[] = [];
  const xy = stats.xy ?? SRGB_WHITE;
  const c = cctFromXy(xy.x, xy.y);
  const neutralCct = cctFromXy(SRGB_WHITE.x, SRGB_WHITE.y).cct!;
  const camera = cameraKelvin ?? ASSUMED_CAMERA_KELVIN;
  if (cameraKelvin === null) {
    notes.push({
      code: 'camera-white-balance-assumed',
      message: `The camera's white balance was not given; ${ASSUMED_CAMERA_KELVIN} K is assumed for the light and gel figures.`,
    });
  }
  const base = {
    chromaticity: { x: round(xy.x, 5), y: round(xy.y, 5) },
    cctKelvin: c.cct === null ? null : round(c.cct, 1),
    duv: c.duv === null ? null : round(c.duv, 5),
    cctMeaningful: c.meaningful,
    method: c.method,
    neutral: { ...SRGB_WHITE, cctKelvin: round(neutralCct, 1) },
    tint: (c.duv === null || Math.abs(c.duv) < 0.005
      ? 'none'
      : c.duv > 0
        ? 'green'
        : 'magenta') as Correction['tint'],
    cameraKelvin: camera,
    cameraKelvinSource: (cameraKelvin === null ? 'assumed' : 'caller') as 'caller' | 'assumed',
  };
  if (c.cct === null || !c.meaningful) {
    notes.push(
      cctRangeWarning(c.range) ?? {
        code: 'far-from-locus',
        message:
          'The patch is too far from the Planckian locus for a colour temperature to mean much.',
      },
    );
    return { ...base, miredOffset: null, lightKelvin: null, whiteBalance: null, gel: null, notes };
  }
  const offset = mired(c.cct) - mired(neutralCct);
  const lightMired = mired(camera) + offset;
  const lightKelvin = lightMired > 0 ? 1e6 / lightMired : null;
  const whiteBalance =
    lightKelvin !== null && lightKelvin >= 1500 && lightKelvin <= 20000
      ? {
          kelvin: Math.round(lightKelvin),
          miredShift: round(offset, 1),
          amberBlueSteps: -Math.round(offset / WB_FINE_TUNE_STEP_MIRED) || 0,
        }
      : null;
  if (whiteBalance && Math.abs(whiteBalance.amberBlueSteps) > WB_FINE_TUNE_USUAL_STEPS) {
    const s = whiteBalance.amberBlueSteps;
    notes.push({
      code: 'fine-tune-beyond-range',
      message: `Fine-tuning this takes ${Math.abs(s)} steps toward ${s > 0 ? 'amber' : 'blue'}; cameras usually offer about \u00b1${WB_FINE_TUNE_USUAL_STEPS}: set the white balance to about ${whiteBalance.kelvin} K instead.`,
    });
  }
  let gel: Correction['gel'] = null;
  if (lightKelvin !== null && lightKelvin >= 2500 && lightKelvin <= 10000) {
    try {
      const b = solveBalance({ cameraKelvin: camera, flashKelvin: lightKelvin });
      gel = {
        requiredMiredShift: b.requiredMiredShift,
        gels: b.gels.map(({ name, miredShift, lossStops }) => ({ name, miredShift, lossStops })),
        residualMired: b.residualMired,
        lossStops: b.gelLossStops,
      };
    } catch (e) {
      if (!(e instanceof LightingInputError)) throw e;
      notes.push({ code: 'gel-not-solved', message: `No gel suggestion: ${e.field} ${e.reason}.` });
    }
  } else {
    notes.push({
      code: 'light-outside-gel-range',
      message: 'The light is outside 2500-10000 K at this white balance: no gel suggestion.',
    });
  }
  if (base.tint !== 'none') {
    notes.push({
      code: 'tint',
      message: `The patch leans ${base.tint} (Duv ${base.duv}): a ${base.tint === 'green' ? 'minus-green' : 'plus-green'} correction may be needed too.`,
    });
  }
  return {
    ...base,
    miredOffset: round(offset, 1),
    lightKelvin: lightKelvin === null ? null : Math.round(lightKelvin),
    whiteBalance,
    gel,
    notes,
  };
}

/** Scene EV100 = settings EV100 + log2(patch Y / 0.18), assuming the patch is a grey card. */
export function exposureFor(stats: PatchStats, exif: FrameExif): ExposureEstimate {
  const { fNumber, exposureTime, iso } = exif;
  const settings =
    fNumber && exposureTime && iso ? ev100FromSettings(fNumber, exposureTime, iso) : null;
  const scene =
    settings !== null && stats.luminance > 0
      ? settings + Math.log2(stats.luminance / MIDDLE_GREY)
      : null;
  return {
    settingsEv100: settings === null ? null : round(settings, 2),
    patchLuminance: round(stats.luminance, 4),
    sceneEv100: scene === null ? null : round(scene, 2),
    basis: exif.flashFired
      ? 'Flash fired: the estimate is for the flash-lit patch, not the ambient light.'
      : 'Ambient light on an 18 % grey patch, rendered with the sRGB curve (approximate).',
  };
}
