import { Body, Controller, Get, Headers, HttpCode, Param, Post, Req } from '@nestjs/common';
import {
  ApiAcceptedResponse,
  ApiBadRequestResponse,
  ApiConflictResponse,
  ApiCreatedResponse,
  ApiExcludeEndpoint,
  ApiOkResponse,
  ApiOperation,
  ApiTags,
} from '@nestjs/swagger';
import { problem } from '../common/decorators/problem-responses.js';
import type { FastifyRequest } from 'fastify';
import { Public, SessionAuth } from '../common/decorators/access.decorator.js';
import type { RequestWithPrincipal } from '../common/guards/access.guard.js';
import { toBillingDto, toCheckoutDto, toInvoiceDto } from './billing.mapper.js';
import { BillingService } from './billing.service.js';
import {
  CancelResponseDto,
  CheckoutRequestDto,
  CheckoutResponseDto,
  InvoiceListResponseDto,
  InvoiceResponseDto,
  WebhookResponseDto,
} from './dto/billing.dto.js';
import { WebhookService } from './webhook.service.js';

@ApiTags('billing')
@Controller('billing')
export class BillingController {
  constructor(
    private readonly billing: BillingService,
    private readonly webhooks: WebhookService,
  ) {}

  @Get()
  @SessionAuth('owner')
  @ApiOperation({
    summary: "The organisation's plan, subscription and any open checkout (owners).",
  })
  @ApiOkResponse({
    description: 'plan (as in /v1/plans), subscription or null, openCheckout or null.',
  })
  async getBilling(@Req() req: RequestWithPrincipal) {
    return toBillingDto(await this.billing.overview(req.principal!.organizationId));
  }

  @Post('checkout')
  @SessionAuth('owner')
  @ApiOperation({
    summary: 'Start a hosted checkout to move to a paid plan (upgrade or downgrade).',
    description:
      'A plan with fewer seats than the organisation has members is refused with a 409 problem: `limit: "seats"`, `limitValue` (the new plan\'s seats), `members`, `removeMembers` (how many to remove first) and `planCode` (the plan asked for). Pending invitations do not block the change; beyond the new seats they cannot be accepted.',
  })
  @ApiCreatedResponse({ type: CheckoutResponseDto })
  @ApiConflictResponse({
    description:
      'Already on that plan, or the plan has fewer seats than the members (`limit: "seats"`).',
  })
  async createCheckout(@Req() req: RequestWithPrincipal, @Body() body: CheckoutRequestDto) {
    const c = await this.billing.startCheckout(req.principal!, body.planCode);
    return { ...toCheckoutDto(c), change: c.change };
  }

  @Post('cancel')
  @SessionAuth('owner')
  @HttpCode(202)
  @ApiOperation({
    summary: 'Cancel the subscription now; the organisation moves to the free plan.',
    description:
      "Never refused for seats: members beyond the free plan's seats keep their access, but nobody new can be invited or join until the members fit (GET /v1/team/members says how many seats are used). The same holds for any plan change the payments service reports.",
  })
  @ApiAcceptedResponse({ type: CancelResponseDto })
  @problem(409, 'There is no subscription to cancel.')
  cancelSubscription(@Req() req: RequestWithPrincipal) {
    return this.billing.cancel(req.principal!.organizationId);
  }

  @Get('invoices')
  @SessionAuth('owner')
  @ApiOperation({ summary: 'Invoices with their lines (plan, metered overage), newest first.' })
  @ApiOkResponse({ type: InvoiceListResponseDto })
  async listInvoices(@Req() req: RequestWithPrincipal) {
    return { data: (await this.billing.invoices(req.principal!.organizationId)).map(toInvoiceDto) };
  }

  @Get('invoices/:id')
  @SessionAuth('owner')
  @ApiOperation({ summary: 'One invoice.' })
  @ApiOkResponse({ type: InvoiceResponseDto })
  async getInvoice(@Req() req: RequestWithPrincipal, @Param('id') id: string) {
    return toInvoiceDto(await this.billing.invoice(req.principal!.organizationId, id));
  }

  @Post('webhooks')
  @Public()
  @HttpCode(200)
  @ApiExcludeEndpoint()
  @ApiOkResponse({ type: WebhookResponseDto })
  @ApiBadRequestResponse({ description: 'Missing or wrong signature.' })
  async receiveBillingWebhook(
    @Req() req: FastifyRequest & { rawBody?: Buffer },
    @Headers('stripe-signature') signature: string | undefined,
  ) {
    return this.webhooks.handle(this.webhooks.verify(req.rawBody, signature));
  }
}
