// Every migration, in order. Add new migrations at the end.
import { Init1764633600000 } from './1764633600000-Init.js';
import { Accounts1764720000000 } from './1764720000000-Accounts.js';
import { MeteringPlans1764806400000 } from './1764806400000-MeteringPlans.js';
import { Frames1764892800000 } from './1764892800000-Frames.js';
import { GearSetups1764979200000 } from './1764979200000-GearSetups.js';
import { Billing1765065600000 } from './1765065600000-Billing.js';
import { UserPreferences1765152000000 } from './1765152000000-UserPreferences.js';
import { UsageErrorIndex1765238400000 } from './1765238400000-UsageErrorIndex.js';
import { IdempotencyKeys1765324800000 } from './1765324800000-IdempotencyKeys.js';
import { DemoSeedRows1765411200000 } from './1765411200000-DemoSeedRows.js';

export const MIGRATIONS = [
  Init1764633600000,
  Accounts1764720000000,
  MeteringPlans1764806400000,
  Frames1764892800000,
  GearSetups1764979200000,
  Billing1765065600000,
  UserPreferences1765152000000,
  UsageErrorIndex1765238400000,
  IdempotencyKeys1765324800000,
  DemoSeedRows1765411200000,
];
