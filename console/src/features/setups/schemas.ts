import { z } from 'zod';
import type { CreateSavedSetupBody } from './api/setups';

const number = (message: string) => z.number({ error: message });

/** The quick "save a setup" form: where, when, and the key light; the server plans the rest. */
export const saveSetupSchema = z.object({
  name: z.string().trim().min(1, 'Name the setup').max(100, 'Use at most 100 characters'),
  venue: z.string().trim().max(200, 'Use at most 200 characters'),
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Pick the shoot date'),
  timeZone: z.string().trim().min(1, 'Enter an IANA time zone, e.g. Europe/Lisbon').max(64),
  latitude: number('Enter the latitude')
    .min(-90, 'Between -90 and 90')
    .max(90, 'Between -90 and 90'),
  longitude: number('Enter the longitude')
    .min(-180, 'Between -180 and 180')
    .max(180, 'Between -180 and 180'),
  keyGuideNumber: number('Enter the key light’s guide number (m, ISO 100)').positive(
    'Must be above 0',
  ),
  keyDistance: number('Enter the key light’s distance in metres').positive('Must be above 0'),
  notes: z.string().max(2000, 'Use at most 2000 characters'),
});
export type SaveSetupValues = z.infer<typeof saveSetupSchema>;

export function toCreateSetupBody(values: SaveSetupValues): CreateSavedSetupBody {
  return {
    name: values.name,
    ...(values.venue ? { venue: values.venue } : {}),
    ...(values.notes ? { notes: values.notes } : {}),
    inputs: {
      date: values.date,
      timeZone: values.timeZone,
      latitude: values.latitude,
      longitude: values.longitude,
      key: {
        guideNumber: values.keyGuideNumber,
        guideNumberUnit: 'm',
        distance: values.keyDistance,
        distanceUnit: 'm',
      },
    },
  };
}

/** Server field paths (`inputs.key.guideNumber`) mapped to the form's fields. */
export const setupFieldMap = {
  'inputs.date': 'date',
  'inputs.timeZone': 'timeZone',
  'inputs.latitude': 'latitude',
  'inputs.longitude': 'longitude',
  'inputs.key.guideNumber': 'keyGuideNumber',
  'inputs.key.distance': 'keyDistance',
} as const;

/** Where a saved setup reopens: the playground's setup tab, told which setup to load. */
export function playgroundHref(playgroundPath: string, id: string): string {
  return `${playgroundPath}?setup=${encodeURIComponent(id)}&calc=setup`;
}
