// Gear test helpers: members of a role in an organisation, and gear created through the API.
import type { DataSource } from 'typeorm';
import type { Role } from '../../src/common/decorators/access.decorator.js';
import { signUp, type SignedInAgent } from './accounts.js';

/**
 * A signed-in member of `owner`'s organisation with `role`. The membership row is written
 * directly (the invite flow has its own tests); the session then switches to that organisation
 * through the API, as a real member would.
 */
export async function memberOf(
  url: string,
  ds: DataSource,
  owner: SignedInAgent,
  role: Role,
): Promise<SignedInAgent> {
  const m = await signUp(url);
  await ds.query(`INSERT INTO memberships (organization_id, user_id, role) VALUES ($1, $2, $3)`, [
    owner.organizationId,
    m.userId,
    role,
  ]);
  const res = await m.agent
    .post('/v1/me/organization')
    .send({ organizationId: owner.organizationId });
  if (res.status !== 200)
    throw new Error(`switch failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { ...m, organizationId: owner.organizationId, role };
}

async function created(res: { status: number; body: unknown }, what: string) {
  if (res.status !== 201)
    throw new Error(`${what} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as Record<string, unknown> & { id: string };
}

export const createLight = async (a: SignedInAgent, body: Record<string, unknown> = {}) =>
  created(
    await a.agent
      .post('/v1/gear/lights')
      .send({ name: `Light ${Math.random().toString(36).slice(2, 8)}`, guideNumber: 60, ...body }),
    'create light',
  );

export const createModifier = async (a: SignedInAgent, body: Record<string, unknown> = {}) =>
  created(
    await a.agent
      .post('/v1/gear/modifiers')
      .send({ name: `Mod ${Math.random().toString(36).slice(2, 8)}`, lossStops: 1, ...body }),
    'create modifier',
  );

export const createGelKit = async (a: SignedInAgent, body: Record<string, unknown> = {}) =>
  created(
    await a.agent
      .post('/v1/gear/gel-kits')
      .send({ name: `Kit ${Math.random().toString(36).slice(2, 8)}`, ...body }),
    'create gel kit',
  );

/** A small invented kit: two warming cuts, one cooling cut, one green cut. */
export const SMALL_KIT_PIECES = [
  { name: 'warm half', miredShift: 90, lossStops: 0.4 },
  { name: 'warm quarter', miredShift: 50, lossStops: 0.25 },
  { name: 'cool quarter', miredShift: -30, lossStops: 0.4 },
  { name: 'green quarter', greenShift: 7.5, lossStops: 0.15 },
];
