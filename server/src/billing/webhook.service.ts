// Webhook events from the payments service: signature checked with the SDK's own verifier, each
// event id processed once (a replay answers 200 and changes nothing), stale events ignored:
// a subscription or invoice only moves to a state from a newer event, a cancelled subscription
// never comes back, and a paid invoice never goes back to open.
// A plan change always applies, even to fewer seats than members; the owners are then told by
// e-mail, once: only the event that changes the plan sends it, and a replay is never processed.
// When the change comes from a failed payment (subscription past due or unpaid), the owners get
// one e-mail for both causes: the payment-failed e-mail, which then also says the seats; the
// subscription event sends nothing more. That holds in either order of the two events, since the
// invoice event works out the plan the failure leaves (not the plan held when it arrives).
import { BadRequestException, Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type Stripe from 'stripe';
import { DataSource, EntityManager } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { PlanEntity } from '../plans/plan.entity.js';
import { PlansService } from '../plans/plans.service.js';
import { seatUsage } from '../team/seats.js';
import {
  BillingCheckoutEntity,
  BillingInvoiceEntity,
  BillingSubscriptionEntity,
  type InvoiceLine,
} from './billing.entities.js';
import { BillingMailer, type PaymentMail } from './billing-mailer.js';
import { overageFor } from './overage.js';
import { PAYMENTS, type Payments } from './payments.client.js';

type After = () => Promise<unknown>;
const INVOICE_RANK: Record<string, number> = {
  draft: 0,
  open: 1,
  paid: 2,
  void: 2,
  uncollectible: 2,
};
const ENTITLED = ['active', 'trialing'];
/** Not entitled because a payment failed: the payment-failed e-mail tells the owners. */
const PAYMENT_FAILED = ['past_due', 'unpaid'];
const at = (unix: number | null | undefined) => (unix ? new Date(unix * 1000) : null);

@Injectable()
export class WebhookService {
  private readonly logger = new Logger('BillingWebhooks');

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(PAYMENTS) private readonly payments: Payments,
    private readonly plans: PlansService,
    private readonly mailer: BillingMailer,
  ) {}

  verify(raw: Buffer | undefined, signature: string | undefined): Stripe.Event {
    if (!this.payments) throw new DomainError('unavailable', 'Billing is not configured.');
    if (!raw || !signature) {
      throw new BadRequestException({
        message: 'A signed webhook body is required.',
        errors: [{ field: signature ? 'body' : 'Stripe-Signature', reason: 'is missing' }],
      });
    }
    let event: Stripe.Event;
    try {
      event = this.payments.webhooks.constructEvent(
        raw,
        signature,
        this.config.paymentsWebhookSecret,
      );
    } catch (e) {
      throw new BadRequestException({
        message: 'The webhook signature does not match.',
        errors: [{ field: 'Stripe-Signature', reason: (e as Error).message.slice(0, 200) }],
      });
    }
    // A correctly signed body can still be malformed: refuse it (400) rather than fail later.
    const e = event as Partial<Stripe.Event> | null;
    const bad =
      !e || typeof e !== 'object'
        ? 'body'
        : typeof e.id !== 'string' || !e.id
          ? 'body.id'
          : typeof e.type !== 'string'
            ? 'body.type'
            : typeof e.created !== 'number'
              ? 'body.created'
              : !e.data || typeof e.data.object !== 'object' || e.data.object === null
                ? 'body.data.object'
                : null;
    if (bad) {
      throw new BadRequestException({
        message: 'The webhook event is malformed.',
        errors: [{ field: bad, reason: 'is missing or has the wrong type' }],
      });
    }
    return event;
  }

  async handle(
    event: Stripe.Event,
  ): Promise<{ received: true; duplicate: boolean; outcome: string }> {
    const after: After[] = [];
    const result = await this.ds.transaction(async (m) => {
      const fresh: unknown[] = await m.query(
        `INSERT INTO billing_events (id, type, event_created_at, outcome) VALUES ($1, $2, $3, 'processing')
         ON CONFLICT (id) DO NOTHING RETURNING id`,
        [event.id, event.type, new Date(event.created * 1000)],
      );
      if (fresh.length === 0) return { duplicate: true, outcome: 'duplicate' };
      const outcome = await this.process(m, event, after);
      await m.query(`UPDATE billing_events SET outcome = $2 WHERE id = $1`, [event.id, outcome]);
      return { duplicate: false, outcome };
    });
    for (const fn of after) {
      await fn().catch((e: Error) => this.logger.warn(`after ${event.id}: ${e.message}`));
    }
    return { received: true, ...result };
  }

  private async process(m: EntityManager, event: Stripe.Event, after: After[]): Promise<string> {
    const obj = event.data.object as unknown as Record<string, unknown>;
    switch (event.type) {
      case 'checkout.session.completed':
      case 'checkout.session.expired': {
        const status = event.type === 'checkout.session.completed' ? 'complete' : 'expired';
        const r = await m.update(
          BillingCheckoutEntity,
          { id: obj.id as string, status: 'open' },
          { status },
        );
        return r.affected ? `checkout ${status}` : 'ignored: checkout unknown or already closed';
      }
      case 'customer.subscription.created':
      case 'customer.subscription.updated':
      case 'customer.subscription.deleted':
        return this.subscription(m, event, obj as unknown as Stripe.Subscription, after);
      case 'invoice.created':
      case 'invoice.finalized':
      case 'invoice.paid':
      case 'invoice.payment_failed':
      case 'invoice.updated':
        return this.invoice(m, event, obj as unknown as Stripe.Invoice);
      default:
        return 'ignored: type not used';
    }
  }

  private async orgOf(m: EntityManager, customer: unknown): Promise<string | null> {
    const id = typeof customer === 'string' ? customer : (customer as { id?: string })?.id;
    const rows: { organization_id: string }[] = await m.query(
      `SELECT organization_id FROM billing_accounts WHERE customer_id = $1`,
      [id],
    );
    return rows[0]?.organization_id ?? null;
  }

  private async subscription(
    m: EntityManager,
    event: Stripe.Event,
    incoming: Stripe.Subscription,
    after: After[],
  ): Promise<string> {
    const orgId = await this.orgOf(m, incoming.customer);
    if (!orgId) return 'ignored: unknown customer';
    const asOf = new Date(event.created * 1000);
    const existing = await m.findOne(BillingSubscriptionEntity, {
      where: { id: incoming.id },
      lock: { mode: 'pessimistic_write' },
    });
    if (existing?.status === 'canceled') return 'stale: subscription already cancelled';
    // Cancellation is final whenever it arrives; anything else must be newer than what we hold.
    if (existing && asOf < existing.stateAsOf && incoming.status !== 'canceled') {
      return 'stale: older than the state held';
    }
    let sub = incoming;
    // Same second as the state held: the order is unknowable from the events, so ask.
    if (existing && asOf.getTime() === existing.stateAsOf.getTime() && this.payments) {
      sub = await this.payments.subscriptions.retrieve(incoming.id);
    }
    const planCode = String(sub.metadata?.plan_code ?? '');
    if (!(await m.findOneBy(PlanEntity, { code: planCode })))
      return `ignored: unknown plan "${planCode}"`;
    const item = sub.items?.data?.[0] as unknown as Record<string, number> | undefined;
    const s = sub as unknown as Record<string, number>;
    await m.save(BillingSubscriptionEntity, {
      id: sub.id,
      organizationId: orgId,
      customerId: typeof sub.customer === 'string' ? sub.customer : sub.customer.id,
      planCode,
      status: sub.status,
      startedAt: at(sub.created) ?? asOf,
      currentPeriodStart: at(item?.current_period_start ?? s.current_period_start),
      currentPeriodEnd: at(item?.current_period_end ?? s.current_period_end),
      stateAsOf: existing && existing.stateAsOf > asOf ? existing.stateAsOf : asOf,
    });
    const { code: effective, from } = await this.applyPlan(m, orgId);
    after.push(async () => this.plans.forget(orgId));
    const over = from === null ? '' : await this.seatsOverPlan(m, orgId, from, sub.status);
    if (ENTITLED.includes(sub.status)) {
      // A new plan replaces the old subscription: cancel any other one still running.
      const others = await m.query(
        `SELECT id FROM billing_subscriptions WHERE organization_id = $1 AND id <> $2
           AND status NOT IN ('canceled', 'incomplete_expired') AND started_at <= $3`,
        [orgId, sub.id, at(sub.created) ?? asOf],
      );
      for (const o of others as { id: string }[]) {
        after.push(() => this.payments!.subscriptions.cancel(o.id));
      }
    }
    return `subscription ${sub.status}; organisation on ${effective}${over}`;
  }

  /**
   * The organisation's plan follows its newest subscription in good standing, else free. `from` is
   * the plan it had when this event changed it, null when unchanged. The organisation's row is
   * locked first (the lock seat checks take), so the plan read is the one replaced.
   */
  private async applyPlan(
    m: EntityManager,
    orgId: string,
  ): Promise<{ code: string; from: string | null }> {
    const rows: { plan_code: string }[] = await m.query(
      `SELECT plan_code FROM billing_subscriptions WHERE organization_id = $1 AND status = ANY($2)
       ORDER BY started_at DESC, state_as_of DESC LIMIT 1`,
      [orgId, ENTITLED],
    );
    const code = rows[0]?.plan_code ?? 'free';
    const held: { plan_code: string }[] = await m.query(
      `SELECT plan_code FROM organizations WHERE id = $1 FOR NO KEY UPDATE`,
      [orgId],
    );
    const from = held[0]?.plan_code;
    if (from === undefined || from === code) return { code, from: null };
    await m.query(`UPDATE organizations SET plan_code = $2, updated_at = now() WHERE id = $1`, [
      orgId,
      code,
    ]);
    return { code, from };
  }

  /**
   * After a move to a plan with fewer seats, more members than the new seats: the change stands
   * (nobody new joins until the team fits) and each owner gets an e-mail, queued in the event's
   * transaction. A drop caused by a failed payment sends nothing here: the payment-failed e-mail
   * of the invoice event says the seats too.
   * Returns a note for the event's outcome.
   */
  private async seatsOverPlan(
    m: EntityManager,
    orgId: string,
    from: string,
    status: string,
  ): Promise<string> {
    const u = await seatUsage(m, orgId);
    const before = await m.findOneBy(PlanEntity, { code: from });
    if (u.members <= u.seats || (before && before.seats <= u.seats)) return '';
    if (PAYMENT_FAILED.includes(status)) {
      return `; ${u.members} members over ${u.seats} seats (told in the payment-failed e-mail)`;
    }
    const mail = {
      organizationId: orgId,
      planName: u.planName,
      seats: u.seats,
      members: u.members,
    };
    // Queued inside the event's transaction: committed with the plan change, never lost after it.
    await this.mailer.sendSeatsOverPlan(mail, `${this.config.publicUrl}/team`, m);
    return `; ${u.members} members over ${u.seats} seats (owners get an e-mail)`;
  }

  private async invoice(
    m: EntityManager,
    event: Stripe.Event,
    inv: Stripe.Invoice,
  ): Promise<string> {
    const orgId = await this.orgOf(m, inv.customer);
    if (!orgId) return 'ignored: unknown customer';
    const raw = inv as unknown as Record<string, unknown> & {
      parent?: { subscription_details?: { subscription?: string } };
    };
    const subscriptionId =
      (raw.subscription as string | undefined) ??
      raw.parent?.subscription_details?.subscription ??
      null;
    let lines = (inv.lines?.data ?? []).map(toLine);
    let total = inv.total ?? 0;
    let note = '';
    if (
      event.type === 'invoice.created' &&
      inv.status === 'draft' &&
      inv.billing_reason === 'subscription_cycle'
    ) {
      const added = await this.addOverage(m, orgId, subscriptionId, inv);
      if (added) {
        lines = [...lines.filter((l) => l.kind !== 'overage'), added];
        total = lines.reduce((a, l) => a + l.amountCents, 0);
        note = `; overage ${added.amountCents} cents added`;
      }
    }
    const asOf = new Date(event.created * 1000);
    const existing = await m.findOne(BillingInvoiceEntity, {
      where: { id: inv.id! },
      lock: { mode: 'pessimistic_write' },
    });
    const rank = INVOICE_RANK[inv.status ?? 'draft'] ?? 0;
    if (existing) {
      const held = INVOICE_RANK[existing.status] ?? 0;
      if (rank < held || (rank === held && asOf < existing.stateAsOf))
        return `stale: invoice already ${existing.status}`;
    }
    await m.save(BillingInvoiceEntity, {
      id: inv.id!,
      organizationId: orgId,
      subscriptionId,
      status: inv.status ?? 'draft',
      billingReason: inv.billing_reason ?? 'manual',
      currency: inv.currency,
      totalCents: total,
      amountPaidCents: inv.amount_paid ?? 0,
      periodStart: at(inv.period_start),
      periodEnd: at(inv.period_end),
      lines,
      issuedAt: at(inv.created) ?? asOf,
      stateAsOf: asOf,
    });
    if ((event.type === 'invoice.paid' && total > 0) || event.type === 'invoice.payment_failed') {
      const plan = lines.find((l) => l.kind === 'plan')?.description ?? 'your plan';
      const failed = event.type === 'invoice.payment_failed';
      const fallback = failed ? await this.planAfterFailedPayment(m, orgId, subscriptionId) : null;
      const mail: PaymentMail = {
        kind: failed ? 'payment-failed' : 'payment-succeeded',
        organizationId: orgId,
        invoiceId: inv.id!,
        amount: `${(total / 100).toFixed(2)} ${inv.currency.toUpperCase()}`,
        planName: plan,
        ...(fallback ? { fallbackPlanName: fallback.planName } : {}),
        ...(fallback?.over
          ? {
              seats: {
                planName: fallback.planName,
                seats: fallback.seats,
                members: fallback.members,
                teamLink: `${this.config.publicUrl}/team`,
              },
            }
          : {}),
      };
      await this.mailer.send(mail, `${this.config.publicUrl}/billing`, m);
    }
    return `invoice ${inv.status}${note}`;
  }

  /**
   * The plan a failed payment of `subscriptionId` leaves the organisation on (its newest other
   * subscription in good standing, else free). `over` when that plan has fewer seats than the
   * members and fewer than the subscription's own plan: the same rule as the seats notice, worked
   * out whether or not the subscription event that applies the drop has arrived yet.
   */
  private async planAfterFailedPayment(
    m: EntityManager,
    orgId: string,
    subscriptionId: string | null,
  ): Promise<{ planName: string; seats: number; members: number; over: boolean } | null> {
    if (!subscriptionId) return null;
    const rows: { lost_seats: number; name: string; seats: number; members: number }[] =
      await m.query(
        `SELECT lost.seats AS lost_seats, fallback.name, fallback.seats,
                (SELECT count(*)::int FROM memberships WHERE organization_id = $1) AS members
           FROM billing_subscriptions s
           JOIN plans lost ON lost.code = s.plan_code
           JOIN plans fallback ON fallback.code = coalesce(
                (SELECT plan_code FROM billing_subscriptions
                  WHERE organization_id = $1 AND id <> $2 AND status = ANY($3)
                  ORDER BY started_at DESC, state_as_of DESC LIMIT 1), 'free')
          WHERE s.id = $2 AND s.organization_id = $1`,
        [orgId, subscriptionId, ENTITLED],
      );
    const r = rows[0];
    if (!r) return null;
    const over = r.members > r.seats && r.lost_seats > r.seats;
    return { planName: r.name, seats: r.seats, members: r.members, over };
  }

  /** Reports the period's metered overage onto the draft invoice (once: idempotency key). */
  private async addOverage(
    m: EntityManager,
    orgId: string,
    subscriptionId: string | null,
    inv: Stripe.Invoice,
  ): Promise<InvoiceLine | null> {
    if (!subscriptionId || !this.payments || !inv.period_start || !inv.period_end) return null;
    const sub = await m.findOneBy(BillingSubscriptionEntity, { id: subscriptionId });
    const plan = sub && (await m.findOneBy(PlanEntity, { code: sub.planCode }));
    if (!plan) return null;
    const o = await overageFor(
      this.ds,
      orgId,
      plan,
      new Date(inv.period_start * 1000),
      new Date(inv.period_end * 1000),
    );
    if (!o || o.amountCents <= 0) return null;
    const description = `API calls over the included ${o.includedCalls.toLocaleString('en')}: ${o.overCalls.toLocaleString('en')} at ${o.pricePer1000Cents} cents per 1,000 (${o.from} to ${o.to})`;
    await this.payments.invoiceItems.create(
      {
        customer: typeof inv.customer === 'string' ? inv.customer : inv.customer!.id,
        invoice: inv.id!,
        amount: o.amountCents,
        currency: inv.currency,
        description,
        metadata: {
          kind: 'overage',
          over_calls: String(o.overCalls),
          billable_calls: String(o.billableCalls),
        },
      } as Stripe.InvoiceItemCreateParams,
      { idempotencyKey: `overage-${inv.id}` },
    );
    return { description, amountCents: o.amountCents, kind: 'overage', quantity: o.overCalls };
  }
}

function toLine(l: Stripe.InvoiceLineItem): InvoiceLine {
  const kind = (l.metadata?.kind as string | undefined) ?? '';
  return {
    description: l.description ?? '',
    amountCents: l.amount,
    kind: kind === 'plan' || kind === 'overage' ? kind : 'other',
    quantity: kind === 'overage' ? Number(l.metadata?.over_calls ?? 0) : (l.quantity ?? 1),
  };
}
