import { Module } from '@nestjs/common';
import { PlansModule } from '../plans/plans.module.js';
import { FramesController } from './frames.controller.js';
import { FramesService } from './frames.service.js';
import { ObjectStore } from './object-store.service.js';

@Module({
  imports: [PlansModule],
  controllers: [FramesController],
  providers: [FramesService, ObjectStore],
})
export class FramesModule {}
