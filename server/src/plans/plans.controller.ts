import { Controller, Get, Req } from '@nestjs/common';
import { ApiOkResponse, ApiOperation, ApiTags } from '@nestjs/swagger';
import { ApiKeyAuth, Public } from '../common/decorators/access.decorator.js';
import { KeyReadLimited } from './key-read.decorator.js';
import type { RequestWithPrincipal } from '../common/guards/access.guard.js';
import {
  CurrentPlanResponseDto,
  PlanListResponseDto,
  toPlanDto,
  type PlanDto,
} from './plans.dto.js';
import { PlansService } from './plans.service.js';
import { monthBounds } from './quota.service.js';
import { UsageService } from '../usage/usage.service.js';
import { seatUsage } from '../team/seats.js';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';

@ApiTags('plans')
@Controller('plans')
export class PlansController {
  constructor(
    private readonly plans: PlansService,
    private readonly usage: UsageService,
    @InjectDataSource() private readonly ds: DataSource,
  ) {}

  @Get()
  @Public()
  @ApiOperation({ summary: 'The plans: included calls, rate limits, overage price and features.' })
  @ApiOkResponse({ type: PlanListResponseDto })
  async listPlans(): Promise<{ data: PlanDto[] }> {
    return { data: (await this.plans.list()).map(toPlanDto) };
  }

  @Get('current')
  @ApiKeyAuth()
  @KeyReadLimited()
  @ApiOperation({
    summary: "Your organisation's plan, this month's calls and the seats used against it.",
    description:
      'With a console session or an API key: an app can read how much of the monthly quota is ' +
      'left (`plan.includedCalls` against `usage`) before a batch of calls.',
  })
  @ApiOkResponse({ type: CurrentPlanResponseDto })
  async getCurrentPlan(@Req() req: RequestWithPrincipal) {
    const orgId = req.principal!.organizationId;
    const plan = await this.plans.forOrganization(orgId);
    const { start, reset } = monthBounds(new Date());
    const [month, seats] = await Promise.all([
      this.usage.monthTotals(orgId, start),
      seatUsage(this.ds, orgId),
    ]);
    return {
      plan: toPlanDto(plan),
      periodStart: start,
      resetsAt: reset.toISOString(),
      usage: {
        ...month,
        seatsUsed: seats.used,
        members: seats.members,
        pendingInvites: seats.pendingInvites,
      },
    };
  }
}
