import { Controller, Delete, Get, HttpCode, Param, Post, Query, Req, Res } from '@nestjs/common';
import { RouteConfig } from '@nestjs/platform-fastify';
import {
  ApiBody,
  ApiConsumes,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiProduces,
  ApiResponse,
  ApiTags,
} from '@nestjs/swagger';
import type { FastifyReply } from 'fastify';
import { requestMeta } from '../auth/request-context.js';
import { ApiKeyAuth } from '../common/decorators/access.decorator.js';
import { meteredTooManyRequests, problem } from '../common/decorators/problem-responses.js';
import type { RequestWithPrincipal } from '../common/guards/access.guard.js';
import { ApiQueryFromSchema, QuerySchemaPipe } from '../compute/validation/schema-dto.js';
import { KeyReadLimited } from '../plans/key-read.decorator.js';
import type { IdempotentRouteConfig } from '../idempotency/idempotency.hook.js';
import { IdempotentBody } from '../idempotency/idempotency.guard.js';
import {
  IDEMPOTENCY_REPLAYED_DOC,
  IdempotentMeteredCall,
} from '../idempotency/idempotent.decorator.js';
import type { MeterRouteConfig } from '../usage/metering.hook.js';
import { FrameListResponseDto, FrameResponseDto } from './dto/frame.dto.js';
import { toFrameDto } from './frame.mapper.js';
import { FramesService } from './frames.service.js';
import { FrameIdPipe } from './frame-id.pipe.js';
import { readFrameForKey, UPLOAD_FIELD_RANGES } from './upload-reader.js';

/** The 404 of a route with a frame id (FrameIdPipe: an id that is not a UUID names no frame). */
const FRAME_NOT_FOUND =
  'No such frame in your organisation; an id that is not a UUID names none (`errors` names `id`).';

/** A whole-number form field of the upload, with the range the reader enforces. */
const uploadInt = (name: keyof typeof UPLOAD_FIELD_RANGES, description: string) => {
  const [minimum, maximum] = UPLOAD_FIELD_RANGES[name];
  return {
    type: 'integer',
    minimum,
    maximum,
    description: `${description} Whole number, ${minimum} to ${maximum}.`,
  };
};

const listQuery = {
  type: 'object' as const,
  additionalProperties: false,
  properties: {
    limit: {
      type: 'integer' as const,
      minimum: 1,
      maximum: 100,
      default: 20,
      example: 20,
      description: 'Page size, a whole number from 1 to 100 (default 20).',
    },
    cursor: {
      type: 'string' as const,
      maxLength: 100,
      description: 'nextCursor of the previous page.',
    },
  },
};

@ApiTags('frames')
@Controller('frames')
export class FramesController {
  constructor(private readonly frames: FramesService) {}

