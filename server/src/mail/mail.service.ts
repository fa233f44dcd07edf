// Outgoing mail through a durable pg-boss queue: the request only inserts a job row; a worker
// delivers it over SMTP with retries, so a slow or failing SMTP server never slows a request.
import {
  Inject,
  Injectable,
  Logger,
  OnApplicationBootstrap,
  OnApplicationShutdown,
} from '@nestjs/common';
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import nodemailer, { Transporter } from 'nodemailer';
import PgBoss from 'pg-boss';
import type { EntityManager } from 'typeorm';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { MailTemplate, render } from './templates.js';

export const MAIL_QUEUE = 'mail';

export type MailJob = MailTemplate & { to: string };

/**
 * What the queue stores: the template name and recipient in clear (for operations), the data —
 * which holds single-use links such as password-reset tokens — sealed with AES-256-GCM under a
 * key derived from the session secret, so the job table never holds a usable token.
 */
interface QueuedMail {
  template: MailJob['template'];
  to: string;
  sealed: string;
}

function mailKey(secret: string): Buffer {
  return Buffer.from(hkdfSync('sha256', secret, 'lumenwright', 'mail-queue-v1', 32));
}

export function sealMail(job: MailJob, secret: string): QueuedMail {
  const iv = randomBytes(12);
  const c = createCipheriv('aes-256-gcm', mailKey(secret), iv);
  const body = Buffer.concat([c.update(JSON.stringify(job.data), 'utf8'), c.final()]);
  const sealed = Buffer.concat([iv, c.getAuthTag(), body]).toString('base64');
  return { template: job.template, to: job.to, sealed };
}

export function unsealMail(q: QueuedMail, secret: string): MailJob {
  const raw = Buffer.from(q.sealed, 'base64');
  const d = createDecipheriv('aes-256-gcm', mailKey(secret), raw.subarray(0, 12));
  d.setAuthTag(raw.subarray(12, 28));
  const data = JSON.parse(Buffer.concat([d.update(raw.subarray(28)), d.final()]).toString('utf8'));
  return { template: q.template, to: q.to, data } as MailJob;
}

@Injectable()
export class MailService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('MailService');
  private boss: PgBoss | null = null;
  private transport: Transporter | null = null;
  private started: Promise<void> | null = null;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  async onApplicationBootstrap(): Promise<void> {
    this.started = this.start();
    await this.started;
  }

  private async start(): Promise<void> {
    const boss = new PgBoss({
      connectionString: this.config.databaseUrl,
      schema: 'pgboss',
      max: 4,
      application_name: 'lumenwright-mail',
      schedule: false,
    });
    boss.on('error', (err: Error) => this.logger.warn(`mail queue: ${err.message}`));
    await boss.start();
    await boss.createQueue(MAIL_QUEUE, {
      name: MAIL_QUEUE,
      retryLimit: 10,
      retryDelay: 5,
      retryBackoff: true,
      // Jobs that still fail after the retries stay in the table (state "failed") for inspection.
      retentionDays: 14,
    });
    this.transport = this.config.smtpUrl
      ? nodemailer.createTransport(smtpOptions(this.config.smtpUrl))
      : nodemailer.createTransport({ jsonTransport: true });
    // One job per handler call: a failure retries that message only (v10 hands over arrays).
    for (let i = 0; i < 2; i++) {
      await boss.work<QueuedMail>(
        MAIL_QUEUE,
        { batchSize: 1, pollingIntervalSeconds: this.config.nodeEnv === 'test' ? 0.5 : 2 },
        async (jobs) => {
          for (const job of jobs)
            await this.deliver(unsealMail(job.data, this.config.sessionSecret));
        },
      );
    }
    this.boss = boss;
  }

  /**
   * Queues a message; resolves once the job row is written (milliseconds, no SMTP involved).
   * Given a transaction's EntityManager, the job row is inserted inside that transaction (an
   * outbox): it commits with the change that caused it, or rolls back with it, so a message is
   * never lost after a commit nor sent for a change that did not happen.
   */
  async send(job: MailJob, within?: EntityManager): Promise<void> {
    if (!this.boss) await this.started;
    if (!this.boss) throw new Error('The mail queue is not running');
    await this.boss.send(MAIL_QUEUE, sealMail(job, this.config.sessionSecret), {
      retryLimit: 10,
      retryDelay: 5,
      retryBackoff: true,
      ...(within ? { db: transactionDb(within) } : {}),
    });
  }

  private async deliver(job: MailJob): Promise<void> {
    const msg = render(job);
    await this.transport!.sendMail({
      from: this.config.mailFrom,
      to: job.to,
      subject: msg.subject,
      text: msg.text,
      html: msg.html,
    });
    if (!this.config.smtpUrl) this.logger.log(`mail not delivered (no SMTP_URL): "${msg.subject}"`);
  }

  async onApplicationShutdown(): Promise<void> {
    const boss = this.boss;
    this.boss = null;
    if (boss) await boss.stop({ graceful: true, timeout: 3000, wait: true, close: true });
    this.transport?.close();
  }
}

/** pg-boss's database interface over a TypeORM transaction (structured result: the rows). */
function transactionDb(m: EntityManager): PgBoss.Db {
  return {
    executeSql: async (text: string, values: unknown[]) => {
      if (!m.queryRunner) throw new Error('A mail outbox needs a transaction');
      const result = await m.queryRunner.query(text, values, true);
      return { rows: result.records };
    },
  };
}

/** SMTP_URL (smtp[s]://user:pass@host:port) as transport options, with timeouts. */
function smtpOptions(url: string) {
  const u = new URL(url);
  const secure = u.protocol === 'smtps:';
  return {
    host: u.hostname,
    port: u.port ? Number(u.port) : secure ? 465 : 587,
    secure,
    ...(u.username
      ? { auth: { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } }
      : {}),
    // A local fake has no certificate; only upgrade to TLS when the server offers it.
    ignoreTLS: !secure && (u.hostname === '127.0.0.1' || u.hostname === 'localhost'),
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 20_000,
  };
}
