import { Body, Controller, Get, HttpCode, Patch, Post, Req } from '@nestjs/common';
import {
  ApiAcceptedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { problem } from '../common/decorators/problem-responses.js';
import type { FastifyRequest } from 'fastify';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import { DomainError } from '../common/errors/domain-error.js';
import { AuthService } from './auth.service.js';
import {
  AcceptedResponseDto,
  ChangePasswordRequestDto,
  EmailChangeRequestDto,
  EmailStateResponseDto,
  MeResponseDto,
  MyOrganizationsResponseDto,
  SwitchOrganizationRequestDto,
  UpdateProfileRequestDto,
} from './dto/auth.dto.js';
import { toMeDto, toOrganizationDto } from './me.mapper.js';
import { can } from './permissions.js';
import { CurrentPrincipal, Meta, RequestMeta, SessionPrincipal } from './request-context.js';
import { SessionManager } from './session-manager.js';

@ApiTags('me')
@Controller('me')
export class MeController {
  constructor(
    private readonly auth: AuthService,
    private readonly sessions: SessionManager,
  ) {}

  @Get()
  @SessionAuth(...can('profile:manage'))
  @ApiOperation({
    summary: 'The signed-in user, the organisation this session acts for, and the role.',
  })
  @ApiOkResponse({ type: MeResponseDto })
  async getMe(@CurrentPrincipal() p: SessionPrincipal): Promise<MeResponseDto> {
    const s = await this.auth.me(p.userId, p.organizationId);
    return toMeDto(s.user, s.organization, s.role);
  }

  @Patch()
  @SessionAuth(...can('profile:manage'))
  @ApiOperation({
    summary: 'Update your own name and/or preferences (send at least one).',
  })
  @ApiOkResponse({ type: MeResponseDto })
  async updateMe(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: UpdateProfileRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<MeResponseDto> {
    await this.auth.updateProfile(
      p.userId,
      { name: body.name, lengthUnit: body.preferences?.lengthUnit },
      meta,
    );
    const s = await this.auth.me(p.userId, p.organizationId);
    return toMeDto(s.user, s.organization, s.role);
  }

  @Post('password')
  @SessionAuth(...can('profile:manage'))
  @HttpCode(204)
  @ApiOperation({ summary: 'Change your password; your other sessions end.' })
  @ApiNoContentResponse()
  async changePassword(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: ChangePasswordRequestDto,
    @Req() req: FastifyRequest,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.auth.changePassword(
      p.userId,
      body.currentPassword,
      body.newPassword,
      req.session.sessionId,
      meta,
    );
  }

  @Get('email')
  @SessionAuth(...can('profile:manage'))
  @ApiOperation({
    summary: 'Your sign-in address, and an asked-for change still waiting for its confirmation.',
  })
  @ApiOkResponse({ type: EmailStateResponseDto })
  getMyEmail(@CurrentPrincipal() p: SessionPrincipal): Promise<EmailStateResponseDto> {
    return this.auth.emailState(p.userId);
  }

  @Post('email')
  @SessionAuth(...can('profile:manage'))
  @HttpCode(202)
  @ApiOperation({
    summary: 'Ask to change your sign-in address; a confirmation link goes to the new one.',
  })
  @ApiAcceptedResponse({ type: AcceptedResponseDto })
  @problem(409, 'An account with the new address already exists; `errors` names newEmail.')
  async requestEmailChange(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: EmailChangeRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<AcceptedResponseDto> {
    await this.auth.requestEmailChange(p.userId, body.newEmail, body.password, meta);
    return { message: 'Open the link we sent to the new address to confirm it.' };
  }

  @Get('organizations')
  @SessionAuth(...can('profile:manage'))
  @ApiOperation({ summary: 'The organisations you belong to, with your role in each.' })
  @ApiOkResponse({ type: MyOrganizationsResponseDto })
  async listMyOrganizations(
    @CurrentPrincipal() p: SessionPrincipal,
  ): Promise<MyOrganizationsResponseDto> {
    const rows = await this.auth.listMemberships(p.userId);
    return {
      data: rows
        .filter((m) => m.organization)
        .map((m) => ({
          organization: toOrganizationDto(m.organization!),
          role: m.role,
          current: m.organizationId === p.organizationId,
        })),
    };
  }

  @Post('organization')
  @SessionAuth(...can('profile:manage'))
  @HttpCode(200)
  @ApiOperation({ summary: 'Make this session act for another organisation you belong to.' })
  @ApiOkResponse({ type: MeResponseDto })
  @problem(404, 'You are not a member of that organisation.')
  async switchOrganization(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: SwitchOrganizationRequestDto,
    @Req() req: FastifyRequest,
  ): Promise<MeResponseDto> {
    const rows = await this.auth.listMemberships(p.userId);
    if (!rows.some((m) => m.organizationId === body.organizationId)) {
      throw new DomainError('not_found', 'You are not a member of that organisation.');
    }
    await this.sessions.switchOrganization(req, body.organizationId);
    const s = await this.auth.me(p.userId, body.organizationId);
    return toMeDto(s.user, s.organization, s.role);
  }
}
