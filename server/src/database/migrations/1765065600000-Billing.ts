import { MigrationInterface, QueryRunner } from 'typeorm';

/** Billing: payments-service customers, checkouts, subscriptions, invoices, processed events. */
export class Billing1765065600000 implements MigrationInterface {
  name = 'Billing1765065600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE billing_accounts (
        organization_id uuid NOT NULL PRIMARY KEY,
        customer_id text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_billing_accounts_customer ON billing_accounts (customer_id)`,
    );
    await q.query(`
      CREATE TABLE billing_checkouts (
        id text NOT NULL PRIMARY KEY,
        organization_id uuid NOT NULL,
        plan_code text NOT NULL,
        status text NOT NULL,
        url text NOT NULL,
        created_by_user_id uuid,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE INDEX ix_billing_checkouts_org ON billing_checkouts (organization_id, created_at)`,
    );
    await q.query(`
      CREATE TABLE billing_subscriptions (
        id text NOT NULL PRIMARY KEY,
        organization_id uuid NOT NULL,
        customer_id text NOT NULL,
        plan_code text NOT NULL,
        status text NOT NULL,
        started_at timestamptz NOT NULL,
        current_period_start timestamptz,
        current_period_end timestamptz,
        state_as_of timestamptz NOT NULL,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE INDEX ix_billing_subscriptions_org ON billing_subscriptions (organization_id, started_at)`,
    );
    await q.query(`
      CREATE TABLE billing_invoices (
        id text NOT NULL PRIMARY KEY,
        organization_id uuid NOT NULL,
        subscription_id text,
        status text NOT NULL,
        billing_reason text NOT NULL,
        currency text NOT NULL,
        total_cents integer NOT NULL,
        amount_paid_cents integer NOT NULL,
        period_start timestamptz,
        period_end timestamptz,
        lines jsonb NOT NULL,
        issued_at timestamptz NOT NULL,
        state_as_of timestamptz NOT NULL,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE INDEX ix_billing_invoices_org ON billing_invoices (organization_id, issued_at)`,
    );
    await q.query(`
      CREATE TABLE billing_events (
        id text NOT NULL PRIMARY KEY,
        type text NOT NULL,
        event_created_at timestamptz NOT NULL,
        outcome text NOT NULL,
        received_at timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of [
      'billing_events',
      'billing_invoices',
      'billing_subscriptions',
      'billing_checkouts',
      'billing_accounts',
    ]) {
      await q.query(`DROP TABLE IF EXISTS ${t}`);
    }
  }
}
