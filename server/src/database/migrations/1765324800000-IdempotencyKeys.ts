import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Idempotency-Key records for the metered POSTs (computations and frame uploads): one row per
 * caller and key, holding the request fingerprint and, once finished, the response to replay.
 * Rows expire after 24 h (swept by the idempotency sweeper).
 */
export class IdempotencyKeys1765324800000 implements MigrationInterface {
  name = 'IdempotencyKeys1765324800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE idempotency_keys (
        caller text NOT NULL,
        key text NOT NULL,
        organization_id uuid NOT NULL,
        fingerprint text NOT NULL,
        state text NOT NULL,
        status integer,
        headers jsonb,
        body bytea,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        CONSTRAINT pk_idempotency_keys PRIMARY KEY (caller, key),
        CONSTRAINT idempotency_keys_state_check CHECK (state IN ('in_flight', 'done')),
        CONSTRAINT fk_idempotency_keys_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX ix_idempotency_keys_expires ON idempotency_keys (expires_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS idempotency_keys`);
  }
}
