// The plan list states the rates the rate-limit guard applies, for live and test keys alike.
import { rateFor } from './metered-call.guard.js';
import { PLAN_CATALOGUE } from './plan-catalogue.js';
import type { PlanEntity } from './plan.entity.js';
import { toPlanDto } from './plans.dto.js';

const key = (keyMode: 'live' | 'test') => ({
  kind: 'api-key' as const,
  userId: null,
  organizationId: '00000000-0000-4000-8000-000000000001',
  role: null,
  keyId: '00000000-0000-4000-8000-000000000002',
  keyMode,
});

describe('plan DTO rates', () => {
  it.each(PLAN_CATALOGUE.map((p) => [p.code, p] as const))(
    '%s: published live and test-key rates are the ones the guard applies',
    (_code, def) => {
      const plan = def as unknown as PlanEntity;
      const dto = toPlanDto(plan);
      expect({ rate: dto.ratePerSecond, burst: dto.burst }).toEqual(rateFor(plan, key('live')));
      expect({ rate: dto.testKeyRatePerSecond, burst: dto.testKeyBurst }).toEqual(
        rateFor(plan, key('test')),
      );
    },
  );

  it('caps test keys at 10 a second, burst 20, on the paid plans', () => {
    const studio = toPlanDto(
      PLAN_CATALOGUE.find((p) => p.code === 'studio') as unknown as PlanEntity,
    );
    expect([studio.testKeyRatePerSecond, studio.testKeyBurst]).toEqual([10, 20]);
    // The free plan's own limits (5 a second, burst 10) are already below the cap.
    const free = toPlanDto(PLAN_CATALOGUE.find((p) => p.code === 'free') as unknown as PlanEntity);
    expect([free.testKeyRatePerSecond, free.testKeyBurst]).toEqual([5, 10]);
  });
});
