import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';

type S = components['schemas'];
export type Light = S['LightResponseDto'];
export type Modifier = S['ModifierResponseDto'];
export type GelKit = S['GelKitResponseDto'];
export type GelPiece = S['GelPieceResponseDto'];
export type LightBody = S['CreateLightRequestDto'];
export type ModifierBody = S['CreateModifierRequestDto'];
export type GelPieceBody = S['CreateGelPieceRequestDto'];

/** Query keys for the gear list; every mutation invalidates `gearKeys.all`. */
export const gearKeys = {
  all: ['gear'] as const,
  lights: () => [...gearKeys.all, 'lights'] as const,
  modifiers: () => [...gearKeys.all, 'modifiers'] as const,
  gelKits: () => [...gearKeys.all, 'gel-kits'] as const,
};

export const lightsQueryOptions = () =>
  queryOptions({
    queryKey: gearKeys.lights(),
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/lights', { signal })),
  });
export const useLights = () => useQuery(lightsQueryOptions());

export const modifiersQueryOptions = () =>
  queryOptions({
    queryKey: gearKeys.modifiers(),
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/modifiers', { signal })),
  });
export const useModifiers = () => useQuery(modifiersQueryOptions());

export const gelKitsQueryOptions = () =>
  queryOptions({
    queryKey: gearKeys.gelKits(),
    queryFn: ({ signal }) => unwrap(client.GET('/v1/gear/gel-kits', { signal })),
  });
export const useGelKits = () => useQuery(gelKitsQueryOptions());

function useGearMutation<TInput, TResult>(fn: (input: TInput) => Promise<TResult>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: gearKeys.all }),
  });
}

/** POST /v1/gear/lights or PATCH /v1/gear/lights/{id} */
export function saveLight(input: { id?: string; body: LightBody }): Promise<Light> {
  return input.id
    ? unwrap(
        client.PATCH('/v1/gear/lights/{id}', {
          params: { path: { id: input.id } },
          body: input.body,
        }),
      )
    : unwrap(client.POST('/v1/gear/lights', { body: input.body }));
}
export const useSaveLight = () => useGearMutation(saveLight);

/** DELETE /v1/gear/lights/{id} */
export function deleteLight(id: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/gear/lights/{id}', { params: { path: { id } } }));
}
export const useDeleteLight = () => useGearMutation(deleteLight);

/** POST /v1/gear/modifiers or PATCH /v1/gear/modifiers/{id} */
export function saveModifier(input: { id?: string; body: ModifierBody }): Promise<Modifier> {
  return input.id
    ? unwrap(
        client.PATCH('/v1/gear/modifiers/{id}', {
          params: { path: { id: input.id } },
          body: input.body,
        }),
      )
    : unwrap(client.POST('/v1/gear/modifiers', { body: input.body }));
}
export const useSaveModifier = () => useGearMutation(saveModifier);

/** DELETE /v1/gear/modifiers/{id} */
export function deleteModifier(id: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/gear/modifiers/{id}', { params: { path: { id } } }));
}
export const useDeleteModifier = () => useGearMutation(deleteModifier);

/** POST /v1/gear/gel-kits (name only; pieces are added one by one). */
export function createGelKit(name: string): Promise<GelKit> {
  return unwrap(client.POST('/v1/gear/gel-kits', { body: { name } }));
}
export const useCreateGelKit = () => useGearMutation(createGelKit);

/** DELETE /v1/gear/gel-kits/{id} */
export function deleteGelKit(id: string): Promise<unknown> {
  return unwrap(client.DELETE('/v1/gear/gel-kits/{id}', { params: { path: { id } } }));
}
export const useDeleteGelKit = () => useGearMutation(deleteGelKit);

/** POST /v1/gear/gel-kits/{kitId}/pieces or PATCH …/pieces/{pieceId} */
export function saveGelPiece(input: {
  kitId: string;
  pieceId?: string;
  body: GelPieceBody;
}): Promise<GelPiece> {
  return input.pieceId
    ? unwrap(
        client.PATCH('/v1/gear/gel-kits/{kitId}/pieces/{pieceId}', {
          params: { path: { kitId: input.kitId, pieceId: input.pieceId } },
          body: input.body,
        }),
      )
    : unwrap(
        client.POST('/v1/gear/gel-kits/{kitId}/pieces', {
          params: { path: { kitId: input.kitId } },
          body: input.body,
        }),
      );
}
export const useSaveGelPiece = () => useGearMutation(saveGelPiece);

/** DELETE /v1/gear/gel-kits/{kitId}/pieces/{pieceId} */
export function deleteGelPiece(input: { kitId: string; pieceId: string }): Promise<unknown> {
  return unwrap(
    client.DELETE('/v1/gear/gel-kits/{kitId}/pieces/{pieceId}', {
      params: { path: { kitId: input.kitId, pieceId: input.pieceId } },
    }),
  );
}
export const useDeleteGelPiece = () => useGearMutation(deleteGelPiece);
