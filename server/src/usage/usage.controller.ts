import { Controller, Get, Header, Query, Req, Res } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { FastifyReply } from 'fastify';
import { SessionAuth } from '../common/decorators/access.decorator.js';
import type { RequestWithPrincipal } from '../common/guards/access.guard.js';
import { ApiQueryFromSchema, QuerySchemaPipe } from '../compute/validation/schema-dto.js';
import {
  eventsQuerySchema,
  summaryQuerySchema,
  UsageEventPageResponseDto,
  UsageSummaryResponseDto,
} from './usage.dto.js';
import { EventFilters, UsageService } from './usage.service.js';
import { DomainError } from '../common/errors/domain-error.js';

/** A validated query: strings, and numbers where the schema says so (`limit`, `status`). */
interface Q {
  from?: string;
  to?: string;
  keyId?: string;
  endpoint?: string;
  status?: number;
  outcome?: string;
  limit?: number;
  cursor?: string;
}
const CSV_MAX_ROWS = 100_000;

function instant(field: string, v: string | undefined): Date | undefined {
  if (!v) return undefined;
  const d = new Date(v.length === 10 ? `${v}T00:00:00Z` : v);
  if (Number.isNaN(d.getTime())) {
    throw new DomainError('invalid_input', `${field} is not a valid time.`, [
      { field, reason: 'is not a valid time' },
    ]);
  }
  return d;
}

function filters(q: Q): EventFilters {
  return {
    keyId: q.keyId?.toLowerCase(),
    endpoint: q.endpoint,
    status: q.status,
    outcome: q.outcome as EventFilters['outcome'],
    from: instant('from', q.from),
    to: instant('to', q.to),
  };
}

const csvCell = (v: unknown) => {
  const s = v === null || v === undefined ? '' : String(v);
  // Quote everything that could break the row or be read as a formula by a spreadsheet.
  return /[",\n\r]|^[=+\-@]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

@ApiTags('usage')
@Controller('usage')
export class UsageController {
  constructor(private readonly usage: UsageService) {}

  @Get('summary')
  @SessionAuth('owner', 'admin', 'developer')
  @ApiOperation({
    summary: 'Calls by day, endpoint, key, status and source over a range of UTC days.',
  })
  @ApiQueryFromSchema(summaryQuerySchema)
  @ApiOkResponse({ type: UsageSummaryResponseDto })
  getUsageSummary(
    @Req() req: RequestWithPrincipal,
    @Query(new QuerySchemaPipe(summaryQuerySchema)) q: Q,
  ) {
    const today = new Date().toISOString().slice(0, 10);
    const from = q.from ?? `${today.slice(0, 8)}01`;
    const to = q.to ?? today;
    if (from > to) {
      throw new DomainError('invalid_input', `The range starts (${from}) after it ends (${to}).`, [
        { field: 'from', reason: `must be on or before ${to}` },
      ]);
    }
    return this.usage.summary(req.principal!.organizationId, from, to, {
      keyId: q.keyId,
      endpoint: q.endpoint,
      status: q.status,
      outcome: q.outcome as EventFilters['outcome'],
    });
  }

  @Get('events')
  @SessionAuth('owner', 'admin', 'developer')
  @ApiOperation({ summary: 'Usage events, newest first, with cursor pagination.' })
  @ApiQueryFromSchema(eventsQuerySchema)
  @ApiOkResponse({ type: UsageEventPageResponseDto })
  listUsageEvents(
    @Req() req: RequestWithPrincipal,
    @Query(new QuerySchemaPipe(eventsQuerySchema)) q: Q,
  ) {
    const limit = q.limit ?? 50;
    return this.usage.events(req.principal!.organizationId, filters(q), limit, q.cursor);
  }

  @Get('events.csv')
  @SessionAuth('owner', 'admin', 'developer')
  @Header('Content-Type', 'text/csv; charset=utf-8')
  @Header('Content-Disposition', 'attachment; filename="lumenwright-usage.csv"')
  @ApiOperation({ summary: `Usage events as CSV (same filters; at most ${CSV_MAX_ROWS} rows).` })
  @ApiQueryFromSchema(eventsQuerySchema)
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'CSV with a header row.', schema: { type: 'string' } })
  async exportUsageEvents(
    @Req() req: RequestWithPrincipal,
    @Query(new QuerySchemaPipe(eventsQuerySchema)) q: Q,
    @Res({ passthrough: true }) _res: FastifyReply,
  ): Promise<string> {
    const cols = [
      'occurredAt',
      'id',
      'keyId',
      'userId',
      'source',
      'endpoint',
      'status',
      'latencyMs',
      'billableUnits',
      'requestId',
    ] as const;
    const lines = [cols.join(',')];
    let cursor: string | undefined = q.cursor;
    const f = filters(q);
    while (lines.length <= CSV_MAX_ROWS) {
      const page = await this.usage.events(req.principal!.organizationId, f, 200, cursor);
      for (const e of page.data) lines.push(cols.map((c) => csvCell(e[c])).join(','));
      if (!page.nextCursor) break;
      cursor = page.nextCursor;
    }
    return lines.slice(0, CSV_MAX_ROWS + 1).join('\r\n') + '\r\n';
  }
}
