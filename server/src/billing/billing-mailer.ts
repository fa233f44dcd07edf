// Payment e-mails to the organisation's owners, through the accounts feature's mail queue.
// The two templates ('payment-succeeded', 'payment-failed') belong in src/mail/templates.ts
// (accounts' file); until they are there, nothing is queued and a warning is logged once, so
// the queue never holds jobs its worker cannot render.
import { Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { MailService, type MailJob } from '../mail/mail.service.js';
import { render } from '../mail/templates.js';

export interface PaymentMail {
  kind: 'payment-succeeded' | 'payment-failed';
  organizationId: string;
  invoiceId: string;
  amount: string;
  planName: string;
}

@Injectable()
export class BillingMailer {
  private readonly logger = new Logger('BillingMailer');
  private warned = false;

  constructor(
    @InjectDataSource() private readonly ds: DataSource,
    private readonly mail: MailService,
  ) {}

  /** Whether the mail worker can render the payment templates. */
  static supported(): boolean {
    try {
      const sample = {
        name: 'x',
        organizationName: 'x',
        amount: 'x',
        planName: 'x',
        invoiceId: 'x',
        link: 'http://127.0.0.1/',
      };
      const a = render({ template: 'payment-succeeded', data: sample } as unknown as MailJob);
      const b = render({ template: 'payment-failed', data: sample } as unknown as MailJob);
      return !!a?.subject && !!b?.subject;
    } catch {
      return false;
    }
  }

  /** Queues one message per owner; returns how many were queued. */
  async send(m: PaymentMail, link: string): Promise<number> {
    if (!BillingMailer.supported()) {
      if (!this.warned) {
        this.logger.warn(
          'payment e-mail templates are missing from src/mail/templates.ts: not queued',
        );
        this.warned = true;
      }
      return 0;
    }
    const owners: { email: string; name: string; org: string }[] = await this.ds.query(
      `SELECT u.email, u.name, o.name AS org FROM memberships m
         JOIN users u ON u.id = m.user_id JOIN organizations o ON o.id = m.organization_id
       WHERE m.organization_id = $1 AND m.role = 'owner'`,
      [m.organizationId],
    );
    for (const o of owners) {
      const data = {
        name: o.name,
        organizationName: o.org,
        amount: m.amount,
        planName: m.planName,
        invoiceId: m.invoiceId,
        link,
      };
      await this.mail.send({ template: m.kind, to: o.email, data } as unknown as MailJob);
    }
    return owners.length;
  }
}
