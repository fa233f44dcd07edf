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
  CreateModifierRequestDto,
  ModifierListResponseDto,
  ModifierResponseDto,
  UpdateModifierRequestDto,
} from './dto/modifier.dto.js';
import { GearProblems } from './gear-docs.js';
import { toModifierDto } from './gear.mapper.js';
import { ModifiersService } from './modifiers.service.js';

@ApiTags('gear')
@Controller('gear/modifiers')
export class ModifiersController {
  constructor(private readonly modifiers: ModifiersService) {}

  @Get()
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: "The organisation's modifiers, by name." })
  @ApiOkResponse({ type: ModifierListResponseDto })
  @GearProblems()
  async listModifiers(@CurrentPrincipal() p: Principal) {
    return { data: (await this.modifiers.list(p.organizationId)).map(toModifierDto) };
  }

  @Post()
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({
    summary: 'Add a modifier with its light loss (default: the typical loss for its kind).',
  })
  @ApiCreatedResponse({ type: ModifierResponseDto })
  @GearProblems({ write: true })
  async createModifier(@CurrentPrincipal() p: Principal, @Body() body: CreateModifierRequestDto) {
    return toModifierDto(await this.modifiers.create(p.organizationId, body));
  }

  @Get(':id')
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: 'One modifier.' })
  @ApiOkResponse({ type: ModifierResponseDto })
  @GearProblems({ withId: true })
  async getModifier(@CurrentPrincipal() p: Principal, @Param('id') id: string) {
    return toModifierDto(await this.modifiers.get(p.organizationId, id));
  }

  @Patch(':id')
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({ summary: 'Change a modifier.' })
  @ApiOkResponse({ type: ModifierResponseDto })
  @GearProblems({ withId: true, write: true })
  async updateModifier(
    @CurrentPrincipal() p: Principal,
    @Param('id') id: string,
    @Body() body: UpdateModifierRequestDto,
  ) {
    return toModifierDto(await this.modifiers.update(p.organizationId, id, body));
  }

  @Delete(':id')
  @SessionAuth(...can('gear:manage'))
  @HttpCode(204)
  @ApiOperation({
    summary: 'Remove a modifier (saved setups keep the values they were computed with).',
  })
  @ApiNoContentResponse({ description: 'Removed.' })
  @GearProblems({ withId: true })
  async deleteModifier(@CurrentPrincipal() p: Principal, @Param('id') id: string): Promise<void> {
    await this.modifiers.remove(p.organizationId, id);
  }
}
