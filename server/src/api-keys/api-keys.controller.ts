import { Body, Controller, Delete, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import {
  ApiCreatedResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { problem } from '../common/decorators/problem-responses.js';
import { PageQueryDto } from '../audit/dto/page-query.dto.js';
import { can } from '../auth/permissions.js';
import { CurrentPrincipal, Meta, RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import { toApiKeyDto } from './api-key.mapper.js';
import { ApiKeysService } from './api-keys.service.js';
import {
  ApiKeyCreatedResponseDto,
  ApiKeyPageResponseDto,
  ApiKeyResponseDto,
  CreateApiKeyRequestDto,
  RotateApiKeyRequestDto,
} from './dto/api-key.dto.js';

/** Key management is for console sessions only: a key can never create or revoke keys. */
@ApiTags('keys')
@Controller('keys')
export class ApiKeysController {
  constructor(private readonly keys: ApiKeysService) {}

  @Post()
  @SessionAuth(...can('keys:manage-own'))
  @ApiOperation({ summary: 'Create an API key. The secret is in this response only.' })
  @ApiCreatedResponse({ type: ApiKeyCreatedResponseDto })
  async createApiKey(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: CreateApiKeyRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<ApiKeyCreatedResponseDto> {
    const { key, secret } = await this.keys.create(p, body, meta);
    return { ...toApiKeyDto(key), secret };
  }

  @Get()
  @SessionAuth(...can('keys:manage-own'))
  @ApiOperation({
    summary: "List keys (owners and admins: all of the organisation's; developers: their own).",
  })
  @ApiOkResponse({ type: ApiKeyPageResponseDto })
  async listApiKeys(
    @CurrentPrincipal() p: SessionPrincipal,
    @Query() q: PageQueryDto,
  ): Promise<ApiKeyPageResponseDto> {
    const page = await this.keys.list(p, q.limit ?? 20, q.cursor);
    return { data: page.data.map(toApiKeyDto), nextCursor: page.nextCursor };
  }

  @Get(':id')
  @SessionAuth(...can('keys:manage-own'))
  @ApiOperation({ summary: 'One key (never its secret).' })
  @ApiOkResponse({ type: ApiKeyResponseDto })
  @ApiNotFoundResponse({ description: 'No such key in your organisation, or not yours to manage.' })
  async getApiKey(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
  ): Promise<ApiKeyResponseDto> {
    return toApiKeyDto(await this.keys.get(p, id));
  }

  @Delete(':id')
  @SessionAuth(...can('keys:manage-own'))
  @HttpCode(200)
  @ApiOperation({ summary: 'Revoke a key: refused from the very next request, on every instance.' })
  @ApiOkResponse({ type: ApiKeyResponseDto })
  async revokeApiKey(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
    @Meta() meta: RequestMeta,
  ): Promise<ApiKeyResponseDto> {
    return toApiKeyDto(await this.keys.revoke(p, id, meta));
  }

  @Post(':id/rotate')
  @SessionAuth(...can('keys:manage-own'))
  @ApiOperation({
    summary: 'Issue a new secret; the old one works for the grace period you choose.',
  })
  @ApiCreatedResponse({ type: ApiKeyCreatedResponseDto })
  @problem(409, 'A revoked or expired key cannot be rotated; create a new key.')
  async rotateApiKey(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
    @Body() body: RotateApiKeyRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<ApiKeyCreatedResponseDto> {
    const { key, secret } = await this.keys.rotate(p, id, body.gracePeriodSeconds ?? 86400, meta);
    return { ...toApiKeyDto(key), secret };
  }
}
