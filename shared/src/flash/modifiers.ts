/**
 * Typical light-shaping tools with default light loss (stops) and size (m). Losses are common
 * practice, no source (broad published ranges; treat as defaults the caller can override).
 */
export type ModifierName =
  | 'bare'
  | 'umbrella'
  | 'softbox'
  | 'softbox-double-diffusion'
  | 'octabox'
  | 'beauty-dish'
  | 'grid'
  | 'snoot';

export const MODIFIERS: Record<ModifierName, { lossStops: number; sizeM: number }> = {
  bare: { lossStops: 0, sizeM: 0.08 },
  umbrella: { lossStops: 1.25, sizeM: 1.0 }, // 1-1.5 stops
  softbox: { lossStops: 1.25, sizeM: 0.9 }, // 1-1.5
  'softbox-double-diffusion': { lossStops: 2, sizeM: 0.9 }, // 1.5-2.5
  octabox: { lossStops: 2.5, sizeM: 1.2 }, // 2-3
  'beauty-dish': { lossStops: 0.75, sizeM: 0.55 }, // 0.5-1 (white)
  grid: { lossStops: 0.6, sizeM: 0.1 }, // 0.3-1 on axis
  snoot: { lossStops: 1.5, sizeM: 0.05 }, // 1-2
};

export const MODIFIER_NAMES = Object.keys(MODIFIERS) as ModifierName[];
