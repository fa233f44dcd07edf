import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts: users, organisations, memberships, console sessions (connect-pg-simple's layout),
 * e-mailed tokens, invites, API keys, audit events and the sign-in throttle's counters.
 */
export class Accounts1764720000000 implements MigrationInterface {
  name = 'Accounts1764720000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE users (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        email citext NOT NULL,
        name text NOT NULL,
        password_hash text NOT NULL,
        password_changed_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE UNIQUE INDEX uq_users_email ON users (email)`);

    await q.query(`
      CREATE TABLE organizations (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        name text NOT NULL,
        plan_code text NOT NULL DEFAULT 'free',
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);

    await q.query(`
      CREATE TABLE memberships (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        user_id uuid NOT NULL,
        role text NOT NULL CHECK (role IN ('owner', 'admin', 'developer', 'photographer')),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_memberships_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE,
        CONSTRAINT fk_memberships_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE UNIQUE INDEX uq_memberships_org_user ON memberships (organization_id, user_id)`,
    );
    await q.query(`CREATE INDEX ix_memberships_user ON memberships (user_id)`);

    // connect-pg-simple's table layout (sid, sess json, expire timestamp(6)).
    await q.query(`
      CREATE TABLE sessions (
        sid varchar NOT NULL PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX ix_sessions_expire ON sessions (expire)`);
    // "Sign out everywhere" and password resets delete a user's sessions by this expression.
    await q.query(`CREATE INDEX ix_sessions_user ON sessions ((sess->>'userId'))`);

    await q.query(`
      CREATE TABLE user_tokens (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        user_id uuid NOT NULL,
        purpose text NOT NULL CHECK (purpose IN ('password_reset', 'email_change')),
        token_hash text NOT NULL,
        new_email citext,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_user_tokens_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE UNIQUE INDEX uq_user_tokens_token_hash ON user_tokens (token_hash)`);
    await q.query(`CREATE INDEX ix_user_tokens_user ON user_tokens (user_id)`);

    await q.query(`
      CREATE TABLE invites (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        email citext NOT NULL,
        role text NOT NULL CHECK (role IN ('owner', 'admin', 'developer', 'photographer')),
        token_hash text NOT NULL,
        invited_by_user_id uuid,
        expires_at timestamptz NOT NULL,
        last_sent_at timestamptz NOT NULL,
        accepted_at timestamptz,
        canceled_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_invites_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE,
        CONSTRAINT fk_invites_invited_by FOREIGN KEY (invited_by_user_id)
          REFERENCES users (id) ON DELETE SET NULL
      )`);
    await q.query(`CREATE UNIQUE INDEX uq_invites_token_hash ON invites (token_hash)`);
    await q.query(`CREATE INDEX ix_invites_org ON invites (organization_id, created_at)`);

    await q.query(`
      CREATE TABLE api_keys (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid NOT NULL,
        created_by_user_id uuid,
        name text NOT NULL,
        environment text NOT NULL CHECK (environment IN ('test', 'live')),
        public_id text NOT NULL,
        secret_hash text NOT NULL,
        previous_secret_hash text,
        previous_secret_expires_at timestamptz,
        expires_at timestamptz,
        revoked_at timestamptz,
        revoked_by_user_id uuid,
        last_used_at timestamptz,
        rotated_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_api_keys_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE,
        CONSTRAINT fk_api_keys_created_by FOREIGN KEY (created_by_user_id)
          REFERENCES users (id) ON DELETE SET NULL
      )`);
    await q.query(`CREATE UNIQUE INDEX uq_api_keys_public_id ON api_keys (public_id)`);
    await q.query(`CREATE INDEX ix_api_keys_org ON api_keys (organization_id, created_at)`);

    await q.query(`
      CREATE TABLE audit_events (
        id uuid NOT NULL DEFAULT gen_random_uuid() PRIMARY KEY,
        organization_id uuid,
        actor_user_id uuid,
        actor_key_id uuid,
        action text NOT NULL,
        target_type text,
        target_id text,
        ip text,
        user_agent text,
        metadata jsonb NOT NULL DEFAULT '{}'::jsonb,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT fk_audit_events_organization FOREIGN KEY (organization_id)
          REFERENCES organizations (id) ON DELETE CASCADE
      )`);
    await q.query(
      `CREATE INDEX ix_audit_events_org_created ON audit_events (organization_id, created_at, id)`,
    );

    await q.query(`
      CREATE TABLE auth_throttle (
        key text NOT NULL PRIMARY KEY,
        window_started_at timestamptz NOT NULL,
        failures integer NOT NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of [
      'auth_throttle',
      'audit_events',
      'api_keys',
      'invites',
      'user_tokens',
      'sessions',
      'memberships',
      'organizations',
      'users',
    ]) {
      await q.query(`DROP TABLE IF EXISTS ${t}`);
    }
  }
}
