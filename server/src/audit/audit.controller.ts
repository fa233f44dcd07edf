import { Controller, Get, Query } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { InjectRepository } from '@nestjs/typeorm';
import { In, Repository } from 'typeorm';
import { can } from '../auth/permissions.js';
import { CurrentPrincipal } from '../auth/request-context.js';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import type { Principal } from '../common/guards/access.guard.js';
import { UserEntity } from '../users/user.entity.js';
import { AuditService } from './audit.service.js';
import { AuditListQueryDto, AuditPageResponseDto } from './dto/audit.dto.js';

@ApiTags('audit')
@Controller('audit')
export class AuditController {
  constructor(
    private readonly audit: AuditService,
    @InjectRepository(UserEntity) private readonly users: Repository<UserEntity>,
  ) {}

  @Get()
  @SessionAuth(...can('audit:read'))
  @ApiOperation({ summary: "The organisation's audit log, newest first." })
  @ApiOkResponse({ type: AuditPageResponseDto })
  async listAuditEvents(
    @CurrentPrincipal() p: Principal,
    @Query() q: AuditListQueryDto,
  ): Promise<AuditPageResponseDto> {
    const page = await this.audit.list(p.organizationId, {
      limit: q.limit ?? 20,
      ...(q.cursor ? { cursor: q.cursor } : {}),
      ...(q.action ? { action: q.action } : {}),
    });
    const ids = [...new Set(page.data.map((e) => e.actorUserId).filter((x): x is string => !!x))];
    const names = new Map(
      (ids.length ? await this.users.find({ where: { id: In(ids) } }) : []).map((u) => [
        u.id,
        u.name,
      ]),
    );
    return {
      data: page.data.map((e) => ({
        id: e.id,
        action: e.action,
        actor: {
          userId: e.actorUserId,
          name: e.actorUserId ? (names.get(e.actorUserId) ?? null) : null,
          keyId: e.actorKeyId,
        },
        targetType: e.targetType,
        targetId: e.targetId,
        ip: e.ip,
        userAgent: e.userAgent,
        metadata: e.metadata,
        createdAt: e.createdAt.toISOString(),
      })),
      nextCursor: page.nextCursor,
    };
  }
}
