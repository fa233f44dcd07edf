// Owner-facing billing: where the organisation stands, plan changes through the hosted checkout,
// cancellation, invoices. State changes arrive by webhook (webhook.service.ts), never from here.
import { Inject, Injectable } from '@nestjs/common';
import { HttpAdapterHost } from '@nestjs/core';
import { InjectDataSource } from '@nestjs/typeorm';
import type { AddressInfo } from 'node:net';
import { DataSource, Not, In } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal } from '../common/guards/access.guard.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { PlansService } from '../plans/plans.service.js';
import { assertSeatsForPlan, seatUsage } from '../team/seats.js';
import {
  BillingAccountEntity,
  BillingCheckoutEntity,
  BillingInvoiceEntity,
  BillingSubscriptionEntity,
} from './billing.entities.js';
import { PAYMENTS, type Payments } from './payments.client.js';

@Injectable()
export class BillingService {
  private registered: Promise<void> | null = null;

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(PAYMENTS) private readonly payments: Payments,
    private readonly plans: PlansService,
    private readonly http: HttpAdapterHost,
  ) {}

  private api() {
    if (!this.payments)
      throw new DomainError('unavailable', 'Billing is not configured on this server.');
    return this.payments;
  }

  /** Our own address once listening (PORT=0 in tests picks one at random). */
  private baseUrl(): string {
    if (this.config.port !== 0) return this.config.publicUrl;
    const addr = this.http.httpAdapter.getHttpServer().address() as AddressInfo;
    return `http://127.0.0.1:${addr.port}`;
  }

  /** With the local fake, tell it where to deliver webhooks (once per process; it dedupes). */
  private ensureWebhook(): Promise<void> {
    if (!this.config.paymentsRegisterWebhook) return Promise.resolve();
    this.registered ??= this.api()
      .webhookEndpoints.create({
        url: `${this.baseUrl()}/v1/billing/webhooks`,
        enabled_events: ['*'],
      })
      .then(() => undefined)
      .catch((e: unknown) => {
        this.registered = null;
        throw e;
      });
    return this.registered;
  }

  async overview(orgId: string) {
    this.plans.forget(orgId);
    const plan = await this.plans.forOrganization(orgId);
    const subscription = await this.ds.getRepository(BillingSubscriptionEntity).findOne({
      where: { organizationId: orgId, status: Not(In(['canceled', 'incomplete_expired'])) },
      order: { startedAt: 'DESC' },
    });
    const checkout = await this.ds.getRepository(BillingCheckoutEntity).findOne({
      where: { organizationId: orgId, status: 'open' },
      order: { createdAt: 'DESC' },
    });
    return { plan, subscription, checkout };
  }

  async startCheckout(p: Principal, planCode: string) {
    const payments = this.api();
    const all = await this.plans.list();
    const target = all.find((x) => x.code === planCode);
    if (!target) {
      throw new DomainError('invalid_input', `There is no plan "${planCode}".`, [
        { field: 'planCode', reason: `must be one of ${all.map((x) => x.code).join(', ')}` },
      ]);
    }
    if (target.monthlyPriceCents === 0) {
      throw new DomainError(
        'invalid_input',
        'The free plan needs no checkout: cancel the subscription instead.',
        [
          {
            field: 'planCode',
            reason: 'must be a paid plan (use POST /v1/billing/cancel for free)',
          },
        ],
      );
    }
    const { plan: current, subscription } = await this.overview(p.organizationId);
    if (current.code === planCode && subscription?.status === 'active') {
      throw new DomainError('conflict', `The organisation is already on ${target.name}.`);
    }
    // A smaller plan must leave every member a seat: asked for here, it is refused up front. (A
    // change the payments service reports by webhook always applies; see webhook.service.ts.)
    assertSeatsForPlan(await seatUsage(this.ds, p.organizationId), target);
    await this.ensureWebhook();
    const customerId = await this.customerFor(p);
    const base = this.config.publicUrl;
    const session = await payments.checkout.sessions.create({
      mode: 'subscription',
      customer: customerId,
      client_reference_id: p.organizationId,
      line_items: [
        {
          quantity: 1,
          price_data: {
            currency: 'usd',
            unit_amount: target.monthlyPriceCents,
            recurring: { interval: 'month' },
            product_data: { name: `Lumenwright ${target.name}` },
          },
        },
      ],
      metadata: { organization_id: p.organizationId, plan_code: target.code },
      subscription_data: {
        metadata: { organization_id: p.organizationId, plan_code: target.code },
      },
      success_url: `${base}/billing?checkout=complete&session={CHECKOUT_SESSION_ID}`,
      cancel_url: `${base}/billing?checkout=cancelled`,
    });
    const row = await this.ds.getRepository(BillingCheckoutEntity).save({
      id: session.id,
      organizationId: p.organizationId,
      planCode: target.code,
      status: 'open',
      url: session.url!,
      createdByUserId: p.userId,
    });
    return { ...row, change: target.sortOrder > current.sortOrder ? 'upgrade' : 'downgrade' };
  }

  private async customerFor(p: Principal): Promise<string> {
    const repo = this.ds.getRepository(BillingAccountEntity);
    const known = await repo.findOneBy({ organizationId: p.organizationId });
    if (known) return known.customerId;
    const rows: { email: string; org: string }[] = await this.ds.query(
      `SELECT u.email, o.name AS org FROM users u, organizations o WHERE u.id = $1 AND o.id = $2`,
      [p.userId, p.organizationId],
    );
    const customer = await this.api().customers.create(
      {
        email: rows[0]?.email,
        name: rows[0]?.org,
        metadata: { organization_id: p.organizationId },
      },
      { idempotencyKey: `customer-${p.organizationId}` },
    );
    await repo
      .createQueryBuilder()
      .insert()
      .values({ organizationId: p.organizationId, customerId: customer.id })
      .orIgnore()
      .execute();
    return (await repo.findOneByOrFail({ organizationId: p.organizationId })).customerId;
  }

  /** Cancels at once; the webhook then moves the organisation to the free plan. */
  async cancel(orgId: string) {
    const { subscription } = await this.overview(orgId);
    if (!subscription) throw new DomainError('conflict', 'There is no subscription to cancel.');
    await this.ensureWebhook();
    await this.api().subscriptions.cancel(subscription.id);
    return { subscriptionId: subscription.id, status: 'cancelling' as const };
  }

  invoices(orgId: string) {
    return this.ds.getRepository(BillingInvoiceEntity).find({
      where: { organizationId: orgId },
      order: { issuedAt: 'DESC' },
      take: 100,
    });
  }

  async invoice(orgId: string, id: string) {
    const row = await this.ds
      .getRepository(BillingInvoiceEntity)
      .findOneBy({ id, organizationId: orgId });
    if (!row) throw new DomainError('not_found', 'No such invoice for your organisation.');
    return row;
  }
}
