import { queryOptions, useQuery } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

type S = components['schemas'];
export type GearLight = S['LightResponseDto'];
export type GearModifier = S['ModifierResponseDto'];
export type GearGelKit = S['GelKitResponseDto'];

/**
 * Same query keys as the Gear page's lists, so both share one cache entry and see each other's
 * changes (the Gear page invalidates `['gear']` after every change).
 */
export const gearOptionKeys = {
  lights: ['gear', 'lights'] as const,
  modifiers: ['gear', 'modifiers'] as const,
  gelKits: ['gear', 'gel-kits'] as const,
};

// Gear edited in another browser tab reaches this one only by refetching: on every return to the
// window ('always', not only once stale), so a pick is compared with the gear as it is now.
const following = { staleTime: 60_000, refetchOnWindowFocus: 'always' } as const;

export const gearLightsQuery = queryOptions({
  queryKey: gearOptionKeys.lights,
  queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/lights', { signal })),
  ...following,
});

export const gearModifiersQuery = queryOptions({
  queryKey: gearOptionKeys.modifiers,
  queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/modifiers', { signal })),
  ...following,
});

export const gearGelKitsQuery = queryOptions({
  queryKey: gearOptionKeys.gelKits,
  queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/gel-kits', { signal })),
  ...following,
});

/** The studio's lights, modifiers and gel kits, for the playground's "from your gear" pickers. */
export const useGearLights = () => useQuery(gearLightsQuery);
export const useGearModifiers = () => useQuery(gearModifiersQuery);
export const useGearGelKits = () => useQuery(gearGelKitsQuery);
