// Reads a `multipart/form-data` frame upload: one `file` part (held in memory, at most the
// configured size: @fastify/multipart stops reading past it) and a few small numeric fields.
// The type is sniffed from the bytes (file-type), never taken from the name or the header.
import { createHash } from 'node:crypto';
import type { FastifyRequest } from 'fastify';
import type {} from '@fastify/multipart';
// 'file-type/core' (buffer detection only): the Jest mapping for the bare 'file-type' points at
// the root copy (v22, Node >= 22), while this workspace pins v21.
import { fileTypeFromBuffer } from 'file-type/core';
import { DomainError, FieldProblem } from '../common/errors/domain-error.js';
import type { Rect } from './analysis/patch.js';

export const ACCEPTED_TYPES: Record<string, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
};

export interface FrameUpload {
  buf: Buffer;
  contentType: string;
  fileName: string | null;
  sha256: string;
  patch: Rect | null;
  cameraKelvin: number | null;
}

const FIELDS = ['patchX', 'patchY', 'patchWidth', 'patchHeight', 'cameraKelvin'] as const;
type FieldName = (typeof FIELDS)[number];
const RANGES: Record<FieldName, [number, number]> = {
  patchX: [0, 100_000],
  patchY: [0, 100_000],
  patchWidth: [1, 100_000],
  patchHeight: [1, 100_000],
  cameraKelvin: [1500, 20000],
};

export async function readFrameUpload(req: FastifyRequest, maxBytes: number): Promise<FrameUpload> {
  if (!req.isMultipart()) {
    throw new DomainError('unsupported_media_type', 'Send the frame as multipart/form-data.', [
      { field: 'body', reason: 'must be multipart/form-data with a `file` part' },
    ]);
  }
  const values: Partial<Record<FieldName, number>> = {};
  const problems: FieldProblem[] = [];
  let file: { buf: Buffer; name: string | null } | null = null;
  try {
    for await (const part of req.parts()) {
      if (part.type === 'file') {
        if (part.fieldname !== 'file' || file) {
          part.file.resume();
          problems.push({ field: part.fieldname, reason: 'only one file part, named `file`' });
          continue;
        }
        file = { buf: await part.toBuffer(), name: part.filename || null };
      } else if ((FIELDS as readonly string[]).includes(part.fieldname)) {
        const name = part.fieldname as FieldName;
        const n = Number(part.value);
        const [min, max] = RANGES[name];
        if (
          typeof part.value !== 'string' ||
          !/^\d+$/.test(part.value.trim()) ||
          n < min ||
          n > max
        ) {
          problems.push({ field: name, reason: `must be an integer from ${min} to ${max}` });
        } else values[name] = n;
      } else {
        problems.push({ field: part.fieldname, reason: 'is not a known field' });
      }
    }
  } catch (e) {
    const code = (e as { code?: string }).code;
    if (code === 'FST_REQ_FILE_TOO_LARGE') {
      throw new DomainError('payload_too_large', `The file is larger than ${maxBytes} bytes.`, [
        { field: 'file', reason: `must be at most ${maxBytes} bytes` },
      ]);
    }
    if (code === 'FST_FILES_LIMIT' || code === 'FST_PARTS_LIMIT' || code === 'FST_FIELDS_LIMIT') {
      throw new DomainError('payload_too_large', 'The form has too many parts.', [
        { field: 'body', reason: 'send one `file` part and at most the documented fields' },
      ]);
    }
    throw e;
  }
  if (!file) problems.push({ field: 'file', reason: 'is required (a JPEG or PNG image)' });
  const given = (['patchX', 'patchY', 'patchWidth', 'patchHeight'] as const).filter(
    (f) => values[f] !== undefined,
  );
  if (given.length > 0 && given.length < 4) {
    for (const f of ['patchX', 'patchY', 'patchWidth', 'patchHeight'] as const) {
      if (values[f] === undefined) {
        problems.push({ field: f, reason: 'is required when any patch field is given' });
      }
    }
  }
  if (problems.length || !file) {
    throw new DomainError('invalid_input', 'Some fields are missing or invalid.', problems);
  }
  if (file.buf.length === 0) {
    throw new DomainError('invalid_input', 'The file is empty.', [
      { field: 'file', reason: 'is empty' },
    ]);
  }
  const sniffed = await fileTypeFromBuffer(file.buf);
  if (!sniffed || !ACCEPTED_TYPES[sniffed.mime]) {
    const what = sniffed ? `${sniffed.mime}` : 'not a recognised file type';
    const heic = sniffed && /heic|heif|avif/.test(sniffed.mime);
    throw new DomainError(
      'unsupported_media_type',
      heic
        ? `HEIC/HEIF is not accepted: this server's image library cannot decode it. Send JPEG or PNG.`
        : `The file is ${what}; send a JPEG or PNG image.`,
      [{ field: 'file', reason: `must be image/jpeg or image/png (the content is ${what})` }],
    );
  }
  const patch =
    given.length === 4
      ? {
          x: values.patchX!,
          y: values.patchY!,
          width: values.patchWidth!,
          height: values.patchHeight!,
        }
      : null;
  return {
    buf: file.buf,
    contentType: sniffed.mime,
    fileName: file.name ? file.name.slice(0, 200) : null,
    sha256: createHash('sha256').update(file.buf).digest('hex'),
    patch,
    cameraKelvin: values.cameraKelvin ?? null,
  };
}
