// Billing e-mails to the organisation's owners, through the durable mail queue (templates
// 'payment-succeeded', 'payment-failed' and 'seats-over-plan' in src/mail/templates.ts). A failed
// payment that also leaves more members than seats is one 'payment-failed' e-mail saying both.
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import { MailService, type MailJob } from '../mail/mail.service.js';
import type { SeatsAfterFailedPayment } from '../mail/templates.js';

export interface PaymentMail {
  kind: 'payment-succeeded' | 'payment-failed';
  organizationId: string;
  invoiceId: string;
  amount: string;
  planName: string;
  /** Payment failed, and the plan it leaves the studio on has fewer seats than its members. */
  seats?: SeatsAfterFailedPayment;
  /** Payment failed: the plan it leaves the studio on until a payment goes through. */
  fallbackPlanName?: string;
}

/** A plan change (by webhook) left more members than the new plan's seats. */
export interface SeatsOverPlanMail {
  organizationId: string;
  planName: string;
  seats: number;
  members: number;
}

interface Owner {
  email: string;
  name: string;
  org: string;
}

@Injectable()
export class BillingMailer {
  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    private readonly mail: MailService,
  ) {}

  /**
   * Queues one message per owner; returns how many were queued. Given the webhook's transaction,
   * the messages commit (or roll back) with the event that caused them.
   */
  async send(m: PaymentMail, link: string, within?: EntityManager): Promise<number> {
    const owners = await this.owners(m.organizationId, within);
    for (const o of owners) {
      const data = {
        name: o.name,
        organizationName: o.org,
        amount: m.amount,
        planName: m.planName,
        invoiceId: m.invoiceId,
        link,
        ...(m.seats ? { seats: m.seats } : {}),
        ...(m.fallbackPlanName ? { fallbackPlanName: m.fallbackPlanName } : {}),
      };
      await this.mail.send({ template: m.kind, to: o.email, data } as MailJob, within);
    }
    return owners.length;
  }

  /** Queues the seats notice to every owner; `link` is the console's Team page. */
  async sendSeatsOverPlan(
    m: SeatsOverPlanMail,
    link: string,
    within?: EntityManager,
  ): Promise<number> {
    const owners = await this.owners(m.organizationId, within);
    for (const o of owners) {
      await this.mail.send(
        {
          template: 'seats-over-plan',
          to: o.email,
          data: {
            name: o.name,
            organizationName: o.org,
            planName: m.planName,
            seats: m.seats,
            members: m.members,
            link,
          },
        },
        within,
      );
    }
    return owners.length;
  }

  private owners(organizationId: string, within?: EntityManager): Promise<Owner[]> {
    return (within ?? this.ds).query(
      `SELECT u.email, u.name, o.name AS org FROM memberships m
         JOIN users u ON u.id = m.user_id JOIN organizations o ON o.id = m.organization_id
       WHERE m.organization_id = $1 AND m.role = 'owner'`,
      [organizationId],
    );
  }
}
