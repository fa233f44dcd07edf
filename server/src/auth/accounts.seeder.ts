// Demo scenario: an invented dusk-portrait studio with one member per role, a few keys and some
// history. Idempotent (fixed ids, ON CONFLICT DO NOTHING); prints nothing secret. Four members need
// more than the free plan's seats, so the studio is on the Studio plan.
import type { DataSource, EntityManager } from 'typeorm';
import { newPublicId, newSecret } from '../api-keys/key-format.js';
import type { Seeder } from '../database/seeds/index.js';
import { hashPassword } from './passwords.js';
import { sha256Hex } from './tokens.js';

export const DEMO_ORG_ID = '5eed0000-0000-4000-8000-000000000001';
export const DEMO_PASSWORD = 'kestrel-dusk-demo';
/** The demo studio's plan: its seats hold the four members. */
export const DEMO_PLAN = 'studio';

export const DEMO_MEMBERS = [
  {
    id: '5eed0000-0000-4000-8000-0000000000a1',
    email: 'ilse@kestrelmoor.test',
    name: 'Ilse Marrowind',
    role: 'owner',
  },
  {
    id: '5eed0000-0000-4000-8000-0000000000a2',
    email: 'corvin@kestrelmoor.test',
    name: 'Corvin Daleholt',
    role: 'admin',
  },
  {
    id: '5eed0000-0000-4000-8000-0000000000a3',
    email: 'sabe@kestrelmoor.test',
    name: 'Sabe Thornquist',
    role: 'developer',
  },
  {
    id: '5eed0000-0000-4000-8000-0000000000a4',
    email: 'noor@kestrelmoor.test',
    name: 'Noor Wickenden',
    role: 'photographer',
  },
] as const;

/** The demo keys' fixed ids (their invented call history is seeded by usage.seeder.ts). */
export const DEMO_KEY_IDS = {
  bookingSite: '5eed0000-0000-4000-8000-0000000000b1',
  shotListStaging: '5eed0000-0000-4000-8000-0000000000b2',
  oldPrototype: '5eed0000-0000-4000-8000-0000000000b3',
} as const;

const KEYS = [
  {
    id: DEMO_KEY_IDS.bookingSite,
    name: 'Booking site (production)',
    environment: 'live',
    by: 2,
    revoked: false,
  },
  {
    id: DEMO_KEY_IDS.shotListStaging,
    name: 'Shot-list app (staging)',
    environment: 'test',
    by: 2,
    revoked: false,
  },
  {
    id: DEMO_KEY_IDS.oldPrototype,
    name: 'Old prototype',
    environment: 'test',
    by: 1,
    revoked: true,
  },
] as const;

/** One transaction under an advisory lock: concurrent runs serialise and see all or nothing. */
async function run(ds: DataSource): Promise<void> {
  await ds.transaction(async (m) => {
    await m.query(`SELECT pg_advisory_xact_lock(hashtext('lumenwright:accounts-seed'))`);
    await seed(m);
  });
}

