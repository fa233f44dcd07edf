// Versions of the demo data: each demo item's version is the SHA-256 of its definition in RFC 8785
// canonical JSON (key order and number spelling do not count), so any change to a definition is a
// new version without anyone bumping a number. demo_seed_rows records, per organisation, which
// row the seeder wrote for each item and from which version; a re-seed rewrites a row only while
// it still holds exactly what the seeder wrote (the studio has not edited it).
import { createHash } from 'node:crypto';
import canonicalize from 'canonicalize';
import type { EntityManager } from 'typeorm';

export type DemoKind = 'setup' | 'frame';

export function demoVersion(definition: unknown): string {
  const text = canonicalize(JSON.parse(JSON.stringify(definition)) as unknown);
  if (text === undefined) throw new Error('a demo definition must be JSON');
  return createHash('sha256').update(text).digest('hex');
}

export interface DemoSeedRow {
  rowId: string;
  version: string;
}

export async function findDemoRow(
  m: EntityManager,
  organizationId: string,
  kind: DemoKind,
  demoKey: string,
): Promise<DemoSeedRow | null> {
  const rows: { row_id: string; version: string }[] = await m.query(
    `SELECT row_id, version FROM demo_seed_rows
      WHERE organization_id = $1 AND kind = $2 AND demo_key = $3`,
    [organizationId, kind, demoKey],
  );
  const r = rows[0];
  return r ? { rowId: r.row_id, version: r.version } : null;
}

/** Records (or moves) the row written for a demo item, and the version it was written from. */
export async function recordDemoRow(
  m: EntityManager,
  organizationId: string,
  kind: DemoKind,
  demoKey: string,
  row: DemoSeedRow,
): Promise<void> {
  await m.query(
    `INSERT INTO demo_seed_rows (organization_id, kind, demo_key, row_id, version)
     VALUES ($1, $2, $3, $4, $5)
     ON CONFLICT (organization_id, kind, demo_key)
       DO UPDATE SET row_id = EXCLUDED.row_id, version = EXCLUDED.version, seeded_at = now()`,
    [organizationId, kind, demoKey, row.rowId, row.version],
  );
}
