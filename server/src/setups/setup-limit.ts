// The plan's `savedSetups` limit, checked under a per-organisation transaction lock so two
// concurrent saves cannot both take the last place.
import type { EntityManager } from 'typeorm';
import { DomainError } from '../common/errors/domain-error.js';

interface PlanLimitRow {
  code: string;
  name: string;
  saved_setups: number | null;
}

/** Call inside a transaction before inserting a setup; throws 403 when the plan is full. */
export async function assertRoomForSetup(em: EntityManager, organizationId: string): Promise<void> {
  await em.query(`SELECT pg_advisory_xact_lock(hashtext('setups:' || $1::text))`, [organizationId]);
  const rows: PlanLimitRow[] = await em.query(
    `SELECT p.code, p.name, p.saved_setups FROM plans p
      WHERE p.code = coalesce((SELECT plan_code FROM organizations WHERE id = $1), 'free')
         OR p.code = 'free'
      ORDER BY (p.code = 'free')
      LIMIT 1`,
    [organizationId],
  );
  const plan = rows[0];
  if (!plan || plan.saved_setups === null) return;
  const counted: { n: number }[] = await em.query(
    `SELECT count(*)::int AS n FROM setups WHERE organization_id = $1`,
    [organizationId],
  );
  const count = counted[0]?.n ?? 0;
  if (count >= plan.saved_setups) {
    throw new DomainError(
      'forbidden',
      `Your plan (${plan.name}) keeps up to ${plan.saved_setups} saved setups and your organisation has ${count}. Delete one, or change plan, to save another.`,
      [],
      {},
      { limit: 'savedSetups', limitValue: plan.saved_setups, count, planCode: plan.code },
    );
  }
}
