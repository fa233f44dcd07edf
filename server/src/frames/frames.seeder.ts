// Seeds the demo studio's test frames (demo-frames.ts) through FramesService.storeUpload, the upload
// route's own analysis and storage, into the configured object store (the S3 fake under
// `npm start`), as uploaded by the demo photographer from the console. Each is recorded in
// demo_seed_rows with the version of its definition: a re-seed stores nothing again, does not
// bring back a frame the studio deleted, and replaces a demo frame whose definition changed.
// Skipped when the server has no object storage or the studio's plan has no uploads.
import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { AuditEventEntity } from '../audit/audit-event.entity.js';
import { DEMO_MEMBERS } from '../auth/accounts.seeder.js';
import { DomainError } from '../common/errors/domain-error.js';
import type { Principal } from '../common/guards/access.guard.js';
import type { AppConfig } from '../config/config.js';
import { demoVersion, findDemoRow, recordDemoRow } from '../database/seeds/demo-versions.js';
import type { Seeder } from '../database/seeds/index.js';
import { AuditService } from '../audit/audit.service.js';
import { findDemoOrganizationId } from '../gear/demo-gear.js';
import { IdempotencyService } from '../idempotency/idempotency.service.js';
import { PlansService } from '../plans/plans.service.js';
import { DEMO_FRAME_PATCH, DEMO_FRAMES, renderDemoFrame } from './demo-frames.js';
import { FramesService } from './frames.service.js';
import { ObjectStore } from './object-store.service.js';

const photographer = DEMO_MEMBERS.find((m) => m.role === 'photographer')!;

export type FrameSeedOutcome = 'created' | 'replaced' | 'current' | 'left';

/** Seeds the demo frames into `organizationId` as uploaded by `userId`. */
export async function seedDemoFrames(
  ds: DataSource,
  config: AppConfig,
  organizationId: string,
  userId: string | null = photographer.id,
): Promise<Record<string, FrameSeedOutcome> | string> {
  const store = new ObjectStore(config);
  const frames = new FramesService(
    ds,
    config,
    new PlansService(ds),
    store,
    new AuditService(ds.getRepository(AuditEventEntity)),
    new IdempotencyService(ds),
  );
  const p: Principal = {
    kind: 'session',
    userId,
    organizationId,
    role: 'photographer',
    keyId: null,
    keyMode: null,
  };
  try {
    await frames.assertUploadsAllowed(p);
  } catch (e) {
    if (e instanceof DomainError) return `skipped: ${e.message}`;
    throw e;
  }
  try {
    return await ds.transaction(async (m) => {
      await m.query(`SELECT pg_advisory_xact_lock(hashtext('lumenwright:frames-seed'))`);
      const outcomes: Record<string, FrameSeedOutcome> = {};
      for (const demo of DEMO_FRAMES) {
        const version = demoVersion({ ...demo, patch: DEMO_FRAME_PATCH });
        const seeded = await findDemoRow(m, organizationId, 'frame', demo.key);
        const [old] = seeded
          ? ((await m.query(`SELECT id FROM frames WHERE id = $1 AND organization_id = $2`, [
              seeded.rowId,
              organizationId,
            ])) as { id: string }[])
          : [];
        if (seeded && !old) {
          outcomes[demo.key] = 'left'; // the studio deleted it
          continue;
        }
        if (seeded?.version === version) {
          outcomes[demo.key] = 'current';
          continue;
        }
        const buf = await renderDemoFrame(demo);
        const sha256 = createHash('sha256').update(buf).digest('hex');
        // Stored by a run that stopped before recording it: the same bytes are there already.
        const [same] = (await m.query(
          `SELECT id FROM frames WHERE organization_id = $1 AND sha256 = $2 ORDER BY created_at LIMIT 1`,
          [organizationId, sha256],
        )) as { id: string }[];
        const rowId =
          same?.id ??
          (
            await frames.storeUpload(
              {
                buf,
                contentType: 'image/jpeg',
                fileName: demo.fileName,
                sha256,
                patch: { ...DEMO_FRAME_PATCH },
                cameraKelvin: demo.cameraKelvin,
              },
              p,
            )
          ).id;
        await recordDemoRow(m, organizationId, 'frame', demo.key, { rowId, version });
        // A frame cannot be edited: the one from an older definition gives way (audited).
        if (old && old.id !== rowId) await frames.remove(p, old.id);
        outcomes[demo.key] = old ? 'replaced' : 'created';
      }
      return outcomes;
    });
  } finally {
    store.onApplicationShutdown();
  }
}

export const framesSeeder: Seeder = {
  name: 'test frames',
  run: async (ds, config) => {
    const org = await findDemoOrganizationId(ds);
    if (!org || !config) return;
    const out = await seedDemoFrames(ds, config, org);
    if (typeof out === 'string') console.log(`  test frames ${out}`);
  },
};
