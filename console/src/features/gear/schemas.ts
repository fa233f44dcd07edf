import { z } from 'zod';

const name = (max: number) =>
  z.string().trim().min(1, 'Enter a name').max(max, `Use at most ${max} characters`);
const optionalNumber = z.union([z.number(), z.nan()]).optional();

export const lightSchema = z.object({
  name: name(80),
  guideNumber: z
    .number({ error: 'Enter the guide number at ISO 100, full power' })
    .positive('Must be above 0'),
  guideNumberUnit: z.enum(['m', 'ft']),
  notes: z.string().max(2000, 'Use at most 2000 characters'),
});
export type LightValues = z.infer<typeof lightSchema>;

export const MODIFIER_KINDS = [
  'bare',
  'umbrella',
  'softbox',
  'softbox-double-diffusion',
  'octabox',
  'beauty-dish',
  'grid',
  'snoot',
] as const;

export const modifierSchema = z.object({
  name: name(80),
  kind: z.enum(MODIFIER_KINDS),
  lossStops: z
    .number({ error: 'Enter the light loss in stops (0 for none)' })
    .min(0, 'Loss can’t be negative')
    .max(8, 'At most 8 stops'),
  size: optionalNumber,
  sizeUnit: z.enum(['m', 'ft']),
  beamAngleDeg: optionalNumber,
  notes: z.string().max(2000, 'Use at most 2000 characters'),
});
export type ModifierValues = z.infer<typeof modifierSchema>;

export const gelPieceSchema = z.object({
  name: name(60),
  miredShift: z.number({ error: 'Enter the mired shift (positive warms, negative cools)' }),
  greenShift: z.number({ error: 'Enter the green shift (0 for none)' }),
  lossStops: z
    .number({ error: 'Enter the light loss in stops' })
    .min(0, 'Loss can’t be negative')
    .max(8, 'At most 8 stops'),
});
export type GelPieceValues = z.infer<typeof gelPieceSchema>;

/** Drops empty optional numbers (NaN from an empty number input) so they aren't sent. */
export function definedNumber(value: number | undefined): number | null {
  return value === undefined || Number.isNaN(value) ? null : value;
}
