import { Module } from '@nestjs/common';
import { GearModule } from '../gear/gear.module.js';
import { IdempotencyModule } from '../idempotency/idempotency.module.js';
import { PlansModule } from '../plans/plans.module.js';
import { ComputeController } from './compute.controller.js';
import { ComputeService } from './compute.service.js';

@Module({
  imports: [PlansModule, GearModule, IdempotencyModule],
  controllers: [ComputeController],
  providers: [ComputeService],
})
export class ComputeModule {}
