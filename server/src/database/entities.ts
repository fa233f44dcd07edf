// Every TypeORM entity, listed once. Add new entities here.
import { ACCOUNTS_ENTITIES } from '../auth/accounts.entities.js';
import { PlanEntity } from '../plans/plan.entity.js';
import { FrameEntity } from '../frames/frame.entity.js';
import { BILLING_ENTITIES } from '../billing/billing.entities.js';
import { GEAR_ENTITIES } from '../gear/gear.entities.js';
import { SetupEntity } from '../setups/setup.entity.js';
import { IdempotencyKeyEntity } from '../idempotency/idempotency-key.entity.js';
import { DemoSeedRowEntity } from './seeds/demo-seed-row.entity.js';
export const ENTITIES: (new (...args: never[]) => unknown)[] = [
  ...ACCOUNTS_ENTITIES,
  PlanEntity,
  FrameEntity,
  ...BILLING_ENTITIES,
  ...GEAR_ENTITIES,
  SetupEntity,
  IdempotencyKeyEntity,
  DemoSeedRowEntity,
];
