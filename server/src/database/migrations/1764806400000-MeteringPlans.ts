import { MigrationInterface, QueryRunner } from 'typeorm';
import { PLAN_CATALOGUE } from '../../plans/plan-catalogue.js';

/**
 * Plans, monthly quota counters, rate-limit buckets (for the PostgreSQL-backed limiter), usage
 * events partitioned by month (with a default partition) and their daily roll-ups.
 */
export class MeteringPlans1764806400000 implements MigrationInterface {
  name = 'MeteringPlans1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE plans (
        code text NOT NULL PRIMARY KEY,
        name text NOT NULL,
        description text NOT NULL,
        monthly_price_cents integer NOT NULL CHECK (monthly_price_cents >= 0),
        included_calls_per_month integer NOT NULL CHECK (included_calls_per_month >= 0),
        test_calls_per_month integer NOT NULL CHECK (test_calls_per_month >= 0),
        rate_per_second integer NOT NULL CHECK (rate_per_second > 0),
        burst integer NOT NULL CHECK (burst > 0),
        overage_price_per_1000_cents integer CHECK (overage_price_per_1000_cents >= 0),
        uploads boolean NOT NULL,
        saved_setups integer,
        seats integer NOT NULL CHECK (seats > 0),
        sort_order integer NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    for (const p of PLAN_CATALOGUE) {
      await q.query(
        `INSERT INTO plans (code, name, description, monthly_price_cents, included_calls_per_month,
           test_calls_per_month, rate_per_second, burst, overage_price_per_1000_cents, uploads,
           saved_setups, seats, sort_order)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13)`,
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
    // The organisations table belongs to the accounts feature; link it when it is there.
    await q.query(`
      DO $$ BEGIN
        IF to_regclass('organizations') IS NOT NULL THEN
          ALTER TABLE organizations ADD CONSTRAINT fk_organizations_plan
            FOREIGN KEY (plan_code) REFERENCES plans (code) ON UPDATE CASCADE;
        END IF;
      END $$`);

    await q.query(`
      CREATE TABLE quota_counters (
        organization_id uuid NOT NULL,
        period_start date NOT NULL,
        mode text NOT NULL CHECK (mode IN ('live', 'test')),
        reserved bigint NOT NULL DEFAULT 0,
        last_grant integer NOT NULL DEFAULT 0,
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT pk_quota_counters PRIMARY KEY (organization_id, period_start, mode)
      )`);

    // Shared token buckets when several instances run (RATE_LIMIT_STORE=postgres); losing them
    // in a crash only refills the buckets, so the table is unlogged.
    await q.query(`
      CREATE UNLOGGED TABLE rate_limit_buckets (
        key text NOT NULL PRIMARY KEY,
        tokens double precision NOT NULL,
        updated_ms bigint NOT NULL
      )`);

    await q.query(`
      CREATE TABLE usage_events (
        id uuid NOT NULL DEFAULT gen_random_uuid(),
        occurred_at timestamptz NOT NULL,
        organization_id uuid NOT NULL,
        key_id uuid,
        user_id uuid,
        source text NOT NULL CHECK (source IN ('live', 'test', 'console')),
        endpoint text NOT NULL,
        status smallint NOT NULL,
        latency_ms real NOT NULL,
        billable_units integer NOT NULL DEFAULT 0,
        request_id text NOT NULL,
        CONSTRAINT pk_usage_events PRIMARY KEY (id, occurred_at)
      ) PARTITION BY RANGE (occurred_at)`);
    await q.query(`CREATE TABLE usage_events_default PARTITION OF usage_events DEFAULT`);
    await q.query(
      `CREATE INDEX ix_usage_events_org_time ON usage_events (organization_id, occurred_at DESC, id DESC)`,
    );
    await q.query(
      `CREATE INDEX ix_usage_events_key_time ON usage_events (key_id, occurred_at DESC) WHERE key_id IS NOT NULL`,
    );

    await q.query(`
      CREATE TABLE usage_daily (
        organization_id uuid NOT NULL,
        day date NOT NULL,
        key_id uuid,
        source text NOT NULL,
        endpoint text NOT NULL,
        status smallint NOT NULL,
        calls bigint NOT NULL DEFAULT 0,
        billable_units bigint NOT NULL DEFAULT 0,
        latency_ms_sum double precision NOT NULL DEFAULT 0,
        CONSTRAINT uq_usage_daily UNIQUE NULLS NOT DISTINCT
          (organization_id, day, key_id, source, endpoint, status)
      )`);
    await q.query(`CREATE INDEX ix_usage_daily_org_day ON usage_daily (organization_id, day)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS usage_daily`);
    await q.query(`DROP TABLE IF EXISTS usage_events`);
    await q.query(`DROP TABLE IF EXISTS rate_limit_buckets`);
    await q.query(`DROP TABLE IF EXISTS quota_counters`);
    await q.query(
      `ALTER TABLE IF EXISTS organizations DROP CONSTRAINT IF EXISTS fk_organizations_plan`,
    );
    await q.query(`DROP TABLE IF EXISTS plans`);
  }
}
