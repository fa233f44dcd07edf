import { ApiProperty } from '@nestjs/swagger';
import { IsString, Matches } from 'class-validator';

export class CheckoutRequestDto {
  @ApiProperty({ description: 'The paid plan to move to.', example: 'studio' })
  @IsString()
  @Matches(/^[a-z][a-z0-9_-]{0,39}$/, { message: 'must be a plan code such as "studio"' })
  planCode: string;
}

export class CheckoutResponseDto {
  @ApiProperty({ example: 'cs_test_a1b2c3' }) id: string;
  @ApiProperty({ example: 'studio' }) planCode: string;
  @ApiProperty({ enum: ['open', 'complete', 'expired'] }) status: string;
  @ApiProperty({ description: 'Send the owner here to approve or decline the payment.' })
  url: string;
  @ApiProperty({ enum: ['upgrade', 'downgrade'] }) change: string;
  @ApiProperty({ format: 'date-time' }) createdAt: string;
}

export class SubscriptionDto {
  @ApiProperty() id: string;
  @ApiProperty() planCode: string;
  @ApiProperty({ enum: ['active', 'past_due', 'canceled', 'incomplete', 'trialing', 'unpaid'] })
  status: string;
  @ApiProperty({ type: String, nullable: true, format: 'date-time' }) currentPeriodStart:
    string | null;
  @ApiProperty({ type: String, nullable: true, format: 'date-time' }) currentPeriodEnd:
    string | null;
}

export class InvoiceLineDto {
  @ApiProperty() description: string;
  @ApiProperty({ description: 'Cents.' }) amountCents: number;
  @ApiProperty({ enum: ['plan', 'overage', 'other'] }) kind: string;
  @ApiProperty({ description: 'Calls over the included amount for overage lines, else 1.' })
  quantity: number;
}

export class InvoiceResponseDto {
  @ApiProperty() id: string;
  @ApiProperty({ enum: ['draft', 'open', 'paid', 'void', 'uncollectible'] }) status: string;
  @ApiProperty({ example: 'subscription_cycle' }) billingReason: string;
  @ApiProperty({ example: 'usd' }) currency: string;
  @ApiProperty() totalCents: number;
  @ApiProperty() amountPaidCents: number;
  @ApiProperty({ type: String, nullable: true, format: 'date-time' }) periodStart: string | null;
  @ApiProperty({ type: String, nullable: true, format: 'date-time' }) periodEnd: string | null;
  @ApiProperty({ type: [InvoiceLineDto] }) lines: InvoiceLineDto[];
  @ApiProperty({ format: 'date-time' }) issuedAt: string;
}

export class InvoiceListResponseDto {
  @ApiProperty({ type: [InvoiceResponseDto] }) data: InvoiceResponseDto[];
}

export class CancelResponseDto {
  @ApiProperty() subscriptionId: string;
  @ApiProperty({ enum: ['cancelling'], description: 'The webhook moves the organisation to free.' })
  status: string;
}

export class WebhookResponseDto {
  @ApiProperty() received: boolean;
  @ApiProperty({ description: 'True when this event id was processed before (nothing changed).' })
  duplicate: boolean;
  @ApiProperty() outcome: string;
}
