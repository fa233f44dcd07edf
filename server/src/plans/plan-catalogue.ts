// The plans every deployment has (reference data, not demo data): seeded by the migration and
// kept in step by the plans seeder. Prices are in cents of the account currency.
export interface PlanDefinition {
  code: 'free' | 'studio' | 'platform';
  name: string;
  description: string;
  monthlyPriceCents: number;
  /** Live calls included each calendar month (UTC). */
  includedCallsPerMonth: number;
  /** Test-key calls allowed each month: test keys are free but limited. */
  testCallsPerMonth: number;
  /** Sustained calls per second per API key (token-bucket refill rate). */
  ratePerSecond: number;
  /** Calls a key may make at once before the rate applies (token-bucket size). */
  burst: number;
  /** Price per 1,000 live calls over the included amount; null = hard cap at the quota. */
  overagePricePer1000Cents: number | null;
  uploads: boolean;
  /** Saved setups allowed; null = unlimited. */
  savedSetups: number | null;
  seats: number;
  sortOrder: number;
}

export const PLAN_CATALOGUE: readonly PlanDefinition[] = [
  {
    code: 'free',
    name: 'Free',
    description: 'Try the API and build a prototype.',
    monthlyPriceCents: 0,
    includedCallsPerMonth: 2_000,
    testCallsPerMonth: 2_000,
    ratePerSecond: 5,
    burst: 10,
    overagePricePer1000Cents: null,
    uploads: false,
    savedSetups: 10,
    seats: 2,
    sortOrder: 1,
  },
  {
    code: 'studio',
    name: 'Studio',
    description: 'For a working studio and its own apps.',
    monthlyPriceCents: 2_900,
    includedCallsPerMonth: 100_000,
    testCallsPerMonth: 20_000,
    ratePerSecond: 50,
    burst: 100,
    overagePricePer1000Cents: 40,
    uploads: true,
    savedSetups: 500,
    seats: 10,
    sortOrder: 2,
  },
  {
    code: 'platform',
    name: 'Platform',
    description: 'For companies that build photographers’ apps on the API.',
    monthlyPriceCents: 39_900,
    includedCallsPerMonth: 5_000_000,
    testCallsPerMonth: 200_000,
    ratePerSecond: 20_000,
    burst: 40_000,
    overagePricePer1000Cents: 12,
    uploads: true,
    savedSetups: null,
    seats: 50,
    sortOrder: 3,
  },
];

/** Test keys never get more than this, whatever the plan (they are free). */
export const TEST_KEY_RATE = { ratePerSecond: 10, burst: 20 };
/** Calls from a console session (the playground), per user. */
export const CONSOLE_RATE = { ratePerSecond: 5, burst: 20 };
