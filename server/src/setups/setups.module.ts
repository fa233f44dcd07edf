import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { GearModule } from '../gear/gear.module.js';
import { SetupPlanner } from './setup-planner.service.js';
import { SetupEntity } from './setup.entity.js';
import { SetupsController } from './setups.controller.js';
import { SetupsService } from './setups.service.js';

@Module({
  imports: [TypeOrmModule.forFeature([SetupEntity]), GearModule],
  controllers: [SetupsController],
  providers: [SetupsService, SetupPlanner],
})
export class SetupsModule {}
