/**
 * @lumenwright/shared — pure lighting math: twilight, ambient light, exposure, flash, colour
 * balance and the whole dusk setup. No I/O, no clock: time is always an argument.
 */
export { LightingInputError } from './errors.js';
export * from './warning-codes.js';

export * from './twilight/compute-twilight.js';
export * from './twilight/ambient-model.js';
export * from './twilight/ambient-at.js';
export type { AmbientPoint } from './twilight/timeline.js';

export * from './exposure/apex.js';
export * from './exposure/scales.js';
export * from './exposure/solve-exposure.js';
export * from './exposure/background.js';

export * from './flash/power-scale.js';
export * from './flash/guide-number.js';
export * from './flash/falloff.js';
export * from './flash/backlight.js';
export * from './flash/key-light.js';
export * from './flash/modifiers.js';

export * from './color/mired.js';
export * from './color/gels.js';
export * from './color/balance.js';
export * from './color/scene.js';
export * from './color/cct.js';
export * from './color/locus.js';

export * from './setup/dusk-setup.js';
export * from './setup/cautions.js';

export * from './timeline/evening-timeline.js';

export { METRES_PER_FOOT, toMetres, fromMetres, type LengthUnit } from './units/length.js';
export { clockIn, clockOf } from './units/time-zone.js';
export { countOf } from './units/math.js';
