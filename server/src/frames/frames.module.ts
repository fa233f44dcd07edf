import { Module } from '@nestjs/common';
import { IdempotencyModule } from '../idempotency/idempotency.module.js';
import { PlansModule } from '../plans/plans.module.js';
import { FramesController } from './frames.controller.js';
import { FramesService } from './frames.service.js';
import { ObjectStore } from './object-store.service.js';
import { FrameOrphanSweeper } from './orphan-sweeper.service.js';

@Module({
  imports: [PlansModule, IdempotencyModule],
  controllers: [FramesController],
  providers: [FramesService, ObjectStore, FrameOrphanSweeper],
})
export class FramesModule {}
