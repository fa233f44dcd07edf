import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import {
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { RoleRequestDto } from '../auth/dto/auth.dto.js';
import { can } from '../auth/permissions.js';
import { CurrentPrincipal, Meta, RequestMeta, SessionPrincipal } from '../auth/request-context.js';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import { problem } from '../common/decorators/problem-responses.js';
import {
  CreateInviteRequestDto,
  InviteListResponseDto,
  InviteResponseDto,
  MemberListResponseDto,
  MemberResponseDto,
} from './dto/team.dto.js';
import { InvitesService } from './invites.service.js';
import { toInviteDto, toMemberDto, toSeatsDto } from './team.mapper.js';
import { TeamService } from './team.service.js';

@ApiTags('team')
@Controller('team')
export class TeamController {
  constructor(
    private readonly team: TeamService,
    private readonly invites: InvitesService,
  ) {}

  @Get('members')
  @SessionAuth(...can('team:manage'))
  @ApiOperation({
    summary: "Members of the organisation, their roles, and the seats used against the plan's.",
  })
  @ApiOkResponse({ type: MemberListResponseDto })
  async listMembers(@CurrentPrincipal() p: SessionPrincipal): Promise<MemberListResponseDto> {
    const [members, seats] = await Promise.all([
      this.team.listMembers(p.organizationId),
      this.team.seats(p.organizationId),
    ]);
    return { data: members.map(toMemberDto), seats: toSeatsDto(seats) };
  }

  @Patch('members/:userId')
  @SessionAuth(...can('team:manage'))
  @ApiOperation({
    summary:
      "Change another member's role (only owners grant or change the owner role; nobody changes their own).",
  })
  @ApiOkResponse({ type: MemberResponseDto })
  @problem(
    403,
    'The member is you (`errors` names `userId`): nobody changes their own role; another admin or an owner does, and an owner can step down by transferring ownership. Or the change grants or takes away the owner role and you are not an owner.',
  )
  @ApiConflictResponse({ description: 'That would leave the organisation without an owner.' })
  async changeMemberRole(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('userId') userId: string,
    @Body() body: RoleRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<MemberResponseDto> {
    return toMemberDto(await this.team.changeRole(p, userId, body.role, meta));
  }

  @Delete('members/:userId')
  @SessionAuth(...can('team:manage'))
  @HttpCode(204)
  @ApiOperation({
    summary: 'Remove a member; their sessions stop working for this organisation at once.',
  })
  @ApiNoContentResponse()
  @ApiConflictResponse({ description: 'That would leave the organisation without an owner.' })
  async removeMember(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('userId') userId: string,
    @Meta() meta: RequestMeta,
  ): Promise<void> {
    await this.team.removeMember(p, userId, meta);
  }

  @Get('invites')
  @SessionAuth(...can('team:manage'))
  @ApiOperation({ summary: 'Invitations, newest first.' })
  @ApiOkResponse({ type: InviteListResponseDto })
  async listInvites(@CurrentPrincipal() p: SessionPrincipal): Promise<InviteListResponseDto> {
    return { data: (await this.invites.list(p.organizationId)).map(toInviteDto) };
  }

  @Post('invites')
  @SessionAuth(...can('team:manage'))
  @ApiOperation({
    summary: 'Invite someone by e-mail with a role (the link is valid for 7 days).',
    description:
      'A pending invitation holds one of the plan\'s seats until it is accepted, canceled or expires. When members plus pending invitations already fill the seats, the answer is a 409 problem with `limit: "seats"`, `limitValue` (the plan\'s seats), `count` (seats used), `members`, `pendingInvites` and `planCode`.',
  })
  @ApiCreatedResponse({ type: InviteResponseDto })
  @ApiConflictResponse({
    description:
      'Already a member, already invited, or no free seat (`limit: "seats"`: remove a member, cancel an invitation or change plan).',
  })
  async createInvite(
    @CurrentPrincipal() p: SessionPrincipal,
    @Body() body: CreateInviteRequestDto,
    @Meta() meta: RequestMeta,
  ): Promise<InviteResponseDto> {
    return toInviteDto(await this.invites.create(p, body.email, body.role, meta));
  }

  @Post('invites/:id/resend')
  @SessionAuth(...can('team:manage'))
  @HttpCode(200)
  @ApiOperation({
    summary: 'Send the invitation again with a new link and another 7 days.',
    description:
      'An expired invitation takes a seat again when re-sent: with no free seat the answer is the same 409 as for a new invitation (`limit: "seats"`).',
  })
  @ApiOkResponse({ type: InviteResponseDto })
  @ApiConflictResponse({
    description: 'Already accepted or canceled, or (expired invitations) no free seat.',
  })
  async resendInvite(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
    @Meta() meta: RequestMeta,
  ): Promise<InviteResponseDto> {
    return toInviteDto(await this.invites.resend(p, id, meta));
  }

  @Delete('invites/:id')
  @SessionAuth(...can('team:manage'))
  @HttpCode(200)
  @ApiOperation({ summary: 'Cancel an invitation: its link stops working.' })
  @ApiOkResponse({ type: InviteResponseDto })
  async cancelInvite(
    @CurrentPrincipal() p: SessionPrincipal,
    @Param('id') id: string,
    @Meta() meta: RequestMeta,
  ): Promise<InviteResponseDto> {
    return toInviteDto(await this.invites.cancel(p, id, meta));
  }
}
