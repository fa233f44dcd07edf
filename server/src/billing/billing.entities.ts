// Billing's own tables. Ids of payments-service objects are kept as they come (text).
import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** The organisation's customer at the payments service. */
@Entity('billing_accounts')
@Index('uq_billing_accounts_customer', ['customerId'], { unique: true })
export class BillingAccountEntity {
  @PrimaryColumn({ type: 'uuid' })
  organizationId: string;

  @Column({ type: 'text' })
  customerId: string;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}

/** A hosted checkout started by an owner: open, then complete or expired (declined/abandoned). */
@Entity('billing_checkouts')
@Index('ix_billing_checkouts_org', ['organizationId', 'createdAt'])
export class BillingCheckoutEntity {
  @PrimaryColumn({ type: 'text' })
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @Column({ type: 'text' })
  planCode: string;

  @Column({ type: 'text' })
  status: 'open' | 'complete' | 'expired';

  @Column({ type: 'text' })
  url: string;

  @Column({ type: 'uuid', nullable: true })
  createdByUserId: string | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}

/** The latest known state of a subscription; `stateAsOf` is the event time it came from. */
@Entity('billing_subscriptions')
@Index('ix_billing_subscriptions_org', ['organizationId', 'startedAt'])
export class BillingSubscriptionEntity {
  @PrimaryColumn({ type: 'text' })
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @Column({ type: 'text' })
  customerId: string;

  @Column({ type: 'text' })
  planCode: string;

  @Column({ type: 'text' })
  status: string;

  @Column({ type: 'timestamptz' })
  startedAt: Date;

  @Column({ type: 'timestamptz', nullable: true })
  currentPeriodStart: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  currentPeriodEnd: Date | null;

  @Column({ type: 'timestamptz' })
  stateAsOf: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}

export interface InvoiceLine {
  description: string;
  amountCents: number;
  kind: 'plan' | 'overage' | 'other';
  quantity: number;
}

/** An invoice as the payments service last described it, with its lines. */
@Entity('billing_invoices')
@Index('ix_billing_invoices_org', ['organizationId', 'issuedAt'])
export class BillingInvoiceEntity {
  @PrimaryColumn({ type: 'text' })
  id: string;

  @Column({ type: 'uuid' })
  organizationId: string;

  @Column({ type: 'text', nullable: true })
  subscriptionId: string | null;

  @Column({ type: 'text' })
  status: string;

  @Column({ type: 'text' })
  billingReason: string;

  @Column({ type: 'text' })
  currency: string;

  @Column({ type: 'integer' })
  totalCents: number;

  @Column({ type: 'integer' })
  amountPaidCents: number;

  @Column({ type: 'timestamptz', nullable: true })
  periodStart: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  periodEnd: Date | null;

  @Column({ type: 'jsonb' })
  lines: InvoiceLine[];

  @Column({ type: 'timestamptz' })
  issuedAt: Date;

  @Column({ type: 'timestamptz' })
  stateAsOf: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}

/** Every webhook event processed, once: the primary key makes replays no-ops. */
@Entity('billing_events')
export class BillingEventEntity {
  @PrimaryColumn({ type: 'text' })
  id: string;

  @Column({ type: 'text' })
  type: string;

  @Column({ type: 'timestamptz' })
  eventCreatedAt: Date;

  @Column({ type: 'text' })
  outcome: string;

  @CreateDateColumn({ type: 'timestamptz' })
  receivedAt: Date;
}

export const BILLING_ENTITIES = [
  BillingAccountEntity,
  BillingCheckoutEntity,
  BillingSubscriptionEntity,
  BillingInvoiceEntity,
  BillingEventEntity,
];
