import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { components } from '@lumenwright/sdk';
import { client, unwrap } from '@/lib/api';
import type { PixelRect } from '../patch';

export type Frame = components['schemas']['FrameListResponseDto']['data'][number];
export type FrameWarning = Frame['warnings'][number];
export type FrameNote = Frame['colour']['notes'][number];

export const frameKeys = {
  all: ['frames'] as const,
  list: () => [...frameKeys.all, 'list'] as const,
};

/** GET /v1/frames: the latest uploads. */
export const framesQueryOptions = () =>
  queryOptions({
    queryKey: frameKeys.list(),
    queryFn: ({ signal }) =>
      unwrap(client.GET('/v1/frames', { params: { query: { limit: 12 } }, signal })),
  });
export const useFrames = () => useQuery(framesQueryOptions());

export interface UploadFrameInput {
  file: File;
  patch: PixelRect | null;
  cameraKelvin?: number;
  /** Sent as Idempotency-Key: the same on a retry of this upload (see upload-key.ts). */
  key: string;
}

/** POST /v1/frames (multipart): stores the frame and measures the patch (or finds one). */
export function uploadFrame(input: UploadFrameInput): Promise<Frame> {
  const form = new FormData();
  if (input.patch) {
    form.set('patchX', String(input.patch.x));
    form.set('patchY', String(input.patch.y));
    form.set('patchWidth', String(input.patch.width));
    form.set('patchHeight', String(input.patch.height));
  }
  if (input.cameraKelvin) form.set('cameraKelvin', String(Math.round(input.cameraKelvin)));
  // Fields first, file last: the server reads the parts in order while streaming.
  form.set('file', input.file, input.file.name);
  return unwrap(
    client.POST('/v1/frames', {
      // openapi-fetch passes FormData through untouched (the browser sets the boundary).
      body: form as unknown as never,
      headers: { 'Idempotency-Key': input.key },
    }),
  ).then((frame) => frame as unknown as Frame);
}

export function useUploadFrame() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadFrame,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: frameKeys.all }),
  });
}

/** DELETE /v1/frames/{id}: the frame, its original and its thumbnail. */
export function deleteFrame(id: string): Promise<void> {
  return unwrap(client.DELETE('/v1/frames/{id}', { params: { path: { id } } })).then(
    () => undefined,
  );
}

export function useDeleteFrame() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteFrame,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: frameKeys.all }),
  });
}
