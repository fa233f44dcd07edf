import { Module } from '@nestjs/common';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { PlansModule } from '../plans/plans.module.js';
import { BillingController } from './billing.controller.js';
import { BillingMailer } from './billing-mailer.js';
import { BillingService } from './billing.service.js';
import { PAYMENTS, paymentsClient } from './payments.client.js';
import { WebhookService } from './webhook.service.js';

@Module({
  imports: [PlansModule],
  controllers: [BillingController],
  providers: [
    { provide: PAYMENTS, inject: [APP_CONFIG], useFactory: (c: AppConfig) => paymentsClient(c) },
    BillingService,
    WebhookService,
    BillingMailer,
  ],
})
export class BillingModule {}
