/**
 * The stable warning codes each answer can carry. The results' types take their codes from these
 * lists, so a warning with a code that is not listed does not compile; the server publishes the
 * same lists as the API spec's enums (and a test compares them).
 */

/** A warning on a result: a stable code plus a sentence for people. */
export interface CodedWarning<C extends string = string> {
  code: C;
  message: string;
}

/** Exposure answers: the plain APEX solve, and the background solver's own. */
export const EXPOSURE_WARNING_CODES = [
  'overexposed',
  'underexposed',
  'bulb',
  'shutter-too-fast',
  'aperture-off-scale',
  'iso-off-scale',
  'too-dark',
  'needs-tripod',
  'subject-motion',
  'exceeds-sync',
] as const;
export type ExposureWarningCode = (typeof EXPOSURE_WARNING_CODES)[number];

/** Flash power answers; `ambient-dominates` only on the dusk setup's key light. */
export const FLASH_WARNING_CODES = [
  'over-full-power',
  'below-min-power',
  'ambient-dominates',
] as const;
export type FlashWarningCode = (typeof FLASH_WARNING_CODES)[number];

export const BACKLIGHT_WARNING_CODES = [
  'head-outside-beam',
  'ground-outshines-rim',
  'aimed-down',
] as const;
export type BacklightWarningCode = (typeof BACKLIGHT_WARNING_CODES)[number];

export const BALANCE_WARNING_CODES = ['fine-tune-limit', 'fine-tune-beyond-range'] as const;
export type BalanceWarningCode = (typeof BALANCE_WARNING_CODES)[number];

export const TWILIGHT_WARNING_CODES = ['time-zone-mismatch'] as const;
export type TwilightWarningCode = (typeof TWILIGHT_WARNING_CODES)[number];

/**
 * The evening timeline's: the twilight's, the sun never setting or rising, no window at all, slots
 * outside the blue hour, none free, shorter than wanted, and a booked event inside the window.
 */
export const TIMELINE_WARNING_CODES = [
  ...TWILIGHT_WARNING_CODES,
  'polar-day',
  'polar-night',
  'no-window',
  'outside-blue-hour',
  'no-free-stretch',
  'shorter-than-wanted',
  'event-overlaps-window',
] as const;
export type TimelineWarningCode = (typeof TIMELINE_WARNING_CODES)[number];

/** The rim light's backlight warnings, as the dusk setup's list carries them. */
export const RIM_WARNING_CODES = BACKLIGHT_WARNING_CODES.map((c) => `rim-${c}` as const);
export type RimWarningCode = `rim-${BacklightWarningCode}`;

/**
 * The dusk setup's own list: the twilight's, the plan's, the rim light's, the first minute where
 * the ambient outweighs the key, and the balance's.
 */
export const SETUP_WARNING_CODES = [
  ...TWILIGHT_WARNING_CODES,
  'no-sunset',
  'too-dark',
  'no-usable-minute',
  ...RIM_WARNING_CODES,
  'ambient-model',
  'ambient-dominates',
  ...BALANCE_WARNING_CODES,
] as const;
export type SetupWarningCode = (typeof SETUP_WARNING_CODES)[number];

/**
 * A test frame's analysis: warnings about the measured patch. `unclassified` is what a frame
 * stored before the codes existed carries (its text kept as the message).
 */
export const FRAME_WARNING_CODES = [
  'patch-clipped',
  'patch-uneven',
  'patch-dark',
  'warmer-than-cct-range',
  'bluer-than-cct-range',
  'unclassified',
] as const;
export type FrameWarningCode = (typeof FRAME_WARNING_CODES)[number];

/** A test frame's colour notes (about the correction); `unclassified` as for the warnings. */
export const FRAME_NOTE_CODES = [
  'camera-white-balance-assumed',
  'warmer-than-cct-range',
  'bluer-than-cct-range',
  'far-from-locus',
  'fine-tune-beyond-range',
  'gel-not-solved',
  'light-outside-gel-range',
  'tint',
  'unclassified',
] as const;
export type FrameNoteCode = (typeof FRAME_NOTE_CODES)[number];
