// Keeps the plans table in step with the catalogue (idempotent upsert).
import type { DataSource } from 'typeorm';
import type { Seeder } from '../database/seeds/index.js';
import { PLAN_CATALOGUE } from './plan-catalogue.js';

export const plansSeeder: Seeder = {
  name: 'plans',
  run: async (ds: DataSource) => {
    for (const p of PLAN_CATALOGUE) {
      await ds.query(
        `INSERT INTO plans (code, name, description, monthly_price_cents, included_calls_per_month,
           test_calls_per_month, rate_per_second, burst, overage_price_per_1000_cents, uploads,
           saved_setups, seats, sort_order)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13)
         ON CONFLICT (code) DO UPDATE SET name = EXCLUDED.name, description = EXCLUDED.description,
           monthly_price_cents = EXCLUDED.monthly_price_cents,
           included_calls_per_month = EXCLUDED.included_calls_per_month,
           test_calls_per_month = EXCLUDED.test_calls_per_month,
           rate_per_second = EXCLUDED.rate_per_second, burst = EXCLUDED.burst,
           overage_price_per_1000_cents = EXCLUDED.overage_price_per_1000_cents,
           uploads = EXCLUDED.uploads, saved_setups = EXCLUDED.saved_setups,
           seats = EXCLUDED.seats, sort_order = EXCLUDED.sort_order, updated_at = now()`,
        [
          p.code,
          p.name,
          p.description,
          p.monthlyPriceCents,
          p.includedCallsPerMonth,
          p.testCallsPerMonth,
          p.ratePerSecond,
          p.burst,
          p.overagePricePer1000Cents,
          p.uploads,
          p.savedSetups,
          p.seats,
          p.sortOrder,
        ],
      );
    }
  },
};
