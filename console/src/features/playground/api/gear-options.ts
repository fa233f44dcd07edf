import { useQuery } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

type S = components['schemas'];
export type GearLight = S['LightResponseDto'];
export type GearModifier = S['ModifierResponseDto'];
export type GearGelKit = S['GelKitResponseDto'];

/**
 * The studio's lights, modifiers and gel kits, for the playground's "from your gear" pickers. Same query
 * keys as the Gear page's lists, so both share one cache entry and see each other's changes.
 */
export const useGearLights = () =>
  useQuery({
    queryKey: ['gear', 'lights'] as const,
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/lights', { signal })),
    staleTime: 60_000,
  });

export const useGearModifiers = () =>
  useQuery({
    queryKey: ['gear', 'modifiers'] as const,
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/modifiers', { signal })),
    staleTime: 60_000,
  });

export const useGearGelKits = () =>
  useQuery({
    queryKey: ['gear', 'gel-kits'] as const,
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/gel-kits', { signal })),
    staleTime: 60_000,
  });
