import { z } from 'zod';

/** Create-key form: a name, an environment, and an optional expiry date in the future. */
export function createKeySchema(today: string) {
  return z.object({
    name: z.string().trim().min(1, 'Name the key after the app that uses it').max(100),
    environment: z.enum(['test', 'live']),
    expiresOn: z
      .string()
      .refine((value) => value === '' || /^\d{4}-\d{2}-\d{2}$/.test(value), 'Use a date')
      .refine((value) => value === '' || value > today, 'Pick a date after today'),
  });
}
export type CreateKeyValues = z.infer<ReturnType<typeof createKeySchema>>;

/** The request body: an expiry date becomes the end of that day in UTC. */
export function toCreateKeyBody(values: CreateKeyValues) {
  return {
    name: values.name,
    environment: values.environment,
    ...(values.expiresOn ? { expiresAt: `${values.expiresOn}T23:59:59.000Z` } : {}),
  };
}

export const GRACE_PERIODS = [
  { value: '0', label: 'None: the old secret stops now' },
  { value: '3600', label: '1 hour' },
  { value: '86400', label: '24 hours' },
  { value: '604800', label: '7 days' },
] as const;
