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
  CreateLightRequestDto,
  LightListResponseDto,
  LightResponseDto,
  UpdateLightRequestDto,
} from './dto/light.dto.js';
import { GearProblems } from './gear-docs.js';
import { toLightDto } from './gear.mapper.js';
import { LightsService } from './lights.service.js';

@ApiTags('gear')
@Controller('gear/lights')
export class LightsController {
  constructor(private readonly lights: LightsService) {}

  @Get()
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: "The organisation's lights, by name." })
  @ApiOkResponse({ type: LightListResponseDto })
  @GearProblems()
  async listLights(@CurrentPrincipal() p: Principal) {
    return { data: (await this.lights.list(p.organizationId)).map(toLightDto) };
  }

  @Post()
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({
    summary: 'Add a light: a rated guide number, or a meter reading to derive it from.',
  })
  @ApiCreatedResponse({ type: LightResponseDto })
  @GearProblems({ write: true })
  async createLight(@CurrentPrincipal() p: Principal, @Body() body: CreateLightRequestDto) {
    return toLightDto(await this.lights.create(p.organizationId, body));
  }

  @Get(':id')
  @ApiKeyAuth(...can('gear:read'))
  @KeyReadLimited()
  @ApiOperation({ summary: 'One light.' })
  @ApiOkResponse({ type: LightResponseDto })
  @GearProblems({ withId: true })
  async getLight(@CurrentPrincipal() p: Principal, @Param('id') id: string) {
    return toLightDto(await this.lights.get(p.organizationId, id));
  }

  @Patch(':id')
  @SessionAuth(...can('gear:manage'))
  @ApiOperation({
    summary: 'Change a light (a new guide number or meter reading replaces the old).',
  })
  @ApiOkResponse({ type: LightResponseDto })
  @GearProblems({ withId: true, write: true })
  async updateLight(
    @CurrentPrincipal() p: Principal,
    @Param('id') id: string,
    @Body() body: UpdateLightRequestDto,
  ) {
    return toLightDto(await this.lights.update(p.organizationId, id, body));
  }

  @Delete(':id')
  @SessionAuth(...can('gear:manage'))
  @HttpCode(204)
  @ApiOperation({
    summary: 'Remove a light (saved setups keep the values they were computed with).',
  })
  @ApiNoContentResponse({ description: 'Removed.' })
  @GearProblems({ withId: true })
  async deleteLight(@CurrentPrincipal() p: Principal, @Param('id') id: string): Promise<void> {
    await this.lights.remove(p.organizationId, id);
  }
}
