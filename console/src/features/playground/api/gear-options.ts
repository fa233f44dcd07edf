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

/**
 * How long the gear lists count as current. Gear edited in another browser tab reaches this one
 * only by refetching, which happens on a return to the window (or a remount) once the lists are
 * older than this; a quick switch away and back (a message, another tab for a moment) costs no
 * requests. 30 s: an edit made in another tab takes longer than that to make, so on coming back
 * the lists are normally old enough to refetch, and an edit that slips inside it is seen at the
 * next return after that. Changes made in this tab (the Gear page invalidates `['gear']`) show at
 * once, and saving a setup fetches the lists afresh whatever their age (`useCurrentGear`).
 */
export const GEAR_LISTS_FRESH_MS = 30_000;

const following = { staleTime: GEAR_LISTS_FRESH_MS, refetchOnWindowFocus: true } as const;

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
