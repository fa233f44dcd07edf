// Frame rows as API responses (never the entity itself).
import {
  FRAME_NOTE_CODES,
  FRAME_WARNING_CODES,
  type CodedWarning,
  type FrameNoteCode,
  type FrameWarningCode,
} from '@lumenwright/shared';
import type { FrameEntity } from './frame.entity.js';

/**
 * A stored warning or note as the API answers it. Frames analysed before warnings had codes hold
 * plain strings: they read as `unclassified` with the text as the message (the row is not
 * rewritten). An object whose code is not in `codes` (none is written today) reads the same way.
 */
export function readCoded<C extends string>(
  item: unknown,
  codes: readonly C[],
): CodedWarning<C | 'unclassified'> {
  if (typeof item === 'string') return { code: 'unclassified', message: item };
  if (item && typeof item === 'object') {
    const { code, message } = item as { code?: unknown; message?: unknown };
    const text = typeof message === 'string' ? message : '';
    if (typeof code === 'string' && (codes as readonly string[]).includes(code)) {
      return { code: code as C, message: text };
    }
    return { code: 'unclassified', message: text };
  }
  return { code: 'unclassified', message: String(item) };
}

const readList = <C extends string>(items: unknown, codes: readonly C[]) =>
  Array.isArray(items) ? items.map((i) => readCoded(i, codes)) : [];

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
    colour: {
      ...colour,
      notes: readList<FrameNoteCode>(colour.notes, FRAME_NOTE_CODES),
    },
    exposure,
    warnings: readList<FrameWarningCode>(warnings, FRAME_WARNING_CODES),
    createdAt: f.createdAt.toISOString(),
  };
}
