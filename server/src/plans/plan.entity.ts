import { Check, Column, Entity, PrimaryColumn } from 'typeorm';

/** A plan: quota, rate, overage price and features. See plan-catalogue.ts for the seeded ones. */
@Entity('plans')
@Check('plans_monthly_price_cents_check', 'monthly_price_cents >= 0')
@Check('plans_included_calls_per_month_check', 'included_calls_per_month >= 0')
@Check('plans_test_calls_per_month_check', 'test_calls_per_month >= 0')
@Check('plans_rate_per_second_check', 'rate_per_second > 0')
@Check('plans_burst_check', 'burst > 0')
@Check('plans_overage_price_per_1000_cents_check', 'overage_price_per_1000_cents >= 0')
@Check('plans_seats_check', 'seats > 0')
export class PlanEntity {
  @PrimaryColumn({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  description: string;

  @Column({ type: 'integer' })
  monthlyPriceCents: number;

  @Column({ type: 'integer' })
  includedCallsPerMonth: number;

  @Column({ type: 'integer' })
  testCallsPerMonth: number;

  @Column({ type: 'integer' })
  ratePerSecond: number;

  @Column({ type: 'integer' })
  burst: number;

  @Column({ type: 'integer', name: 'overage_price_per_1000_cents', nullable: true })
  overagePricePer1000Cents: number | null;

  @Column({ type: 'boolean' })
  uploads: boolean;

  @Column({ type: 'integer', nullable: true })
  savedSetups: number | null;

  @Column({ type: 'integer' })
  seats: number;

  @Column({ type: 'integer' })
  sortOrder: number;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  createdAt: Date;

  @Column({ type: 'timestamptz', default: () => 'now()' })
  updatedAt: Date;
}
