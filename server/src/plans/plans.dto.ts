import { num, str, bool } from '../compute/schemas/common.js';
import { schemaDto, type ObjectSchema } from '../compute/validation/schema-dto.js';
import type { PlanEntity } from './plan.entity.js';
import { TEST_KEY_RATE } from './plan-catalogue.js';

export interface PlanDto {
  code: string;
  name: string;
  description: string;
  monthlyPriceCents: number;
  includedCallsPerMonth: number;
  testCallsPerMonth: number;
  ratePerSecond: number;
  burst: number;
  testKeyRatePerSecond: number;
  testKeyBurst: number;
  overagePricePer1000Cents: number | null;
  features: { uploads: boolean; savedSetups: number | null; seats: number };
}

export const toPlanDto = (p: PlanEntity): PlanDto => ({
  code: p.code,
  name: p.name,
  description: p.description,
  monthlyPriceCents: p.monthlyPriceCents,
  includedCallsPerMonth: p.includedCallsPerMonth,
  testCallsPerMonth: p.testCallsPerMonth,
  ratePerSecond: p.ratePerSecond,
  burst: p.burst,
  // What the rate-limit guard gives a test key: the plan's, capped at the test-key limits.
  testKeyRatePerSecond: Math.min(p.ratePerSecond, TEST_KEY_RATE.ratePerSecond),
  testKeyBurst: Math.min(p.burst, TEST_KEY_RATE.burst),
  overagePricePer1000Cents: p.overagePricePer1000Cents,
  features: { uploads: p.uploads, savedSetups: p.savedSetups, seats: p.seats },
});

const planSchema: ObjectSchema = {
  type: 'object',
  properties: {
    code: str('Plan code.', 'studio', { enum: ['free', 'studio', 'platform'] }),
    name: str('Display name.', 'Studio'),
    description: str('One line about the plan.'),
    monthlyPriceCents: num('Monthly price, cents.', 2900),
    includedCallsPerMonth: num('Live calls included per calendar month (UTC).', 100000),
    testCallsPerMonth: num('Test-key calls allowed per month (test keys are free).', 20000),
    ratePerSecond: num('Sustained calls per second per live API key.', 50),
    burst: num('Calls a live key may make at once before the rate applies.', 100),
    testKeyRatePerSecond: num(
      `Sustained calls per second per test key: the plan's rate, at most ${TEST_KEY_RATE.ratePerSecond}.`,
      TEST_KEY_RATE.ratePerSecond,
    ),
    testKeyBurst: num(
      `Calls a test key may make at once: the plan's burst, at most ${TEST_KEY_RATE.burst}.`,
      TEST_KEY_RATE.burst,
    ),
    overagePricePer1000Cents: {
      type: ['number', 'null'],
      description: 'Price per 1,000 live calls over the included amount, cents; null = hard cap.',
      example: 40,
    },
    features: {
      type: 'object',
      description: 'What the plan includes.',
      required: ['uploads', 'savedSetups', 'seats'],
      properties: {
        uploads: bool('Test-frame uploads.', true),
        savedSetups: {
          type: ['number', 'null'],
          description: 'Saved setups; null = unlimited.',
          example: 500,
        },
        seats: num(
          'Seats: members plus pending invitations. Invitations and acceptances beyond them get a 409 problem with limit "seats".',
          10,
        ),
      },
    },
  },
};
planSchema.required = Object.keys(planSchema.properties);

export const PlanResponseDto = schemaDto('PlanResponseDto', planSchema);

export const PlanListResponseDto = schemaDto('PlanListResponseDto', {
  type: 'object',
  required: ['data'],
  properties: { data: { type: 'array', items: planSchema } },
});

export const CurrentPlanResponseDto = schemaDto('CurrentPlanResponseDto', {
  type: 'object',
  required: ['plan', 'periodStart', 'resetsAt', 'usage'],
  properties: {
    plan: planSchema,
    periodStart: str('First day of this billing month (UTC).', '2026-12-01', { format: 'date' }),
    resetsAt: str('When the monthly quota resets (ISO 8601).', '2027-01-01T00:00:00.000Z'),
    usage: {
      type: 'object',
      required: [
        'liveCalls',
        'testCalls',
        'consoleCalls',
        'billableUnits',
        'liveCallsCounted',
        'testCallsCounted',
        'seatsUsed',
        'members',
        'pendingInvites',
      ],
      properties: {
        liveCalls: num('Calls with live keys this month, failures included.', 1520),
        testCalls: num('Calls with test keys this month, failures included.', 310),
        liveCallsCounted: num(
          'Successful live-key calls this month: what counts against includedCallsPerMonth.',
          1498,
        ),
        testCallsCounted: num(
          'Successful test-key calls this month: what counts against testCallsPerMonth.',
          301,
        ),
        consoleCalls: num('Calls from the console this month (not billed).', 42),
        billableUnits: num('Billable units this month (successful live calls).', 1498),
        seatsUsed: num(
          'Seats taken against plan.features.seats: members plus pending invitations (not accepted, canceled or expired). It can exceed the seats after a move to a smaller plan; then nobody new can be invited or join until it is under them.',
          3,
          { minimum: 0 },
        ),
        members: num('Members of the organisation.', 2, { minimum: 0 }),
        pendingInvites: num('Invitations that can still be accepted.', 1, { minimum: 0 }),
      },
    },
  },
});
