import { Body, Controller, HttpCode, Post, Req } from '@nestjs/common';
import {
  ApiAcceptedResponse,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
  ApiTooManyRequestsResponse,
  ApiUnauthorizedResponse,
} from '@nestjs/swagger';
import { problem, tooManyRequests } from '../common/decorators/problem-responses.js';
import type { FastifyRequest } from 'fastify';
import { AuditService } from '../audit/audit.service.js';
import { Public, SessionAuth } from '../common/decorators/access.decorator.js';
import { AuthService } from './auth.service.js';
import {
  AcceptedResponseDto,
  MeResponseDto,
  PasswordResetConfirmRequestDto,
  PasswordResetRequestDto,
  SignInRequestDto,
  SignUpRequestDto,
  TokenRequestDto,
} from './dto/auth.dto.js';
import { toMeDto } from './me.mapper.js';
import { can } from './permissions.js';
import { CurrentPrincipal, Meta, RequestMeta, SessionPrincipal } from './request-context.js';
import { SessionManager } from './session-manager.js';

const RESET_ACCEPTED = 'If the address belongs to an account, a message with a link is on its way.';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly sessions: SessionManager,
    private readonly audit: AuditService,
  ) {}

  @Post('sign-up')
  @Public()
  @ApiOperation({ summary: 'Create an account, its organisation (you are the owner) and sign in.' })
  @ApiCreatedResponse({ type: MeResponseDto })
  @ApiConflictResponse({ description: 'The e-mail address is already registered.' })
  @tooManyRequests('Too many new accounts from this address; wait for Retry-After.')
  async signUp(
    @Body() body: SignUpRequestDto,
    @Req() req: FastifyRequest,
    @Meta() meta: RequestMeta,
  ): Promise<MeResponseDto> {
    const s = await this.auth.signUp(body, meta);
    await this.sessions.start(req, s.user.id, s.organization.id);
    return toMeDto(s.user, s.organization, s.role);
  }

  @Post('sign-in')
  @Public()
  @HttpCode(200)
  @ApiOperation({ summary: 'Sign in with e-mail and password; sets the session cookie.' })
  @ApiOkResponse({ type: MeResponseDto })
  @ApiUnauthorizedResponse({
    description: 'Wrong e-mail or password (the answer does not say which).',
  })
  @ApiTooManyRequestsResponse({ description: 'Too many failures; see Retry-After.' })
  @problem(403, 'The account no longer belongs to any organisation.')
  async signIn(
    @Body() body: SignInRequestDto,
    @Req() req: FastifyRequest,
    @Meta() meta: RequestMeta,
  ): Promise<MeResponseDto> {
    const s = await this.auth.signIn(body.email, body.password, meta);
    await this.sessions.start(req, s.user.id, s.organization.id);
    return toMeDto(s.user, s.organization, s.role);
  }

  /** Public so that signing out twice, or with an expired session, is not an error. */
  @Post('sign-out')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'End this session.' })
  @ApiNoContentResponse()
  async signOut(@Req() req: FastifyRequest, @Meta() meta: RequestMeta): Promise<void> {
    const { userId, organizationId } = req.session ?? {};
    await this.sessions.end(req);
    if (userId && organizationId) {
      await this.audit.record({
        organizationId,
        action: 'auth.sign_out',
        actorUserId: userId,
        meta,
      });
    }
  }

  @Post('sign-out-everywhere')
  @SessionAuth(...can('profile:manage'))
  @HttpCode(204)
  @ApiOperation({ summary: 'End every session of your account, this one included.' })
  @ApiNoContentResponse()
  async signOutEverywhere(
    @CurrentPrincipal() p: SessionPrincipal,
    @Req() req: FastifyRequest,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.sessions.endAllFor(p.userId);
    await this.sessions.end(req);
    await this.audit.record({
      organizationId: p.organizationId,
      action: 'auth.sign_out_everywhere',
      actorUserId: p.userId,
      meta,
    });
  }

  @Post('password-reset')
  @Public()
  @HttpCode(202)
  @ApiOperation({ summary: 'E-mail a single-use password-reset link (valid one hour).' })
  @ApiAcceptedResponse({ type: AcceptedResponseDto })
  async requestPasswordReset(
    @Body() body: PasswordResetRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<AcceptedResponseDto> {
    await this.auth.requestPasswordReset(body.email, meta);
    return { message: RESET_ACCEPTED };
  }

  @Post('password-reset/confirm')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'Set a new password with the e-mailed token; ends every session.' })
  @ApiNoContentResponse()
  async confirmPasswordReset(
    @Body() body: PasswordResetConfirmRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.auth.confirmPasswordReset(body.token, body.password, meta);
  }

  @Post('email-change/confirm')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'Confirm a new sign-in address with the token e-mailed to it.' })
  @ApiNoContentResponse()
  @problem(409, 'The new address has meanwhile been taken by another account.')
  async confirmEmailChange(
    @Body() body: TokenRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.auth.confirmEmailChange(body.token, meta);
  }
}
