// Feature modules, one line each. Add yours at the end.
import type { Type } from '@nestjs/common';
import { ACCOUNTS_MODULES } from './auth/accounts.modules.js';
import { ComputeModule } from './compute/compute.module.js';
import { FramesModule } from './frames/frames.module.js';
import { BillingModule } from './billing/billing.module.js';
import { GearModule } from './gear/gear.module.js';
import { SetupsModule } from './setups/setups.module.js';

export const FEATURE_MODULES: Type[] = [
  ...ACCOUNTS_MODULES,
  ComputeModule,
  FramesModule,
  BillingModule,
  GearModule,
  SetupsModule,
];
