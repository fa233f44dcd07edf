// One frame's analysis, from bytes to numbers: no storage, no database.
import type { CodedWarning, FrameWarningCode } from '@lumenwright/shared';
import { DomainError } from '../common/errors/domain-error.js';
import {
  colourWarnings,
  correctionFor,
  exposureFor,
  type Correction,
  type ExposureEstimate,
} from './analysis/correction.js';
import { autoRect, decode, measureRect } from './analysis/decode.js';
import { readExif, type FrameExif } from './analysis/exif.js';
import type { Rect } from './analysis/patch.js';

export interface FrameAnalysis {
  patch: Rect & {
    source: 'caller' | 'auto';
    linearRgb: { r: number; g: number; b: number };
    luminance: number;
    luminanceCv: number;
    clippedFraction: number;
  };
  colour: Correction;
  exposure: ExposureEstimate;
  warnings: FrameWarning[];
}

/** What the analysis writes: any listed code but `unclassified` (kept for older rows). */
export type FrameWarning = CodedWarning<Exclude<FrameWarningCode, 'unclassified'>>;

export interface AnalysisInput {
  buf: Buffer;
  patch: Rect | null;
  cameraKelvin: number | null;
  maxPixels: number;
}

const r4 = (v: number) => Math.round(v * 1e4) / 1e4;

export async function analyseFrame(
  input: AnalysisInput,
): Promise<{ width: number; height: number; exif: FrameExif; analysis: FrameAnalysis }> {
  const decoded = await decode(input.buf, input.maxPixels);
  const { width, height } = decoded;
  let rect = input.patch;
  if (rect) {
    const problems = outside(rect, width, height);
    if (problems.length) {
      throw new DomainError('invalid_input', 'The patch is not inside the image.', problems);
    }
  } else {
    rect = autoRect(decoded);
    if (!rect) {
      throw new DomainError(
        'invalid_input',
        'No even, neutral patch was found: give one with patchX, patchY, patchWidth, patchHeight.',
        [{ field: 'patchX', reason: 'is needed: no neutral patch was found automatically' }],
      );
    }
  }
  const [stats, exif] = await Promise.all([
    measureRect(input.buf, rect, input.maxPixels),
    readExif(input.buf),
  ]);
  const warnings: FrameWarning[] = [];
  if (stats.clippedFraction > 0.01) {
    warnings.push({
      code: 'patch-clipped',
      message: 'Part of the patch is clipped: its colour and brightness are unreliable.',
    });
  }
  if (stats.luminanceCv > 0.1) {
    warnings.push({
      code: 'patch-uneven',
      message: 'The patch is uneven (texture or a gradient): pick a flatter area.',
    });
  }
  if (stats.luminance < 0.01) {
    warnings.push({
      code: 'patch-dark',
      message: 'The patch is very dark: its colour is unreliable.',
    });
  }
  warnings.push(...colourWarnings(stats));
  return {
    width,
    height,
    exif,
    analysis: {
      patch: {
        ...rect,
        source: input.patch ? 'caller' : 'auto',
        linearRgb: { r: r4(stats.linear.r), g: r4(stats.linear.g), b: r4(stats.linear.b) },
        luminance: r4(stats.luminance),
        luminanceCv: r4(stats.luminanceCv),
        clippedFraction: r4(stats.clippedFraction),
      },
      colour: correctionFor(stats, input.cameraKelvin),
      exposure: exposureFor(stats, exif),
      warnings,
    },
  };
}

function outside(r: Rect, width: number, height: number) {
  const p: { field: string; reason: string }[] = [];
  if (r.x >= width) p.push({ field: 'patchX', reason: `must be less than the width (${width})` });
  if (r.y >= height)
    p.push({ field: 'patchY', reason: `must be less than the height (${height})` });
  if (r.x + r.width > width) {
    p.push({ field: 'patchWidth', reason: `reaches past the right edge (width ${width})` });
  }
  if (r.y + r.height > height) {
    p.push({ field: 'patchHeight', reason: `reaches past the bottom edge (height ${height})` });
  }
  return p;
}