async function seed(ds: EntityManager): Promise<void> {
  const created: unknown[] = await ds.query(
    `INSERT INTO organizations (id, name, plan_code)
     VALUES ($1, 'Kestrelmoor Evening Portraits', $2)
     ON CONFLICT (id) DO NOTHING RETURNING id`,
    [DEMO_ORG_ID, DEMO_PLAN],
  );
  // A demo seeded before seats were enforced sits on the free plan: move it up, unless its plan
  // came from billing (a subscription, even a cancelled one, is the owner's own choice).
  await ds.query(
    `UPDATE organizations o SET plan_code = $2, updated_at = now()
      WHERE o.id = $1 AND o.plan_code = 'free'
        AND NOT EXISTS (SELECT 1 FROM billing_subscriptions s WHERE s.organization_id = o.id)`,
    [DEMO_ORG_ID, DEMO_PLAN],
  );
  const existing = new Set(
    (
      (await ds.query(`SELECT id FROM users WHERE id = ANY($1)`, [
        DEMO_MEMBERS.map((m) => m.id),
      ])) as { id: string }[]
    ).map((r) => r.id),
  );
  for (const m of DEMO_MEMBERS) {
    if (!existing.has(m.id)) {
      await ds.query(
        `INSERT INTO users (id, email, name, password_hash) VALUES ($1, $2, $3, $4) ON CONFLICT DO NOTHING`,
        [m.id, m.email, m.name, await hashPassword(DEMO_PASSWORD)],
      );
    }
    await ds.query(
      `INSERT INTO memberships (organization_id, user_id, role) VALUES ($1, $2, $3)
       ON CONFLICT (organization_id, user_id) DO NOTHING`,
      [DEMO_ORG_ID, m.id, m.role],
    );
  }
  for (const k of KEYS) {
    // Random secrets nobody knows: demo keys exist to be listed, revoked and rotated.
    await ds.query(
      `INSERT INTO api_keys (id, organization_id, created_by_user_id, name, environment, public_id, secret_hash, revoked_at, revoked_by_user_id, created_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, now() - interval '20 days')
       ON CONFLICT (id) DO NOTHING`,
      [
        k.id,
        DEMO_ORG_ID,
        DEMO_MEMBERS[k.by].id,
        k.name,
        k.environment,
        newPublicId(),
        sha256Hex(newSecret()),
        k.revoked ? new Date(Date.now() - 5 * 86400000) : null,
        k.revoked ? DEMO_MEMBERS[1].id : null,
      ],
    );
  }
  if (!created.length) return; // history only on the first run
  const [owner, admin, dev, photo] = DEMO_MEMBERS.map((m) => m.id);
  const history: [string, string | undefined, string, string | null, string | null, number][] = [
    ['auth.sign_up', owner, 'user', owner!, null, 30],
    [
      'invite.created',
      owner,
      'invite',
      null,
      '{"email":"corvin@kestrelmoor.test","role":"admin"}',
      29,
    ],
    ['member.joined', admin, 'user', admin!, '{"role":"admin"}', 29],
    [
      'invite.created',
      admin,
      'invite',
      null,
      '{"email":"sabe@kestrelmoor.test","role":"developer"}',
      25,
    ],
    ['member.joined', dev, 'user', dev!, '{"role":"developer"}', 24],
    [
      'key.created',
      dev,
      'api_key',
      KEYS[0].id,
      '{"name":"Booking site (production)","environment":"live"}',
      20,
    ],
    [
      'key.created',
      dev,
      'api_key',
      KEYS[1].id,
      '{"name":"Shot-list app (staging)","environment":"test"}',
      20,
    ],
    [
      'invite.created',
      admin,
      'invite',
      null,
      '{"email":"noor@kestrelmoor.test","role":"photographer"}',
      12,
    ],
    ['member.joined', photo, 'user', photo!, '{"role":"photographer"}', 11],
    ['auth.sign_in_failed', photo, 'user', photo!, null, 6],
    ['key.revoked', admin, 'api_key', KEYS[2].id, '{"name":"Old prototype"}', 5],
    ['auth.sign_in', owner, 'user', owner!, null, 1],
  ];
  for (const [action, actor, targetType, targetId, metadata, daysAgo] of history) {
    await ds.query(
      `INSERT INTO audit_events (organization_id, actor_user_id, action, target_type, target_id, ip, user_agent, metadata, created_at)
       VALUES ($1, $2, $3, $4, $5, '192.0.2.10', 'demo seed', $6::jsonb, now() - make_interval(days => $7))`,
      [DEMO_ORG_ID, actor ?? null, action, targetType, targetId, metadata ?? '{}', daysAgo],
    );
  }
}

export const accountsSeeder: Seeder = {
  name: 'accounts: Kestrelmoor Evening Portraits (demo studio)',
  run,
};
