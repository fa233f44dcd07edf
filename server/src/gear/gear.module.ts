import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { PlansModule } from '../plans/plans.module.js';
import { GEAR_ENTITIES } from './gear.entities.js';
import { GearReferenceResolver } from './gear-reference.resolver.js';
import { GelKitsController } from './gel-kits.controller.js';
import { GelKitsService } from './gel-kits.service.js';
import { LightsController } from './lights.controller.js';
import { LightsService } from './lights.service.js';
import { ModifiersController } from './modifiers.controller.js';
import { ModifiersService } from './modifiers.service.js';

/** The organisation's gear; exports the resolver that turns gear ids in requests into values. */
@Module({
  imports: [TypeOrmModule.forFeature(GEAR_ENTITIES), PlansModule],
  controllers: [LightsController, ModifiersController, GelKitsController],
  providers: [LightsService, ModifiersService, GelKitsService, GearReferenceResolver],
  exports: [GearReferenceResolver],
})
export class GearModule {}
