import { Body, Controller, HttpCode, Post, Req } from '@nestjs/common';
import {
  ApiConflictResponse,
  ApiNotFoundResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { problem, tooManyRequests } from '../common/decorators/problem-responses.js';
import type { FastifyRequest } from 'fastify';
import { MeResponseDto } from '../auth/dto/auth.dto.js';
import { toMeDto } from '../auth/me.mapper.js';
import { Meta, RequestMeta } from '../auth/request-context.js';
import { Public } from '../common/decorators/access.decorator.js';
import {
  AcceptInviteRequestDto,
  InvitePreviewRequestDto,
  InvitePreviewResponseDto,
} from './dto/team.dto.js';
import { InvitesService } from './invites.service.js';

/** The invitee's side: public, the e-mailed token is the credential (sent in the body, never the URL). */
@ApiTags('team')
@Controller('invites')
export class InvitesController {
  constructor(private readonly invites: InvitesService) {}

  @Post('preview')
  @Public()
  @HttpCode(200)
  @ApiOperation({ summary: 'What an invitation link is for (organisation, role, address).' })
  @ApiOkResponse({ type: InvitePreviewResponseDto })
  @ApiNotFoundResponse({ description: 'Invalid, used, canceled or expired.' })
  previewInvite(@Body() body: InvitePreviewRequestDto): Promise<InvitePreviewResponseDto> {
    return this.invites.preview(body.token);
  }

  @Post('accept')
  @Public()
  @HttpCode(200)
  @ApiOperation({
    summary: 'Accept an invitation as a new or existing account, and sign in.',
    description:
      'Joining takes a seat: when the members already fill the plan\'s seats (e.g. the plan was lowered after the invitation was sent) the answer is a 409 problem with `limit: "seats"` and nothing is written (no account, no membership); the invitation stays valid, so the link works once a seat is free.',
  })
  @ApiOkResponse({ type: MeResponseDto })
  @ApiConflictResponse({ description: 'No free seat in the organisation (`limit: "seats"`).' })
  @problem(404, 'The invitation is invalid, already used, canceled or expired.')
  @tooManyRequests('Too many wrong passwords for the invited account; wait for Retry-After.')
  async acceptInvite(
    @Body() body: AcceptInviteRequestDto,
    @Req() req: FastifyRequest,
    @Meta() meta: RequestMeta,
  ): Promise<MeResponseDto> {
    const s = await this.invites.accept(req, body, meta);
    return toMeDto(s.user, s.organization, s.role);
  }
}
