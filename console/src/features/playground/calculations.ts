/** The playground's calculations, their tabs and the API operation that confirms each. */
export const calculations = [
  { id: 'twilight', label: 'Twilight', path: '/v1/twilight' },
  { id: 'timeline', label: 'Evening plan', path: '/v1/timeline' },
  { id: 'exposure', label: 'Background', path: '/v1/exposure' },
  { id: 'flash', label: 'Flash', path: '/v1/flash' },
  { id: 'falloff', label: 'Falloff', path: '/v1/falloff' },
  { id: 'backlight', label: 'Backlight', path: '/v1/backlight' },
  { id: 'balance', label: 'Gels', path: '/v1/balance' },
  { id: 'setup', label: 'Dusk setup', path: '/v1/setup' },
] as const;

export type CalculationId = (typeof calculations)[number]['id'];

export function calculationById(id: string | null | undefined) {
  return calculations.find((calculation) => calculation.id === id);
}
