import { Body, Controller, Delete, Get, HttpCode, Patch, Post, Req } from '@nestjs/common';
import { ApiNoContentResponse, ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { problem } from '../common/decorators/problem-responses.js';
import type { FastifyRequest } from 'fastify';
import { OrganizationResponseDto } from '../auth/dto/auth.dto.js';
import { toOrganizationDto } from '../auth/me.mapper.js';
import { can } from '../auth/permissions.js';
import { CurrentPrincipal, Meta, RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { SessionManager } from '../auth/session-manager.js';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import { TeamService } from '../team/team.service.js';
import {
  DeleteOrganizationRequestDto,
  TransferOwnershipRequestDto,
  UpdateOrganizationRequestDto,
} from './dto/organization.dto.js';
import { OrganizationsService } from './organizations.service.js';

@ApiTags('organization')
@Controller('organization')
export class OrganizationsController {
  constructor(
    private readonly orgs: OrganizationsService,
    private readonly team: TeamService,
    private readonly sessions: SessionManager,
  ) {}

  @Get()
  @SessionAuth(...can('organization:read'))
  @ApiOperation({ summary: 'The organisation this session acts for.' })
  @ApiOkResponse({ type: OrganizationResponseDto })
  async getOrganization(@CurrentPrincipal() p: SessionPrincipal): Promise<OrganizationResponseDto> {
    return toOrganizationDto(await this.orgs.get(p.organizationId));
  }

  @Patch()
  @SessionAuth(...can('organization:manage'))
  @ApiOperation({ summary: 'Rename the organisation.' })
  @ApiOkResponse({ type: OrganizationResponseDto })
  async updateOrganization(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: UpdateOrganizationRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<OrganizationResponseDto> {
    return toOrganizationDto(await this.orgs.rename(p, body.name, meta));
  }

  @Delete()
  @SessionAuth(...can('organization:delete'))
  @HttpCode(204)
  @ApiOperation({
    summary: 'Delete the organisation with its members, keys, invitations and history.',
  })
  @ApiNoContentResponse()
  @problem(
    409,
    'A subscription is still running (cancel it on the Billing page first, so the payments ' +
      'service stops charging), or other records still refer to this organisation.',
  )
  async deleteOrganization(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: DeleteOrganizationRequestDto,
    @Req() req: FastifyRequest,
  ): Promise<void> {
    await this.orgs.delete(p, body.confirmName);
    await this.sessions.end(req);
  }

  @Post('transfer-ownership')
  @SessionAuth(...can('organization:transfer'))
  @HttpCode(204)
  @ApiOperation({ summary: 'Make another member owner; you become admin.' })
  @ApiNoContentResponse()
  @problem(404, 'No such member in this organisation.')
  async transferOwnership(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: TransferOwnershipRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.team.transferOwnership(p, body.userId, meta);
  }
}
