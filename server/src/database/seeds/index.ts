// Demo-scenario seeders, run in order by `npm run seed`; each must be idempotent.
import type { DataSource } from 'typeorm';
import type { AppConfig } from '../../config/config.js';
import { plansSeeder } from '../../plans/plans.seeder.js';
import { accountsSeeder } from '../../auth/accounts.seeder.js';
import { gearSeeder } from '../../gear/gear.seeder.js';
import { setupsSeeder } from '../../setups/setups.seeder.js';
import { usageSeeder } from '../../usage/usage.seeder.js';
import { framesSeeder } from '../../frames/frames.seeder.js';
import { billingSeeder } from '../../billing/billing.seeder.js';

/** `config` is the server's (object storage for the frames); seeders that need none ignore it. */
export type Seeder = { name: string; run: (ds: DataSource, config?: AppConfig) => Promise<void> };

export const SEEDERS: Seeder[] = [
  plansSeeder,
  accountsSeeder,
  gearSeeder,
  setupsSeeder,
  usageSeeder,
  framesSeeder,
  billingSeeder,
];
