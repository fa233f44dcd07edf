import { Module } from '@nestjs/common';
import { PlansModule } from '../plans/plans.module.js';
import { IdempotencyGuard, IdempotentMeteredCallGuard } from './idempotency.guard.js';
import { IdempotencyHook } from './idempotency.hook.js';
import { IdempotencyService } from './idempotency.service.js';
import { IdempotencySweeper } from './idempotency-sweeper.service.js';

/** Idempotency-Key for the metered POSTs (computations and frame uploads). */
@Module({
  imports: [PlansModule],
  providers: [
    IdempotencyService,
    IdempotencyGuard,
    IdempotentMeteredCallGuard,
    IdempotencyHook,
    IdempotencySweeper,
  ],
  exports: [
    IdempotencyService,
    IdempotencyGuard,
    IdempotentMeteredCallGuard,
    IdempotencySweeper,
    PlansModule,
  ],
})
export class IdempotencyModule {}
