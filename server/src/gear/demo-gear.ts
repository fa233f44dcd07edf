// The invented demo studio's gear: generic values, no maker's data. Guide numbers are typical
// of a mains studio head and a hot-shoe flash (common practice, no source); modifier losses are
// the rough figures photographers quote (common practice, no source); the gel kit is the math
// library's generic catalogue.
import { GEL_CATALOGUE } from '@lumenwright/shared';
import type { DataSource } from 'typeorm';
import { DEMO_ORG_ID } from '../auth/accounts.seeder.js';
import type { ModifierEntity } from './entities/modifier.entity.js';

export const DEMO_LIGHTS = [
  {
    name: 'Key strobe A',
    guideNumber: 60,
    guideNumberUnit: 'm' as const,
    notes: 'Battery head; two packs charged the night before.',
  },
  {
    name: 'Rim speedlight',
    guideNumber: 36,
    guideNumberUnit: 'm' as const,
    notes: 'Hot-shoe flash on a small stand behind the couple.',
  },
];

export const DEMO_MODIFIERS: Array<
  Pick<
    ModifierEntity,
    'name' | 'kind' | 'lossStops' | 'beamAngleDeg' | 'size' | 'sizeUnit' | 'notes'
  >
> = [
  {
    name: '90 cm octa',
    kind: 'octabox',
    lossStops: 2,
    beamAngleDeg: null,
    size: 0.9,
    sizeUnit: 'm',
    notes: 'Loss metered at the studio: 2 stops.',
  },
  {
    name: 'Grid 20°',
    kind: 'grid',
    lossStops: 0.7,
    beamAngleDeg: 20,
    size: 0.1,
    sizeUnit: 'm',
    notes: null,
  },
];

export const DEMO_GEL_KIT = {
  name: 'Studio gel kit',
  notes: 'Generic CTO/CTB and green cuts.',
  pieces: GEL_CATALOGUE.map((g) => ({
    name: g.name,
    miredShift: g.miredShift,
    greenShift: g.greenShift,
    lossStops: g.lossStops,
  })),
};

/** The accounts demo studio, when it has been seeded (the gear and setups seeders run after it). */
export async function findDemoOrganizationId(ds: DataSource): Promise<string | null> {
  const rows: { id: string }[] = await ds.query(`SELECT id FROM organizations WHERE id = $1`, [
    DEMO_ORG_ID,
  ]);
  return rows[0]?.id ?? null;
}
