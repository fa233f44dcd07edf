import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import {
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { can } from '../auth/permissions.js';
import { KeyReadLimited } from '../plans/key-read.decorator.js';
import { CurrentPrincipal } from '../auth/request-context.js';
import { ApiKeyAuth, SessionAuth } from '../common/decorators/access.decorator.js';
import type { Principal } from '../common/guards/access.guard.js';
import {
  CreateGelKitRequestDto,
  CreateGelPieceRequestDto,
  GelKitListResponseDto,
  GelKitResponseDto,
  GelPieceResponseDto,
  UpdateGelKitRequestDto,
  UpdateGelPieceRequestDto,
} from './dto/gel-kit.dto.js';
import { GearProblems } from './gear-docs.js';
import { toGelKitDto, toGelPieceDto } from './gear.mapper.js';
import { GelKitsService } from './gel-kits.service.js';

@ApiTags('gear')
@Controller('gear/gel-kits')
export class GelKitsController {
  constructor(private readonly kits: GelKitsService) {}

  @Get()
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: "The organisation's gel kits with their pieces." })
  @ApiOkResponse({ type: GelKitListResponseDto })
  @GearProblems()
  async listGelKits(@CurrentPrincipal() p: Principal) {
    return { data: (await this.kits.list(p.organizationId)).map(toGelKitDto) };
  }

  @Post()
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({ summary: 'Add a gel kit, optionally with its pieces.' })
  @ApiCreatedResponse({ type: GelKitResponseDto })
  @GearProblems({ write: true })
  async createGelKit(@CurrentPrincipal() p: Principal, @Body() body: CreateGelKitRequestDto) {
    return toGelKitDto(await this.kits.create(p.organizationId, body));
  }

  @Get(':id')
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: 'One gel kit with its pieces.' })
  @ApiOkResponse({ type: GelKitResponseDto })
  @GearProblems({ withId: true })
  async getGelKit(@CurrentPrincipal() p: Principal, @Param('id') id: string) {
    return toGelKitDto(await this.kits.get(p.organizationId, id));
  }

  @Patch(':id')
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({ summary: 'Rename a gel kit or change its notes (pieces have their own routes).' })
  @ApiOkResponse({ type: GelKitResponseDto })
  @GearProblems({ withId: true, write: true })
  async updateGelKit(
    @CurrentPrincipal() p: Principal,
    @Param('id') id: string,
    @Body() body: UpdateGelKitRequestDto,
  ) {
    return toGelKitDto(await this.kits.update(p.organizationId, id, body));
  }

  @Delete(':id')
  @SessionAuth(...can('gear:manage'))
  @HttpCode(204)
  @ApiOperation({ summary: 'Remove a gel kit and its pieces.' })
  @ApiNoContentResponse({ description: 'Removed.' })
  @GearProblems({ withId: true })
  async deleteGelKit(@CurrentPrincipal() p: Principal, @Param('id') id: string): Promise<void> {
    await this.kits.remove(p.organizationId, id);
  }

  @Post(':kitId/pieces')
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({ summary: 'Add a gel to a kit (at most 30 per kit).' })
  @ApiCreatedResponse({ type: GelPieceResponseDto })
  @GearProblems({ withId: true, write: true })
  async addGelPiece(
    @CurrentPrincipal() p: Principal,
    @Param('kitId') kitId: string,
    @Body() body: CreateGelPieceRequestDto,
  ) {
    return toGelPieceDto(await this.kits.addPiece(p.organizationId, kitId, body));
  }

  @Patch(':kitId/pieces/:pieceId')
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({ summary: 'Change one gel of a kit.' })
  @ApiOkResponse({ type: GelPieceResponseDto })
  @GearProblems({ withId: true, write: true })
  async updateGelPiece(
    @CurrentPrincipal() p: Principal,
    @Param('kitId') kitId: string,
    @Param('pieceId') pieceId: string,
    @Body() body: UpdateGelPieceRequestDto,
  ) {
    return toGelPieceDto(await this.kits.updatePiece(p.organizationId, kitId, pieceId, body));
  }

  @Delete(':kitId/pieces/:pieceId')
  @SessionAuth(...can('gear:manage'))
  @HttpCode(204)
  @ApiOperation({ summary: 'Remove one gel from a kit.' })
  @ApiNoContentResponse({ description: 'Removed.' })
  @GearProblems({ withId: true })
  async deleteGelPiece(
    @CurrentPrincipal() p: Principal,
    @Param('kitId') kitId: string,
    @Param('pieceId') pieceId: string,
  ): Promise<void> {
    await this.kits.removePiece(p.organizationId, kitId, pieceId);
  }
}
