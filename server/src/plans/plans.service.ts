// Plans and which plan an organisation is on, cached briefly: plan changes take effect within
// PLAN_CACHE_MS on every instance (the billing feature can call forget() on its own instance).
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';
import { isTransientDependencyError } from '../common/errors/transient.js';
import { PlanEntity } from './plan.entity.js';

/**
 * A dependency could not answer now: a 503 the client may retry. An answer that says our own
 * request was wrong (an SQL or script error) is a bug and stays itself: a logged 500.
 */
export const dependencyUnavailable = (what: string) => (err?: unknown) => {
  if (err instanceof DomainError) return err;
  if (err !== undefined && !isTransientDependencyError(err)) return err;
  return new DomainError('unavailable', `${what} is unavailable; try again shortly.`, [], {
    'Retry-After': '2',
  });
};

export const databaseUnavailable = dependencyUnavailable('The database');

const PLAN_CACHE_MS = 30_000;

@Injectable()
export class PlansService {
  private plans: Map<string, PlanEntity> | null = null;
  private plansLoadedAt = 0;
  private readonly orgPlan = new Map<string, { code: string; at: number }>();

  constructor(@InjectDataSource() private readonly ds: DataSource) {}

  async list(): Promise<PlanEntity[]> {
    const plans = await this.catalogue();
    return [...plans.values()].sort((a, b) => a.sortOrder - b.sortOrder);
  }

  /** The organisation's plan; falls back to the free plan if the organisation has none. */
  async forOrganization(organizationId: string): Promise<PlanEntity> {
    const now = Date.now();
    const plans = await this.catalogue();
    let cached = this.orgPlan.get(organizationId);
    if (!cached || now - cached.at > PLAN_CACHE_MS) {
      try {
        const rows: { plan_code: string }[] = await this.ds.query(
          `SELECT plan_code FROM organizations WHERE id = $1`,
          [organizationId],
        );
        cached = { code: rows[0]?.plan_code ?? 'free', at: now };
        this.orgPlan.set(organizationId, cached);
      } catch (err) {
        // Database down: a plan we knew a moment ago is better than failing the call.
        if (!cached) throw databaseUnavailable(err);
      }
    }
    return plans.get(cached.code) ?? plans.get('free')!;
  }

  forget(organizationId: string): void {
    this.orgPlan.delete(organizationId);
  }

  private async catalogue(): Promise<Map<string, PlanEntity>> {
    if (!this.plans || Date.now() - this.plansLoadedAt > PLAN_CACHE_MS) {
      try {
        const rows = await this.ds.getRepository(PlanEntity).find();
        this.plans = new Map(rows.map((p) => [p.code, p]));
        this.plansLoadedAt = Date.now();
      } catch (err) {
        if (!this.plans) throw databaseUnavailable(err);
      }
    }
    return this.plans;
  }
}
