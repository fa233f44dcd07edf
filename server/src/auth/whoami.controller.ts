import { Controller, Get } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiProperty, ApiTags } from '@nestjs/swagger';
import { ApiKeyAuth, ROLES, Role } from '../common/decorators/access.decorator.js';
import type { Principal } from '../common/guards/access.guard.js';
import { CurrentPrincipal } from './request-context.js';

export class WhoAmIResponseDto {
  @ApiProperty({ enum: ['session', 'api-key'] })
  kind: 'session' | 'api-key';

  @ApiProperty({ format: 'uuid' })
  organizationId: string;

  @ApiProperty({ nullable: true, type: String, format: 'uuid', description: 'Null for API keys.' })
  userId: string | null;

  @ApiProperty({
    nullable: true,
    enum: ROLES,
    description: 'Null for API keys: a key has no role.',
  })
  role: Role | null;

  @ApiProperty({ nullable: true, type: String, format: 'uuid' })
  keyId: string | null;

  @ApiProperty({ nullable: true, enum: ['test', 'live'] })
  keyMode: 'test' | 'live' | null;
}

/** Lets an integration check which key (or session) it is using, without side effects. */
@ApiTags('auth')
@Controller('whoami')
export class WhoAmIController {
  @Get()
  @ApiKeyAuth()
  @ApiOperation({
    summary: 'Who is calling: the API key (or console session) and its organisation.',
  })
  @ApiOkResponse({ type: WhoAmIResponseDto })
  getWhoAmI(@CurrentPrincipal() p: Principal): WhoAmIResponseDto {
    return {
      kind: p.kind,
      organizationId: p.organizationId,
      userId: p.userId,
      role: p.role,
      keyId: p.keyId,
      keyMode: p.keyMode,
    };
  }
}
