// Deletes frame objects that no row refers to. An upload writes its objects first and its row
// last, and undoes the objects when the row fails; only a crash between the two (or a failed undo
// or delete) leaves an object behind. Objects younger than FRAMES_ORPHAN_MIN_AGE_MINUTES are never
// touched, so an upload still in flight keeps its objects. Every instance sweeps on its own timer;
// sweeps are idempotent (deleting a deleted object is a no-op), so no lock is needed.
import {
  Inject,
  Injectable,
  Logger,
  OnApplicationBootstrap,
  OnApplicationShutdown,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { APP_CONFIG, AppConfig } from '../config/config.js';
import { ObjectStore } from './object-store.service.js';

export interface SweepResult {
  /** Objects old enough to be considered. */
  scanned: number;
  /** Objects with no row, deleted. */
  deleted: number;
}

@Injectable()
export class FrameOrphanSweeper implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('FrameOrphanSweeper');
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<SweepResult> | null = null;

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @InjectDataSource() private readonly ds: DataSource,
    private readonly store: ObjectStore,
  ) {}

  onApplicationBootstrap(): void {
    const every = this.config.framesSweepIntervalMinutes;
    if (!every || !this.store.configured) return;
    this.timer = setInterval(() => {
      this.sweep().catch((e: unknown) =>
        this.logger.warn(`frame sweep failed: ${(e as Error).message}`),
      );
    }, every * 60_000);
    this.timer.unref();
  }

  onApplicationShutdown(): void {
    if (this.timer) clearInterval(this.timer);
  }

  /** One pass over `frames/`; concurrent calls share the pass in progress. */
  sweep(minAgeMs = this.config.framesOrphanMinAgeMinutes * 60_000): Promise<SweepResult> {
    this.running ??= this.pass(minAgeMs).finally(() => {
      this.running = null;
    });
    return this.running;
  }

  private async pass(minAgeMs: number): Promise<SweepResult> {
    const result: SweepResult = { scanned: 0, deleted: 0 };
    const before = new Date(Date.now() - minAgeMs);
    for await (const keys of this.store.listOlderThan('frames/', before)) {
      result.scanned += keys.length;
      const rows: { key: string }[] = await this.ds.query(
        `SELECT object_key AS key FROM frames WHERE object_key = ANY($1)
         UNION SELECT thumbnail_key FROM frames WHERE thumbnail_key = ANY($1)`,
        [keys],
      );
      const kept = new Set(rows.map((r) => r.key));
      for (const key of keys) {
        if (kept.has(key)) continue;
        if (await this.store.deleteQuietly(key)) result.deleted++;
      }
    }
    if (result.deleted) {
      this.logger.log(`deleted ${result.deleted} orphaned frame objects of ${result.scanned}`);
    }
    return result;
  }
}
