// Frame rows as API responses (never the entity itself).
import type { FrameEntity } from './frame.entity.js';

export function toFrameDto(f: FrameEntity) {
  const { patch, colour, exposure, warnings } = f.analysis;
  return {
    id: f.id,
    fileName: f.fileName,
    contentType: f.contentType,
    byteSize: f.byteSize,
    sha256: f.sha256,
    width: f.width,
    height: f.height,
    thumbnailUrl: `/v1/frames/${f.id}/thumbnail`,
    exif: f.exif,
    patch,
    colour,
    exposure,
    warnings,
    createdAt: f.createdAt.toISOString(),
  };
}
