// Reads a `multipart/form-data` frame upload: one `file` part (held in memory, at most the
// configured size: @fastify/multipart stops reading past it) and a few small numeric fields.
// The type is sniffed from the bytes (file-type), never taken from the name or the header.
import { createHash } from 'node:crypto';
import type { FastifyRequest } from 'fastify';
import type {} from '@fastify/multipart';
// 'file-type/core' (buffer detection only): the Jest mapping for the bare 'file-type' points at
// the root copy (v22, Node >= 22), while this workspace pins v21.
import { fileTypeFromBuffer } from 'file-type/core';
import { DomainError, FieldProblem, invalidInput } from '../common/errors/domain-error.js';
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
/** Whole-number range of each form field; the upload body in the spec states the same. */
export const UPLOAD_FIELD_RANGES: Record<FieldName, [number, number]> = {
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
  /** Fields the form carried, valid or not: an invalid value is not a missing one. */
  const sent = new Set<string>();
  const problems: FieldProblem[] = [];
  // One problem per field (a field sent twice, or a file part with a field's name, says it once).
  const refuse = (field: string, reason: string) => {
    if (!problems.some((p) => p.field === field)) problems.push({ field, reason });
  };
  let file: { buf: Buffer; name: string | null } | null = null;
  try {
    for await (const part of req.parts()) {
      if (part.type === 'file') {
        if (part.fieldname !== 'file' || file) {
          part.file.resume();
          refuse(part.fieldname, 'only one file part, named `file`');
          continue;
        }
        file = { buf: await part.toBuffer(), name: part.filename || null };
      } else if ((FIELDS as readonly string[]).includes(part.fieldname)) {
        const name = part.fieldname as FieldName;
        sent.add(name);
        const n = Number(part.value);
        const [min, max] = UPLOAD_FIELD_RANGES[name];
        if (
          typeof part.value !== 'string' ||
          !/^\d+$/.test(part.value.trim()) ||
          n < min ||
          n > max
        ) {
          refuse(name, `must be a whole number from ${min} to ${max}`);
        } else values[name] = n;
      } else {
        refuse(part.fieldname, 'is not a known field');
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
  if (!file) refuse('file', 'is required (a JPEG or PNG image)');
  const PATCH_FIELDS = ['patchX', 'patchY', 'patchWidth', 'patchHeight'] as const;
  const given = PATCH_FIELDS.filter((f) => values[f] !== undefined);
  if (PATCH_FIELDS.some((f) => sent.has(f))) {
    for (const f of PATCH_FIELDS) {
      if (!sent.has(f)) refuse(f, 'is required when any patch field is given');
    }
  }
  if (problems.length || !file) {
    throw invalidInput(problems);
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

const READ = Symbol('frameUpload');
type ReadRequest = FastifyRequest & { [READ]?: FrameUpload };

/** The upload readFrameForKey already read from this request, if it did. */
export function readUploadOf(req: FastifyRequest): FrameUpload | undefined {
  return (req as ReadRequest)[READ];
}

/**
 * An upload carrying an Idempotency-Key is read before the limits are taken (a replay must take
 * nothing): read it once here, keep it on the request for the handler, and identify it by the
 * file's bytes (SHA-256) and the fields that change the answer; the multipart framing (boundary,
 * part order) does not count, so a retry that frames the same form differently is the same
 * request.
 */
export async function readFrameForKey(
  req: FastifyRequest,
  config: { framesMaxBytes: number },
): Promise<string> {
  const up = await readFrameUpload(req, config.framesMaxBytes);
  (req as ReadRequest)[READ] = up;
  return JSON.stringify({
    file: up.sha256,
    fileName: up.fileName,
    patch: up.patch,
    cameraKelvin: up.cameraKelvin,
  });
}