  @Post()
  @ApiKeyAuth()
  // An upload is a metered call like a computation: rate limit, monthly quota, usage event, and
  // one billable unit for a stored frame on a live key. With an Idempotency-Key, a retried
  // upload is answered from the first one's stored answer (no second frame, object or event).
  @IdempotentMeteredCall()
  @IdempotentBody(readFrameForKey, FramesService)
  @RouteConfig({ meter: 'frames', idempotent: true } satisfies MeterRouteConfig &
    IdempotentRouteConfig)
  @HttpCode(201)
  @ApiOperation({
    summary:
      'Upload a test frame (JPEG or PNG, at most 25 MB): EXIF, neutral-patch colour (CCT, Duv, mired offset), the white-balance or gel correction, and a scene EV estimate.',
  })
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: {
        file: {
          // A binary part (OpenAPI 3.1 `contentMediaType`; `format: binary` for 3.0-era tools):
          // the generated SDK types it as a Blob, not a string.
          type: 'string',
          format: 'binary',
          // (the decorator's types predate OpenAPI 3.1's keyword)
          ...({ contentMediaType: 'application/octet-stream' } as object),
          description:
            'The image, JPEG or PNG, at most 25 MB; its type is read from its content. Send it after the other fields.',
        },
        patchX: uploadInt(
          'patchX',
          'Neutral patch left edge, pixels (upright image). Give all four or none.',
        ),
        patchY: uploadInt('patchY', 'Neutral patch top edge, pixels.'),
        patchWidth: uploadInt('patchWidth', 'Neutral patch width, pixels.'),
        patchHeight: uploadInt('patchHeight', 'Neutral patch height, pixels.'),
        cameraKelvin: uploadInt('cameraKelvin', 'The white balance the frame was shot at, kelvin.'),
      },
    },
  })
  @ApiResponse({ status: 201, type: FrameResponseDto, headers: IDEMPOTENCY_REPLAYED_DOC })
  @problem(403, 'The plan does not include uploads (type …/plan-feature-missing).')
  @problem(413, 'The file is larger than 25 MB.')
  @meteredTooManyRequests()
  @problem(415, 'Not multipart, or the file is not JPEG or PNG (HEIC is not accepted).')
  @problem(
    422,
    'A field is invalid, the patch is outside the image, or the file is corrupt; or the ' +
      'Idempotency-Key is malformed (…/invalid-input) or was used with a different upload ' +
      '(…/idempotency-key-reused).',
  )
  async uploadFrame(@Req() req: RequestWithPrincipal) {
    return toFrameDto(await this.frames.upload(req, req.principal!));
  }

  @Get()
  @ApiKeyAuth()
  @KeyReadLimited()
  @ApiOperation({ summary: "Your organisation's test frames, newest first." })
  @ApiQueryFromSchema(listQuery)
  @ApiOkResponse({ type: FrameListResponseDto })
  async listFrames(
    @Req() req: RequestWithPrincipal,
    @Query(new QuerySchemaPipe(listQuery)) q: { limit?: number; cursor?: string },
  ) {
    const page = await this.frames.list(req.principal!.organizationId, q.limit ?? 20, q.cursor);
    return { data: page.data.map(toFrameDto), nextCursor: page.nextCursor };
  }

  @Get(':id')
  @ApiKeyAuth()
  @KeyReadLimited()
  @ApiOperation({ summary: 'One test frame and its analysis.' })
  @ApiOkResponse({ type: FrameResponseDto })
  @problem(404, FRAME_NOT_FOUND)
  async getFrame(@Req() req: RequestWithPrincipal, @Param('id', new FrameIdPipe()) id: string) {
    return toFrameDto(await this.frames.get(req.principal!.organizationId, id));
  }

  @Delete(':id')
  @ApiKeyAuth()
  @KeyReadLimited('Deletions')
  @HttpCode(204)
  @ApiOperation({
    summary: 'Delete a test frame: its analysis, the original and the thumbnail.',
    description:
      'With the key that uploaded it (or any key or member of the organisation). Uses no quota ' +
      'and is not metered; the key’s rate limit applies. A frame shows people: delete what you ' +
      'no longer need.',
  })
  @ApiNoContentResponse({ description: 'Deleted.' })
  @problem(404, FRAME_NOT_FOUND)
  async deleteFrame(
    @Req() req: RequestWithPrincipal,
    @Param('id', new FrameIdPipe()) id: string,
  ): Promise<void> {
    await this.frames.remove(req.principal!, id, requestMeta(req));
  }

  @Get(':id/thumbnail')
  @ApiKeyAuth()
  @KeyReadLimited()
  @ApiOperation({ summary: 'The JPEG thumbnail of a test frame (at most 320 px).' })
  @ApiProduces('image/jpeg')
  @ApiOkResponse({ description: 'JPEG image.' })
  @problem(404, FRAME_NOT_FOUND)
  async getFrameThumbnail(
    @Req() req: RequestWithPrincipal,
    @Param('id', new FrameIdPipe()) id: string,
    @Res() reply: FastifyReply,
  ) {
    const obj = await this.frames.thumbnail(req.principal!.organizationId, id);
    void reply
      .header('Cache-Control', 'private, max-age=3600')
      .header('X-Content-Type-Options', 'nosniff')
      .type(obj.contentType);
    return reply.send(obj.body);
  }
}
