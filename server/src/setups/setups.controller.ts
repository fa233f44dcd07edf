import {
  Body,
  Controller,
  Delete,
  Get,
  Header,
  HttpCode,
  Param,
  Patch,
  Post,
  Query,
} from '@nestjs/common';
import {
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import { RouteConfig } from '@nestjs/platform-fastify';
import {
  CurrentPrincipal,
  Meta,
  type RequestMeta,
  type SessionPrincipal,
} from '../auth/request-context.js';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import type { PageRouteConfig } from '../common/http/security-headers.js';
import { can } from '../auth/permissions.js';
import type { Principal } from '../common/guards/access.guard.js';
import { GearProblems, problem } from '../gear/gear-docs.js';
import {
  CreateSavedSetupRequestDto,
  DuplicateSavedSetupRequestDto,
  ListSavedSetupsQueryDto,
  SavedSetupPageResponseDto,
  SavedSetupResponseDto,
  UpcomingSetupsQueryDto,
  UpcomingSetupsResponseDto,
  UpdateSavedSetupRequestDto,
} from './dto/setup.dto.js';
import { toSavedSetupDto } from './setup.mapper.js';
import { SetupsService } from './setups.service.js';
import { renderShotSheet } from './sheet/shot-sheet.js';

/** Everyone in the organisation reads saved setups; developers do not edit them. */
const READERS = can('setups:read');
const EDITORS = can('setups:manage');

@ApiTags('setups')
@Controller('setups')
export class SetupsController {
  constructor(private readonly setups: SetupsService) {}

  @Get()
  @SessionAuth(...READERS)
  @ApiOperation({ summary: 'Saved setups, newest first; `q` searches name, venue and notes.' })
  @ApiOkResponse({ type: SavedSetupPageResponseDto })
  @GearProblems()
  listSetups(@CurrentPrincipal() p: Principal, @Query() q: ListSavedSetupsQueryDto) {
    return this.setups.list(p, { limit: q.limit ?? 20, cursor: q.cursor, q: q.q });
  }

  @Post()
  @SessionAuth(...EDITORS)
  @ApiOperation({
    summary: 'Save a setup: the plan is computed from the inputs (gear may be named by id).',
  })
  @ApiCreatedResponse({ type: SavedSetupResponseDto })
  @GearProblems({ write: true })
  @problem(
    403,
    'The plan’s saved-setups limit is reached (`limit: "savedSetups"`, `limitValue`, `count`, `planCode`).',
  )
  @problem(404, 'A gear id in the inputs is not in your organisation; `errors` names the field.')
  async createSetup(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: CreateSavedSetupRequestDto,
  ) {
    return toSavedSetupDto(await this.setups.create(p, body));
  }

  @Get('upcoming')
  @SessionAuth(...READERS)
  @ApiOperation({
    summary:
      'The next shoots, soonest first: setups whose shooting window has not ended (a setup with ' +
      'no window, in polar day or night, until its local date ends).',
  })
  @ApiOkResponse({ type: UpcomingSetupsResponseDto })
  @GearProblems()
  async upcomingSetups(@CurrentPrincipal() p: Principal, @Query() q: UpcomingSetupsQueryDto) {
    return { data: await this.setups.upcoming(p, q.limit ?? 3) };
  }

  @Get(':id')
  @SessionAuth(...READERS)
  @ApiOperation({ summary: 'One saved setup with its inputs and plan.' })
  @ApiOkResponse({ type: SavedSetupResponseDto })
  @GearProblems({ withId: true })
  async getSetup(@CurrentPrincipal() p: Principal, @Param('id') id: string) {
    return toSavedSetupDto(await this.setups.get(p.organizationId, id));
  }

  @Patch(':id')
  @SessionAuth(...EDITORS)
  @ApiOperation({
    summary: 'Rename, re-describe, or send new inputs (the plan is computed again).',
  })
  @ApiOkResponse({ type: SavedSetupResponseDto })
  @GearProblems({ withId: true, write: true })
  async updateSetup(
    @CurrentPrincipal() p: Principal,
    @Param('id') id: string,
    @Body() body: UpdateSavedSetupRequestDto,
  ) {
    return toSavedSetupDto(await this.setups.update(p, id, body));
  }

  @Post(':id/duplicate')
  @SessionAuth(...EDITORS)
  @ApiOperation({ summary: 'Copy a saved setup (counts against the plan’s saved-setups limit).' })
  @ApiCreatedResponse({ type: SavedSetupResponseDto })
  @GearProblems({ withId: true, write: true })
  @problem(
    403,
    'The plan’s saved-setups limit is reached (`limit: "savedSetups"`, `limitValue`, `count`, `planCode`).',
  )
  async duplicateSetup(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
    @Body() body: DuplicateSavedSetupRequestDto,
  ) {
    return toSavedSetupDto(await this.setups.duplicate(p, id, body));
  }

  @Delete(':id')
  @SessionAuth(...EDITORS)
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a saved setup.' })
  @ApiNoContentResponse({ description: 'Deleted.' })
  @GearProblems({ withId: true })
  async deleteSetup(
    @CurrentPrincipal() p: Principal,
    @Param('id') id: string,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.setups.remove(p, id, meta);
  }

  @Get(':id/sheet')
  @SessionAuth(...READERS)
  @RouteConfig({ page: true } satisfies PageRouteConfig)
  @Header('Content-Type', 'text/html; charset=utf-8')
  @Header('Cache-Control', 'private, no-store')
  @ApiOperation({ summary: 'A print-ready HTML shot sheet: plan, diagram, gels, cautions.' })
  @ApiProduces('text/html')
  @ApiOkResponse({
    description: 'The sheet.',
    content: { 'text/html': { schema: { type: 'string' } } },
  })
  @GearProblems({ withId: true })
  async getSetupSheet(@CurrentPrincipal() p: Principal, @Param('id') id: string): Promise<string> {
    const s = await this.setups.get(p.organizationId, id);
    return renderShotSheet({
      name: s.name,
      venue: s.venue,
      notes: s.notes,
      date: s.shootDate,
      timeZone: s.timeZone,
      author: s.createdBy?.name ?? null,
      plan: s.plan,
      resolvedInputs: s.resolvedInputs,
    });
  }
}
